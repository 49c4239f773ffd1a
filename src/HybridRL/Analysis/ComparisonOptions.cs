namespace HybridRL.Analysis;

/// <summary>Options of the compare pipeline (the CLI's <c>compare</c> command maps onto these).</summary>
public sealed record ComparisonOptions
{
    /// <summary>Run folders or sweep folders (folders containing run folders).</summary>
    public required IReadOnlyList<string> Inputs { get; init; }

    /// <summary>Dotted config.yaml key whose value names a run's group (default: trainer kind).</summary>
    public string By { get; init; } = "trainer.kind";

    public CurveAxis Axis { get; init; } = CurveAxis.EnvSteps;

    /// <summary>Return threshold for "steps to reach"; null = not computed.</summary>
    public double? Threshold { get; init; }

    /// <summary>Folder for comparison.md/.csv and plots; null = compute only.</summary>
    public string? OutDir { get; init; }

    /// <summary>"auto" (eval_return if every run has it, else train_return, else fitness_mean) or a metrics column.</summary>
    public string Metric { get; init; } = "auto";

    /// <summary>Optional dotted config key whose values are bootstrap strata inside a group (e.g. the environment).</summary>
    public string? StratifyBy { get; init; }

    public int GridPoints { get; init; } = 100;
    public int Resamples { get; init; } = 2000;
    public double Confidence { get; init; } = 0.95;
    public ulong Seed { get; init; } = 0;
    public Statistics.BootstrapMethod Method { get; init; } = Statistics.BootstrapMethod.ExpandedPercentile;

    /// <summary>Optional hardware profile YAML for the device-time and cost estimate.</summary>
    public string? HardwareProfilePath { get; init; }

    /// <summary>Shots per expectation for hardware accounting; null = take it from each run's summary ledger.</summary>
    public double? ShotsPerExecution { get; init; }

    public bool WritePlots { get; init; } = true;

    /// <summary>Groups with fewer runs than this get a warning (Henderson et al. 2018 argue for more seeds).</summary>
    public int MinimumSeeds { get; init; } = 5;
}
