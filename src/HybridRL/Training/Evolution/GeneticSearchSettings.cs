using System.Globalization;

namespace HybridRL.Training.Evolution;

/// <summary>
/// Settings of <see cref="GeneticSearch"/> (Such et al. 2017, "Deep Neuroevolution").
/// Keys: <c>population</c>, <c>truncation</c>, <c>mutation_sigma</c>, <c>elites</c>, <c>crossover</c>, <c>elite_episodes</c>.
/// Defaults are our own choice for circuits with tens to thousands of angles (Such et al. used far larger
/// populations for deep networks); tune per task.
/// </summary>
/// <param name="Population">λ, members per generation (≥ 2).</param>
/// <param name="Truncation">T, how many of the best members become parents (1 … λ).</param>
/// <param name="MutationSigma">σ of the Gaussian mutation added to every parameter of a child (&gt; 0).</param>
/// <param name="Elites">How many of the best members are carried over unmutated and re-evaluated (0 … λ−1).</param>
/// <param name="Crossover">Probability that a child is a uniform crossover of two distinct parents before mutation (0 … 1).</param>
/// <param name="EliteEpisodes">Extra evaluation episodes the caller should run for each carried-over elite (≥ 0).</param>
public sealed record GeneticSearchSettings(
    int Population = 64,
    int Truncation = 10,
    double MutationSigma = 0.05,
    int Elites = 1,
    double Crossover = 0.0,
    int EliteEpisodes = 0) : EvolutionSettings
{
    private const string Method = "genetic search";

    public override EvolutionKind Kind => EvolutionKind.Genetic;

    public override void Validate()
    {
        if (Population < 2) throw Bad(Method, "population", "must be at least 2", Population);
        if (Truncation < 1 || Truncation > Population)
            throw Bad(Method, "truncation", $"must be between 1 and population ({Population})", Truncation);
        if (!IsPositiveFinite(MutationSigma))
            throw Bad(Method, "mutation_sigma", "must be a positive finite number", MutationSigma.ToString("R", CultureInfo.InvariantCulture));
        if (Elites < 0 || Elites > Population - 1)
            throw Bad(Method, "elites", $"must be between 0 and population - 1 ({Population - 1})", Elites);
        if (!(Crossover >= 0 && Crossover <= 1))
            throw Bad(Method, "crossover", "must be a probability between 0 and 1", Crossover.ToString("R", CultureInfo.InvariantCulture));
        if (EliteEpisodes < 0) throw Bad(Method, "elite_episodes", "must be 0 or more", EliteEpisodes);
    }

    internal override void Write(BinaryWriter writer)
    {
        writer.Write(Population);
        writer.Write(Truncation);
        writer.Write(MutationSigma);
        writer.Write(Elites);
        writer.Write(Crossover);
        writer.Write(EliteEpisodes);
    }

    internal static GeneticSearchSettings Read(BinaryReader reader) => new(
        reader.ReadInt32(), reader.ReadInt32(), reader.ReadDouble(), reader.ReadInt32(), reader.ReadDouble(), reader.ReadInt32());
}
