namespace HybridRL.Experiments.Config;

/// <summary><c>trainer.genetic</c>: truncation-selection genetic algorithm with Gaussian mutation.</summary>
public sealed record GeneticSettings
{
    public required int Population { get; init; }
    /// <summary>Fraction of the population (best first) that may become parents.</summary>
    public required double Truncation { get; init; }
    public required double MutationSigma { get; init; }
    public required int Elites { get; init; }
    public required bool Crossover { get; init; }
    public required int EpisodesPerMember { get; init; }
    /// <summary>Extra episodes for each carried-over elite, folded into its mean fitness (0 = none).</summary>
    public int EliteEpisodes { get; init; }
    /// <summary>Generations between evaluations of the best member; 0 = none.</summary>
    public required int EvalEvery { get; init; }
    public required int EvalEpisodes { get; init; }
}
