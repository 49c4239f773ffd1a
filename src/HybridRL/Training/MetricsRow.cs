namespace HybridRL.Training;

/// <summary>
/// One metrics.csv row (one logging interval). Columns follow the shared header; a null value is written
/// as an empty field (not applicable to this trainer or not measured in this interval).
/// </summary>
public sealed record MetricsRow
{
    public long? EnvSteps { get; init; }
    public long? Episodes { get; init; }
    public long? Updates { get; init; }
    public long? Generations { get; init; }
    public double? WallSeconds { get; init; }
    public double? TrainReturn { get; init; }
    public double? EvalReturn { get; init; }
    public double? Loss { get; init; }
    public double? FitnessMean { get; init; }
    public double? FitnessBest { get; init; }
    public double? FitnessStd { get; init; }
    public double? Epsilon { get; init; }
    public double? Sigma { get; init; }
    public long? CircuitExecutions { get; init; }
    public long? Shots { get; init; }
    public long? HardwareExecutions { get; init; }
    public long? ParameterCount { get; init; }

    /// <summary>A row holding the shared counters; trainers fill in their own cells.</summary>
    public static MetricsRow FromCounters(TrainingCounters c, long parameterCount) => new()
    {
        EnvSteps = c.EnvSteps,
        Episodes = c.Episodes,
        Updates = c.Updates,
        Generations = c.Generations,
        WallSeconds = c.WallSeconds,
        CircuitExecutions = c.CircuitExecutions,
        Shots = c.Shots,
        HardwareExecutions = c.HardwareExecutions,
        ParameterCount = parameterCount,
    };
}
