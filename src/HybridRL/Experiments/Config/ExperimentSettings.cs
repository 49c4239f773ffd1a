namespace HybridRL.Experiments.Config;

/// <summary>The <c>experiment</c> section.</summary>
public sealed record ExperimentSettings
{
    public required string Name { get; init; }
    public required string Description { get; init; }
    /// <summary>Root seed; every random stream is derived from it.</summary>
    public required ulong Seed { get; init; }
    public required BudgetSettings Budget { get; init; }
}
