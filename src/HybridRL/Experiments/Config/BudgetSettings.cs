namespace HybridRL.Experiments.Config;

/// <summary>Run budget: the run stops when the first non-zero limit is reached (0 = unlimited; at least one is set).</summary>
public sealed record BudgetSettings
{
    public required long EnvSteps { get; init; }
    public required long Episodes { get; init; }
    public required long Generations { get; init; }
    public required long CircuitExecutions { get; init; }
    public required double WallSeconds { get; init; }
}
