namespace HybridRL.Models;

/// <summary>Compressor settings (config section <c>model.compressor</c>).</summary>
public sealed record CompressorSettings
{
    /// <summary><c>model.compressor.kind</c>: none | mps | dense.</summary>
    public CompressorKind Kind { get; init; } = CompressorKind.None;
    /// <summary><c>model.compressor.output_size</c>: features handed to the encoding; 0 = what the encoding holds (qubits × features per qubit).</summary>
    public int OutputSize { get; init; }
    /// <summary><c>model.compressor.bond_dimension</c> (χ, mps only).</summary>
    public int BondDimension { get; init; } = 8;
    /// <summary><c>model.compressor.feature_map</c>: trigonometric | linear (mps only).</summary>
    public SiteFeatureMap FeatureMap { get; init; } = SiteFeatureMap.Trigonometric;
    /// <summary><c>model.compressor.hidden</c> (dense only).</summary>
    public IReadOnlyList<int> Hidden { get; init; } = [16];
    /// <summary><c>model.compressor.activation</c> (dense only).</summary>
    public Activation Activation { get; init; } = Activation.Tanh;
}
