using System.Globalization;

namespace HybridRL.Training.Evolution;

/// <summary>
/// Settings of <see cref="EvolutionStrategiesSearch"/> (Salimans et al. 2017).
/// Keys: <c>population</c>, <c>sigma</c>, <c>learning_rate</c>, <c>weight_decay</c>, <c>adam_beta1</c>,
/// <c>adam_beta2</c>, <c>adam_epsilon</c>.
/// Defaults: σ = 0.02, learning rate 0.01 and L2 coefficient 0.005 are the values Salimans et al. used for
/// their MuJoCo runs (from memory); β₁ = 0.9, β₂ = 0.999, ε = 1e-8 are Kingma &amp; Ba's (2015) defaults;
/// the population of 100 (50 mirrored pairs) is our choice.
/// </summary>
/// <param name="Population">λ, members per generation: even, ≥ 2 (λ/2 mirrored pairs).</param>
/// <param name="Sigma">σ, the fixed noise standard deviation (&gt; 0).</param>
/// <param name="LearningRate">Adam step size α (&gt; 0).</param>
/// <param name="WeightDecay">L2 coefficient subtracted (times the parameters) from the ascent gradient estimate (≥ 0).</param>
/// <param name="AdamBeta1">Adam β₁ in [0, 1).</param>
/// <param name="AdamBeta2">Adam β₂ in [0, 1).</param>
/// <param name="AdamEpsilon">Adam ε (&gt; 0).</param>
public sealed record EvolutionStrategiesSettings(
    int Population = 100,
    double Sigma = 0.02,
    double LearningRate = 0.01,
    double WeightDecay = 0.005,
    double AdamBeta1 = 0.9,
    double AdamBeta2 = 0.999,
    double AdamEpsilon = 1e-8) : EvolutionSettings
{
    private const string Method = "evolution strategies";

    public override EvolutionKind Kind => EvolutionKind.EvolutionStrategies;

    private static string F(double x) => x.ToString("R", CultureInfo.InvariantCulture);

    public override void Validate()
    {
        if (Population < 2 || Population % 2 != 0)
            throw Bad(Method, "population", "must be an even number of at least 2 (mirrored pairs)", Population);
        if (!IsPositiveFinite(Sigma)) throw Bad(Method, "sigma", "must be a positive finite number", F(Sigma));
        if (!IsPositiveFinite(LearningRate)) throw Bad(Method, "learning_rate", "must be a positive finite number", F(LearningRate));
        if (!(double.IsFinite(WeightDecay) && WeightDecay >= 0)) throw Bad(Method, "weight_decay", "must be a finite number of 0 or more", F(WeightDecay));
        if (!(AdamBeta1 >= 0 && AdamBeta1 < 1)) throw Bad(Method, "adam_beta1", "must be in [0, 1)", F(AdamBeta1));
        if (!(AdamBeta2 >= 0 && AdamBeta2 < 1)) throw Bad(Method, "adam_beta2", "must be in [0, 1)", F(AdamBeta2));
        if (!IsPositiveFinite(AdamEpsilon)) throw Bad(Method, "adam_epsilon", "must be a positive finite number", F(AdamEpsilon));
    }

    internal override void Write(BinaryWriter writer)
    {
        writer.Write(Population);
        writer.Write(Sigma);
        writer.Write(LearningRate);
        writer.Write(WeightDecay);
        writer.Write(AdamBeta1);
        writer.Write(AdamBeta2);
        writer.Write(AdamEpsilon);
    }

    internal static EvolutionStrategiesSettings Read(BinaryReader reader) => new(
        reader.ReadInt32(), reader.ReadDouble(), reader.ReadDouble(), reader.ReadDouble(),
        reader.ReadDouble(), reader.ReadDouble(), reader.ReadDouble());
}
