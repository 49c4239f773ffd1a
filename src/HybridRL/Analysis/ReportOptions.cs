namespace HybridRL.Analysis;

/// <summary>Options of <see cref="Report.Write(string, ReportOptions?)"/>.</summary>
public sealed record ReportOptions
{
    public CurveAxis Axis { get; init; } = CurveAxis.EnvSteps;

    /// <summary>Folder for report.md and plots; null = the run or sweep folder itself.</summary>
    public string? OutDir { get; init; }

    /// <summary>Optional hardware profile YAML for device-time and cost estimates.</summary>
    public string? HardwareProfilePath { get; init; }

    /// <summary>Shots per expectation for the hardware estimate; null = each run's summary ledger value.</summary>
    public double? ShotsPerExecution { get; init; }

    /// <summary>For sweeps: config key the comparison groups by, threshold, resamples, seed.</summary>
    public string By { get; init; } = "trainer.kind";
    public double? Threshold { get; init; }
    public int Resamples { get; init; } = 2000;
    public ulong Seed { get; init; } = 0;
}
