namespace HybridRL.Experiments.Runs;

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
}
