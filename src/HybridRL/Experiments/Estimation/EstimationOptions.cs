namespace HybridRL.Experiments.Estimation;

/// <summary>Settings of the calibration behind <see cref="CostEstimator"/>.</summary>
public sealed record EstimationOptions
{
    /// <summary>Wall-clock seconds of real training per calibrated configuration (runs differing only by seed share one).</summary>
    public double CalibrationSeconds { get; init; } = 5;

    /// <summary>Safety factor on the predicted wall time for the Slurm <c>--time</c> suggestion (1.5 is common practice).</summary>
    public double TimeFactor { get; init; } = 1.5;

    /// <summary>Minutes added after the factor, for start-up, final evaluation and file writing (common practice).</summary>
    public double TimeMarginMinutes { get; init; } = 5;

    /// <summary>Folder for the calibration's scratch checkpoint; null = a fresh folder under the system temp folder (deleted afterwards).</summary>
    public string? ScratchDir { get; init; }

    public void Validate()
    {
        if (!(CalibrationSeconds > 0) || double.IsInfinity(CalibrationSeconds))
            throw new ArgumentException($"calibration seconds must be a positive number, got {CalibrationSeconds}");
        if (!(TimeFactor >= 1) || double.IsInfinity(TimeFactor)) throw new ArgumentException($"time factor must be ≥ 1, got {TimeFactor}");
        if (!(TimeMarginMinutes >= 0) || double.IsInfinity(TimeMarginMinutes)) throw new ArgumentException($"time margin must be ≥ 0 minutes, got {TimeMarginMinutes}");
    }
}
