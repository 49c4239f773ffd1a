namespace HybridRL.Experiments.Estimation;

/// <summary>
/// Predicted cost of one training run on this node, extrapolated from a short calibration of the real training
/// (see <see cref="CostEstimator"/> and <see cref="Method"/> for how). Byte counts are bytes; times are seconds.
/// </summary>
public sealed record RunCostEstimate
{
    /// <summary>What was estimated: the experiment file, or the sweep run id.</summary>
    public required string Label { get; init; }
    public required string TrainerKind { get; init; }

    /// <summary>The budget as written in the config, e.g. "env_steps 3000".</summary>
    public required string Budget { get; init; }

    /// <summary>Which budget limit is predicted to end the run.</summary>
    public required string LimitedBy { get; init; }

    public required IReadOnlyList<CalibrationPhase> Phases { get; init; }

    /// <summary>Wall time the calibration trained for.</summary>
    public required double CalibrationSeconds { get; init; }

    /// <summary>True when the calibration reached the whole budget (the prediction is then the measured time).</summary>
    public required bool CoveredWholeBudget { get; init; }

    /// <summary>True when the calibration never reached the phase that dominates the run (deep Q learning after warm-up): the prediction is a lower bound.</summary>
    public required bool LowerBound { get; init; }

    public required double PredictedEnvSteps { get; init; }
    public required double PredictedUnits { get; init; }
    public required double PredictedCircuitExecutions { get; init; }
    public required double PredictedHardwareExecutions { get; init; }

    /// <summary>Predicted time in training units (including the calibrated start).</summary>
    public required double PredictedTrainingSeconds { get; init; }

    public required long Checkpoints { get; init; }
    public required double CheckpointWriteSeconds { get; init; }

    /// <summary>Training plus checkpoint writing.</summary>
    public double PredictedWallSeconds => PredictedTrainingSeconds + Checkpoints * CheckpointWriteSeconds;

    public required long MeasuredPeakMemoryBytes { get; init; }
    public required long PredictedPeakMemoryBytes { get; init; }
    public required long MeasuredCheckpointBytes { get; init; }
    public required long PredictedCheckpointBytes { get; init; }

    /// <summary>Checkpoints kept on disk at once (logging.keep_checkpoints).</summary>
    public required int KeptCheckpoints { get; init; }
    public long PredictedCheckpointDiskBytes => PredictedCheckpointBytes * KeptCheckpoints;

    /// <summary>Slurm <c>--time</c> suggestion for this run (see <see cref="SlurmTime"/>).</summary>
    public required string SuggestedTime { get; init; }

    /// <summary>How the prediction was made, in words, for the output.</summary>
    public required string Method { get; init; }
}
