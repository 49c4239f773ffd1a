namespace HybridRL.Training.Evolution;

/// <summary>
/// Genetic search after Such et al. (2017), "Deep Neuroevolution": each generation the best T members
/// (truncation selection) become parents; the best <c>elites</c> members are carried over unmutated into
/// slots 0 … E−1 of the next generation and evaluated again there (so a lucky evaluation does not keep an
/// elite alive for ever); every other slot is a parent picked uniformly at random — or, with probability
/// <c>crossover</c>, a uniform crossover of two distinct random parents — plus Gaussian noise σ·N(0, I).
/// When <c>elite_episodes</c> &gt; 0 the elite slots are flagged in <see cref="IEvolutionStrategy.ExtraEpisodes"/>
/// so the caller can evaluate them on extra episodes (Such et al. evaluate elite candidates on extra episodes).
/// Generation 0 is the initial vector (slot 0, unmutated) and λ−1 mutants of it.
/// <see cref="Center"/> is the best member of the last told generation (the initial vector before that).
/// </summary>
public sealed class GeneticSearch : EvolutionStrategyBase
{
    private readonly GeneticSearchSettings _settings;
    private readonly double[] _parents;   // Truncation × n
    private readonly double[] _elites;    // max(Elites, 1) × n
    private readonly double[] _center;
    private int _parentCount;
    private int _eliteCount;

    public GeneticSearch(GeneticSearchSettings settings, double[] initialParameters, ulong seed)
        : base(settings, initialParameters, settings?.Population ?? 0, seed)
    {
        _settings = settings!;
        int n = Dimension;
        _parents = new double[checked(_settings.Truncation * n)];
        _elites = new double[checked(Math.Max(_settings.Elites, 1) * n)];
        _center = (double[])initialParameters.Clone();
        initialParameters.CopyTo(_parents, 0);
        _parentCount = 1;
        if (_settings.Elites > 0)
        {
            initialParameters.CopyTo(_elites, 0);
            _eliteCount = 1;
        }
    }

    public override EvolutionKind Kind => EvolutionKind.Genetic;
    public override EvolutionSettings Settings => _settings;
    public override double StepSize => _settings.MutationSigma;
    public override ReadOnlySpan<double> Center => _center;

    /// <summary>Number of parents the next generation is bred from (1 before the first tell).</summary>
    public int ParentCount => _parentCount;

    /// <summary>Number of unmutated elites in slots 0 … EliteCount−1 of the next generation.</summary>
    public int EliteCount => _eliteCount;

    protected override void Sample(Span<double> members, Span<int> extraEpisodes)
    {
        int n = Dimension;
        var s = _settings;
        int slot = 0;
        // Generation 0 without elitism still evaluates the initial vector once, unmutated, in slot 0.
        if (_eliteCount == 0 && Generation == 0)
        {
            _parents.AsSpan(0, n).CopyTo(members[..n]);
            slot = 1;
        }
        for (; slot < _eliteCount; slot++)
        {
            _elites.AsSpan(slot * n, n).CopyTo(members.Slice(slot * n, n));
            extraEpisodes[slot] = s.EliteEpisodes;
        }
        for (; slot < PopulationSize; slot++)
        {
            Span<double> child = members.Slice(slot * n, n);
            if (s.Crossover > 0 && _parentCount >= 2 && Random.NextDouble() < s.Crossover)
            {
                int a = Random.NextInt(_parentCount);
                int b = Random.NextInt(_parentCount - 1);
                if (b >= a) b++;
                UniformCrossover(_parents.AsSpan(a * n, n), _parents.AsSpan(b * n, n), child);
            }
            else
            {
                int p = _parentCount == 1 ? 0 : Random.NextInt(_parentCount);
                _parents.AsSpan(p * n, n).CopyTo(child);
            }
            AddGaussian(child, s.MutationSigma);
        }
    }

    /// <summary>Each gene from parent a or b with probability ½, one random bit per gene.</summary>
    private void UniformCrossover(ReadOnlySpan<double> a, ReadOnlySpan<double> b, Span<double> child)
    {
        ulong bits = 0;
        for (int j = 0; j < child.Length; j++)
        {
            if ((j & 63) == 0) bits = Random.NextUInt64();
            child[j] = (bits & 1) != 0 ? b[j] : a[j];
            bits >>= 1;
        }
    }

    protected override void Update(ReadOnlySpan<double> fitness, ReadOnlySpan<int> order)
    {
        int n = Dimension;
        _parentCount = _settings.Truncation;
        for (int k = 0; k < _parentCount; k++)
            Members.AsSpan(order[k] * n, n).CopyTo(_parents.AsSpan(k * n, n));
        _eliteCount = _settings.Elites;
        for (int k = 0; k < _eliteCount; k++)
            Members.AsSpan(order[k] * n, n).CopyTo(_elites.AsSpan(k * n, n));
        Members.AsSpan(order[0] * n, n).CopyTo(_center);
    }

    protected override void SaveCore(BinaryWriter writer)
    {
        writer.Write(_parentCount);
        writer.Write(_eliteCount);
        WriteArray(writer, _parents);
        WriteArray(writer, _elites);
        WriteArray(writer, _center);
    }

    protected override void LoadCore(BinaryReader reader)
    {
        int parents = reader.ReadInt32(), elites = reader.ReadInt32();
        if (parents < 1 || parents > _settings.Truncation) throw new InvalidDataException($"checkpoint parent count {parents} is out of range");
        if (elites < 0 || elites > Math.Max(_settings.Elites, 1)) throw new InvalidDataException($"checkpoint elite count {elites} is out of range");
        _parentCount = parents;
        _eliteCount = elites;
        ReadArray(reader, _parents, "parents");
        ReadArray(reader, _elites, "elites");
        ReadArray(reader, _center, "center");
    }
}
