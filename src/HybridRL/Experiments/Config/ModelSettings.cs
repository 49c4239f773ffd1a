namespace HybridRL.Experiments.Config;

/// <summary>
/// The <c>model</c> section. For <see cref="ModelKind.Hybrid"/> the compressor, circuit and simulation are set and
/// <see cref="Classical"/> is null; for <see cref="ModelKind.Classical"/> only <see cref="Classical"/> is set.
/// </summary>
public sealed record ModelSettings
{
    public required ModelKind Kind { get; init; }
    public required CompressorSettings? Compressor { get; init; }
    public required CircuitSettings? Circuit { get; init; }
    public required SimulationSettings? Simulation { get; init; }
    public required ClassicalModelSettings? Classical { get; init; }
}
