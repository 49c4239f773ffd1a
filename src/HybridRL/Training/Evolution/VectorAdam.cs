namespace HybridRL.Training.Evolution;

/// <summary>
/// Adam (Kingma &amp; Ba 2015, Algorithm 1) on a flat double vector, minimising: with gradient g,
/// m ← β₁m + (1−β₁)g, v ← β₂v + (1−β₂)g², m̂ = m/(1−β₁ᵗ), v̂ = v/(1−β₂ᵗ), θ ← θ − α m̂/(√v̂ + ε).
/// Buffers are allocated once; the state (t, m, v) is checkpointable.
/// </summary>
public sealed class VectorAdam
{
    private readonly double[] _m;
    private readonly double[] _v;

    public VectorAdam(int dimension, double learningRate, double beta1 = 0.9, double beta2 = 0.999, double epsilon = 1e-8)
    {
        if (dimension < 1) throw new ArgumentOutOfRangeException(nameof(dimension), dimension, "must be at least 1");
        if (!(double.IsFinite(learningRate) && learningRate > 0)) throw new ArgumentException($"learning_rate must be positive, got {learningRate}", "learning_rate");
        if (!(beta1 >= 0 && beta1 < 1)) throw new ArgumentException($"adam_beta1 must be in [0, 1), got {beta1}", "adam_beta1");
        if (!(beta2 >= 0 && beta2 < 1)) throw new ArgumentException($"adam_beta2 must be in [0, 1), got {beta2}", "adam_beta2");
        if (!(double.IsFinite(epsilon) && epsilon > 0)) throw new ArgumentException($"adam_epsilon must be positive, got {epsilon}", "adam_epsilon");
        _m = new double[dimension];
        _v = new double[dimension];
        LearningRate = learningRate;
        Beta1 = beta1;
        Beta2 = beta2;
        Epsilon = epsilon;
    }

    public double LearningRate { get; }
    public double Beta1 { get; }
    public double Beta2 { get; }
    public double Epsilon { get; }

    /// <summary>Number of steps taken (t).</summary>
    public long Steps { get; private set; }

    public ReadOnlySpan<double> FirstMoment => _m;
    public ReadOnlySpan<double> SecondMoment => _v;

    /// <summary>One descent step on <paramref name="parameters"/> with gradient <paramref name="gradient"/>.</summary>
    public void Step(Span<double> parameters, ReadOnlySpan<double> gradient)
    {
        if (parameters.Length != _m.Length || gradient.Length != _m.Length)
            throw new ArgumentException($"parameters and gradient must have {_m.Length} values");
        Steps++;
        double c1 = 1 - Math.Pow(Beta1, Steps);
        double c2 = 1 - Math.Pow(Beta2, Steps);
        for (int i = 0; i < _m.Length; i++)
        {
            double g = gradient[i];
            _m[i] = Beta1 * _m[i] + (1 - Beta1) * g;
            _v[i] = Beta2 * _v[i] + (1 - Beta2) * g * g;
            double mHat = _m[i] / c1;
            double vHat = _v[i] / c2;
            parameters[i] -= LearningRate * mHat / (Math.Sqrt(vHat) + Epsilon);
        }
    }

    public void Save(BinaryWriter writer)
    {
        writer.Write(Steps);
        foreach (double x in _m) writer.Write(x);
        foreach (double x in _v) writer.Write(x);
    }

    public void Load(BinaryReader reader)
    {
        long steps = reader.ReadInt64();
        if (steps < 0) throw new InvalidDataException($"Adam step count {steps} is negative");
        Steps = steps;
        for (int i = 0; i < _m.Length; i++) _m[i] = reader.ReadDouble();
        for (int i = 0; i < _v.Length; i++) _v[i] = reader.ReadDouble();
    }
}
