namespace HybridRL.Models;

/// <summary>Everything <see cref="ModelFactory"/> needs to build a model (config section <c>model</c>).</summary>
public sealed record ModelSettings
{
    /// <summary><c>model.kind</c>: hybrid | classical.</summary>
    public ModelKind Kind { get; init; } = ModelKind.Hybrid;
    public CompressorSettings Compressor { get; init; } = new();
    public CircuitSettings Circuit { get; init; } = new();
    public SimulationSettings Simulation { get; init; } = new();
    public ClassicalSettings Classical { get; init; } = new();
}
