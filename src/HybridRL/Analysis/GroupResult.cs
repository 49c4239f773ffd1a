using HybridRL.Analysis.Ledger;
using HybridRL.Analysis.Statistics;

namespace HybridRL.Analysis;

/// <summary>Everything the comparison reports about one group of runs.</summary>
public sealed record GroupResult(
    string Label,
    IReadOnlyList<RunFolder> Runs,
    IReadOnlyList<LearningCurve> Curves,
    GroupCurveStatistics Curve,
    double[] FinalReturns,
    ConfidenceInterval FinalMean,
    ConfidenceInterval FinalIqm,
    double[] BestReturns,
    ConfidenceInterval BestMean,
    double[] Areas,
    ConfidenceInterval AreaMean,
    double[] ThresholdX,
    double NeverReachedShare,
    double MedianToThreshold,
    double[] ParameterCounts,
    HardwareEstimate? Hardware)
{
    public int RunCount => Runs.Count;
}
