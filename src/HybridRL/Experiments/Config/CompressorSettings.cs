namespace HybridRL.Experiments.Config;

/// <summary><c>model.compressor</c>: optional classical compressor between observation and circuit.</summary>
public sealed record CompressorSettings
{
    public required CompressorKind Kind { get; init; }
    /// <summary>MPS bond dimension (mps only).</summary>
    public required int BondDimension { get; init; }
    /// <summary>Number of features handed to the encoding (resolved: never 0 when Kind != None).</summary>
    public required int OutputSize { get; init; }
    public required MpsFeatureMap FeatureMap { get; init; }
    /// <summary>Hidden layer sizes (dense only).</summary>
    public required EquatableList<int> HiddenSizes { get; init; }
    public required ActivationKind Activation { get; init; }
}
