namespace HybridRL.Experiments.Config;

/// <summary><c>model.circuit</c>: the variational circuit.</summary>
public sealed record CircuitSettings
{
    public required int Qubits { get; init; }
    public required int Layers { get; init; }
    public required EncodingKind Encoding { get; init; }
    public required EquatableList<RotationAxis> Rotations { get; init; }
    public required EntanglerLayout Entangler { get; init; }
    public required EntanglingGate EntanglingGate { get; init; }
    public required InputSquash InputSquash { get; init; }
    public required bool TrainableInputScaling { get; init; }
    public required ReadoutKind Readout { get; init; }
    public required bool TrainableOutputWeights { get; init; }

    /// <summary>Largest number of features the encoding accepts on <see cref="Qubits"/> qubits.</summary>
    public long FeatureCapacity => Encoding switch
    {
        EncodingKind.Amplitude or EncodingKind.Basis => 1L << Math.Min(Qubits, 62),
        _ => Qubits,
    };
}
