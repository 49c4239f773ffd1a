namespace HybridRL.Training.Evolution;

/// <summary>
/// Evolution strategies after Salimans et al. (2017), "Evolution Strategies as a Scalable Alternative to
/// Reinforcement Learning": λ/2 noise vectors εᵢ ~ N(0, I) are evaluated in mirrored pairs
/// (slot 2i = θ + σεᵢ, slot 2i+1 = θ − σεᵢ); fitness is shaped by centred ranks in [−0.5, 0.5]; the
/// gradient estimate g = 1/(λσ) Σᵢ (s₂ᵢ − s₂ᵢ₊₁) εᵢ, with L2 weight decay g ← g − c·θ, is followed by
/// Adam (Kingma &amp; Ba 2015) as an ascent step. σ is fixed. <see cref="Center"/> is θ.
/// </summary>
public sealed class EvolutionStrategiesSearch : EvolutionStrategyBase
{
    private readonly EvolutionStrategiesSettings _settings;
    private readonly double[] _theta;
    private readonly double[] _noise;    // (λ/2) × n
    private readonly double[] _shaped;   // λ
    private readonly double[] _descent;  // n: −(ascent gradient)
    private readonly VectorAdam _adam;

    public EvolutionStrategiesSearch(EvolutionStrategiesSettings settings, double[] initialParameters, ulong seed)
        : base(settings, initialParameters, settings?.Population ?? 0, seed)
    {
        _settings = settings!;
        int n = Dimension;
        _theta = (double[])initialParameters.Clone();
        _noise = new double[checked(PopulationSize / 2 * n)];
        _shaped = new double[PopulationSize];
        _descent = new double[n];
        _adam = new VectorAdam(n, _settings.LearningRate, _settings.AdamBeta1, _settings.AdamBeta2, _settings.AdamEpsilon);
    }

    public override EvolutionKind Kind => EvolutionKind.EvolutionStrategies;
    public override EvolutionSettings Settings => _settings;
    public override double StepSize => _settings.Sigma;
    public override ReadOnlySpan<double> Center => _theta;

    /// <summary>The centred-rank shaped fitness of the last told generation, per slot.</summary>
    public ReadOnlySpan<double> ShapedFitness => _shaped;

    /// <summary>The last ascent-gradient estimate (including weight decay), before Adam.</summary>
    public double AscentGradient(int i) => -_descent[i];

    protected override void Sample(Span<double> members, Span<int> extraEpisodes)
    {
        int n = Dimension;
        double sigma = _settings.Sigma;
        for (int i = 0; i < PopulationSize / 2; i++)
        {
            Span<double> eps = _noise.AsSpan(i * n, n);
            Span<double> plus = members.Slice(2 * i * n, n);
            Span<double> minus = members.Slice((2 * i + 1) * n, n);
            for (int j = 0; j < n; j++)
            {
                double e = Random.NextGaussian();
                eps[j] = e;
                plus[j] = _theta[j] + sigma * e;
                minus[j] = _theta[j] - sigma * e;
            }
        }
    }

    protected override void Update(ReadOnlySpan<double> fitness, ReadOnlySpan<int> order)
    {
        int n = Dimension;
        FitnessRanking.CentredRanks(fitness, order, _shaped);
        Array.Clear(_descent);
        for (int i = 0; i < PopulationSize / 2; i++)
        {
            double w = _shaped[2 * i] - _shaped[2 * i + 1];
            if (w == 0) continue;
            ReadOnlySpan<double> eps = _noise.AsSpan(i * n, n);
            for (int j = 0; j < n; j++) _descent[j] += w * eps[j];
        }
        double scale = 1.0 / (PopulationSize * _settings.Sigma);
        double decay = _settings.WeightDecay;
        for (int j = 0; j < n; j++)
            _descent[j] = -(_descent[j] * scale - decay * _theta[j]);
        _adam.Step(_theta, _descent);
    }

    protected override void SaveCore(BinaryWriter writer)
    {
        WriteArray(writer, _theta);
        WriteArray(writer, _noise);
        WriteArray(writer, _shaped);
        WriteArray(writer, _descent);
        _adam.Save(writer);
    }

    protected override void LoadCore(BinaryReader reader)
    {
        ReadArray(reader, _theta, "theta");
        ReadArray(reader, _noise, "noise");
        ReadArray(reader, _shaped, "shaped");
        ReadArray(reader, _descent, "gradient");
        _adam.Load(reader);
    }
}
