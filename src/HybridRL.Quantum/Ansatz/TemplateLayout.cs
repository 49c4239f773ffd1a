using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Ansatz;

/// <summary>A built template and where its parameters live.</summary>
public sealed record TemplateLayout(
    Circuit Circuit,
    IReadOnlyList<int> RotationParameters,
    IReadOnlyList<int> InputScaleParameters,
    double InitialInputScale)
{
    public int ParameterCount => Circuit.ParameterCount;

    /// <summary>
    /// Initial parameters: rotations uniform in [−spread, spread] drawn from <paramref name="rng"/>, trainable
    /// input scales at <see cref="InitialInputScale"/>.
    /// </summary>
    public double[] InitialParameters(Randomness.RandomStream rng, double spread = Math.PI)
    {
        ArgumentNullException.ThrowIfNull(rng);
        var w = new double[ParameterCount];
        foreach (int p in RotationParameters) w[p] = spread * (2 * rng.NextDouble() - 1);
        foreach (int p in InputScaleParameters) w[p] = InitialInputScale;
        return w;
    }
}
