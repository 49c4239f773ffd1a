using HybridRL.Analysis.Ledger;

namespace HybridRL.Analysis;

/// <summary>Result of <see cref="Comparison.Run"/>: per-group and pairwise statistics, warnings, written files.</summary>
public sealed record ComparisonResult(
    ComparisonOptions Options,
    string MetricColumn,
    double[] Grid,
    IReadOnlyList<GroupResult> Groups,
    IReadOnlyList<PairResult> Pairs,
    (double From, double To) AreaWindow,
    HardwareProfile? Profile,
    HardwareEstimate? HardwareTotal,
    IReadOnlyList<string> Warnings)
{
    /// <summary>Files written (comparison.md, comparison.csv, ... and plots), empty when no output folder was given.</summary>
    public List<string> Files { get; } = [];

    /// <summary>Plain-text table for the terminal.</summary>
    public string TerminalTable => ComparisonWriter.FormatTable(this);
}
