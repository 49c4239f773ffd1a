namespace HybridRL.Training.Evolution;

/// <summary>
/// An ask/tell optimiser over a flat vector of doubles that MAXIMISES fitness.
/// <para>
/// Protocol: <see cref="Ask"/> fills a λ × n row-major buffer with the members of the current
/// generation (member k occupies <c>population[k*n .. k*n+n)</c>); the caller evaluates them (in
/// parallel if it wishes, each into its own slot) and passes the fitness of member k in slot k to
/// <see cref="Tell"/>. Asking again before telling returns the same pending generation without
/// drawing new random numbers. All arithmetic is sequential and deterministic; the random draws
/// come from one <c>RandomStream</c> whose state is part of <see cref="Save"/>.
/// </para>
/// <para>A NaN fitness ranks below every number (the member is treated as the worst).</para>
/// </summary>
public interface IEvolutionStrategy
{
    EvolutionKind Kind { get; }

    /// <summary>n, the length of a parameter vector.</summary>
    int Dimension { get; }

    /// <summary>λ, the number of members per generation.</summary>
    int PopulationSize { get; }

    /// <summary>Number of completed <see cref="Tell"/> calls.</summary>
    int Generation { get; }

    /// <summary>Current step size σ (mutation σ for genetic search, noise σ for ES, adapted σ for CMA-ES).</summary>
    double StepSize { get; }

    /// <summary>The parameters to evaluate greedily: the distribution mean (ES, CMA-ES) or the current elite (genetic search).</summary>
    ReadOnlySpan<double> Center { get; }

    /// <summary>The best member evaluated so far (by the fitness it was told with). Before any tell: the initial parameters.</summary>
    ReadOnlySpan<double> Best { get; }

    /// <summary>Fitness of <see cref="Best"/>; negative infinity before any finite fitness was told.</summary>
    double BestFitness { get; }

    /// <summary>
    /// Per slot of the pending generation: how many EXTRA evaluation episodes the caller should run for
    /// that member (and fold into its mean fitness). Non-zero only for the carried-over elites of genetic
    /// search when <c>elite_episodes</c> &gt; 0; always zero for the other methods.
    /// </summary>
    ReadOnlySpan<int> ExtraEpisodes { get; }

    /// <summary>Writes the pending generation (λ × n, row-major); samples it first if none is pending.</summary>
    void Ask(Span<double> population);

    /// <summary>Reports the fitness (to be maximised) of each member of the pending generation and updates the search.</summary>
    void Tell(ReadOnlySpan<double> fitness);

    /// <summary>Writes the complete state (including any pending generation and the random stream) for a bit-identical resume.</summary>
    void Save(BinaryWriter writer);

    /// <summary>Restores a state written by <see cref="Save"/> into an instance built with the same kind, settings and dimension.</summary>
    void Load(BinaryReader reader);
}
