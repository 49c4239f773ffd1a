namespace HybridRL.Experiments.Config;

/// <summary><c>trainer.evolution_strategies</c>: antithetic-sampling evolution strategies (Salimans et al. 2017).</summary>
public sealed record EvolutionStrategiesSettings
{
    /// <summary>Even: members come in antithetic (+ε, −ε) pairs.</summary>
    public required int Population { get; init; }
    public required double Sigma { get; init; }
    public required double LearningRate { get; init; }
    public required double WeightDecay { get; init; }
    public required int EpisodesPerMember { get; init; }
    public required int EvalEvery { get; init; }
    public required int EvalEpisodes { get; init; }
}
