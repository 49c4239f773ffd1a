using HybridRL.Quantum.Randomness;

namespace HybridRL.Training.Evolution;

/// <summary>
/// Shared machinery of the ask/tell optimisers: the pending generation, best-so-far tracking, ranking
/// buffers, argument checks and the common part of the checkpoint. All buffers are allocated once.
/// </summary>
public abstract class EvolutionStrategyBase : IEvolutionStrategy
{
    private const string Magic = "HybridRL.Evolution";
    private const int FormatVersion = 1;

    private readonly double[] _best;
    private readonly int[] _extraEpisodes;
    private readonly int[] _order;
    private readonly int[] _orderScratch;
    private double _bestFitness = double.NegativeInfinity;
    private bool _pending;

    /// <summary>The stream all random draws of this optimiser come from.</summary>
    protected RandomStream Random { get; }

    /// <summary>The pending (or last told) generation, λ × n row-major.</summary>
    protected double[] Members { get; }

    protected EvolutionStrategyBase(EvolutionSettings settings, double[] initialParameters, int populationSize, ulong seed)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(initialParameters);
        settings.Validate();
        if (initialParameters.Length == 0)
            throw new ArgumentException("initial parameter vector must not be empty", nameof(initialParameters));
        for (int i = 0; i < initialParameters.Length; i++)
            if (!double.IsFinite(initialParameters[i]))
                throw new ArgumentException($"initial parameter {i} is not finite ({initialParameters[i]})", nameof(initialParameters));
        Dimension = initialParameters.Length;
        PopulationSize = populationSize;
        Random = new RandomStream(seed);
        Members = new double[checked(populationSize * Dimension)];
        _best = (double[])initialParameters.Clone();
        _extraEpisodes = new int[populationSize];
        _order = new int[populationSize];
        _orderScratch = new int[populationSize];
    }

    public abstract EvolutionKind Kind { get; }
    public int Dimension { get; }
    public int PopulationSize { get; }
    public int Generation { get; private set; }
    public abstract double StepSize { get; }
    public abstract ReadOnlySpan<double> Center { get; }
    public ReadOnlySpan<double> Best => _best;
    public double BestFitness => _bestFitness;
    public ReadOnlySpan<int> ExtraEpisodes => _extraEpisodes;

    /// <summary>The settings record this optimiser was built with.</summary>
    public abstract EvolutionSettings Settings { get; }

    /// <summary>Whether a generation has been asked for and not yet told.</summary>
    public bool HasPendingGeneration => _pending;

    public void Ask(Span<double> population)
    {
        if (population.Length != Members.Length)
            throw new ArgumentException(
                $"population buffer must hold {PopulationSize} × {Dimension} = {Members.Length} values, got {population.Length}",
                nameof(population));
        if (!_pending)
        {
            Array.Clear(_extraEpisodes);
            Sample(Members, _extraEpisodes);
            _pending = true;
        }
        Members.CopyTo(population);
    }

    public void Tell(ReadOnlySpan<double> fitness)
    {
        if (!_pending) throw new InvalidOperationException("Tell called without a pending generation: call Ask first");
        if (fitness.Length != PopulationSize)
            throw new ArgumentException($"fitness must hold {PopulationSize} values, got {fitness.Length}", nameof(fitness));
        int n = Dimension;
        for (int k = 0; k < fitness.Length; k++)
        {
            if (fitness[k] > _bestFitness) // NaN never compares greater
            {
                _bestFitness = fitness[k];
                Members.AsSpan(k * n, n).CopyTo(_best);
            }
        }
        FitnessRanking.SortDescending(fitness, _order, _orderScratch);
        Update(fitness, _order);
        _pending = false;
        Generation++;
    }

    /// <summary>Draws the next generation into <paramref name="members"/> and marks extra elite episodes.</summary>
    protected abstract void Sample(Span<double> members, Span<int> extraEpisodes);

    /// <summary>Updates the search from the told fitness; <paramref name="order"/> lists slots best first.</summary>
    protected abstract void Update(ReadOnlySpan<double> fitness, ReadOnlySpan<int> order);

    /// <summary>Writes the method-specific state.</summary>
    protected abstract void SaveCore(BinaryWriter writer);

    /// <summary>Reads the method-specific state written by <see cref="SaveCore"/>.</summary>
    protected abstract void LoadCore(BinaryReader reader);

    public void Save(BinaryWriter writer)
    {
        ArgumentNullException.ThrowIfNull(writer);
        writer.Write(Magic);
        writer.Write(FormatVersion);
        writer.Write((int)Kind);
        Settings.Write(writer);
        writer.Write(Dimension);
        writer.Write(PopulationSize);
        writer.Write(Generation);
        Span<ulong> rng = stackalloc ulong[RandomStream.StateWords];
        Random.GetState(rng);
        foreach (ulong w in rng) writer.Write(w);
        writer.Write(_bestFitness);
        WriteArray(writer, _best);
        writer.Write(_pending);
        WriteArray(writer, Members);
        foreach (int e in _extraEpisodes) writer.Write(e);
        SaveCore(writer);
    }

    public void Load(BinaryReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        string magic = reader.ReadString();
        if (magic != Magic) throw new InvalidDataException($"not an evolution checkpoint (header '{magic}')");
        int version = reader.ReadInt32();
        if (version != FormatVersion) throw new InvalidDataException($"evolution checkpoint format {version} is not supported (expected {FormatVersion})");
        var kind = (EvolutionKind)reader.ReadInt32();
        if (kind != Kind) throw new InvalidDataException($"checkpoint holds {kind} state, this optimiser is {Kind}");
        EvolutionSettings saved = ReadSettings(kind, reader);
        if (!saved.Equals(Settings))
            throw new InvalidDataException($"checkpoint settings {saved} differ from this optimiser's settings {Settings}");
        int dim = reader.ReadInt32(), pop = reader.ReadInt32();
        if (dim != Dimension || pop != PopulationSize)
            throw new InvalidDataException($"checkpoint has dimension {dim} and population {pop}, this optimiser {Dimension} and {PopulationSize}");
        int generation = reader.ReadInt32();
        if (generation < 0) throw new InvalidDataException($"checkpoint generation {generation} is negative");
        Span<ulong> rng = stackalloc ulong[RandomStream.StateWords];
        for (int i = 0; i < rng.Length; i++) rng[i] = reader.ReadUInt64();
        Random.SetState(rng);
        _bestFitness = reader.ReadDouble();
        ReadArray(reader, _best, "best");
        _pending = reader.ReadBoolean();
        ReadArray(reader, Members, "members");
        for (int i = 0; i < _extraEpisodes.Length; i++) _extraEpisodes[i] = reader.ReadInt32();
        Generation = generation;
        LoadCore(reader);
    }

    private static EvolutionSettings ReadSettings(EvolutionKind kind, BinaryReader reader) => kind switch
    {
        EvolutionKind.Genetic => GeneticSearchSettings.Read(reader),
        EvolutionKind.EvolutionStrategies => EvolutionStrategiesSettings.Read(reader),
        EvolutionKind.CmaEs => CmaEsSettings.Read(reader),
        _ => throw new InvalidDataException($"unknown evolution kind {(int)kind} in checkpoint"),
    };

    /// <summary>Writes a length-prefixed array of doubles (exact bits).</summary>
    protected static void WriteArray(BinaryWriter writer, ReadOnlySpan<double> values)
    {
        writer.Write(values.Length);
        foreach (double v in values) writer.Write(v);
    }

    /// <summary>Reads an array written by <see cref="WriteArray"/> into a buffer of the same length.</summary>
    protected static void ReadArray(BinaryReader reader, Span<double> into, string name)
    {
        int length = reader.ReadInt32();
        if (length != into.Length) throw new InvalidDataException($"checkpoint array '{name}' has {length} values, expected {into.Length}");
        for (int i = 0; i < into.Length; i++) into[i] = reader.ReadDouble();
    }

    /// <summary>Adds σ·N(0, 1) to every element, drawing in element order.</summary>
    protected void AddGaussian(Span<double> values, double sigma)
    {
        for (int i = 0; i < values.Length; i++) values[i] += sigma * Random.NextGaussian();
    }
}
