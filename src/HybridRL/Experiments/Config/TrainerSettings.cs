namespace HybridRL.Experiments.Config;

/// <summary>The <c>trainer</c> section; exactly the settings object of <see cref="Kind"/> is non-null.</summary>
public sealed record TrainerSettings
{
    public required TrainerKind Kind { get; init; }
    public required DqnSettings? Dqn { get; init; }
    public required GeneticSettings? Genetic { get; init; }
    public required EvolutionStrategiesSettings? EvolutionStrategies { get; init; }
    public required CmaEsSettings? CmaEs { get; init; }
}
