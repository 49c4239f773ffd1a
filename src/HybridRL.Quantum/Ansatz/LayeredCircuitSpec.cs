using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Encodings;

namespace HybridRL.Quantum.Ansatz;

/// <summary>
/// Description of a layered variational circuit: an encoding (once, or before every layer for
/// re-uploading), then <see cref="Layers"/> layers of rotations on every qubit plus an entangler.
/// </summary>
public sealed record LayeredCircuitSpec
{
    public int Qubits { get; init; } = 4;
    public int Layers { get; init; } = 2;
    public EncodingKind Encoding { get; init; } = EncodingKind.Angle;
    /// <summary>Rotation axis of angle and re-uploading encodings.</summary>
    public RotationAxis EncodingAxis { get; init; } = RotationAxis.Y;
    /// <summary>Trainable rotations applied to every qubit in each layer, in order.</summary>
    public IReadOnlyList<RotationAxis> RotationAxes { get; init; } = [RotationAxis.Y, RotationAxis.Z];
    public EntanglerPattern Entangler { get; init; } = EntanglerPattern.Chain;
    public EntanglingGate EntanglingGate { get; init; } = EntanglingGate.CNOT;
    public InputSquash InputSquash { get; init; } = InputSquash.None;
    /// <summary>Constant input scale (or initial value of trainable scales).</summary>
    public double InputScale { get; init; } = 1.0;
    /// <summary>Give each feature (per re-uploading layer) its own trainable scale parameter.</summary>
    public bool TrainableInputScale { get; init; }

    public void Validate(int inputCount)
    {
        if (Qubits < 1 || Qubits > Circuit.MaxQubits)
            throw new ArgumentOutOfRangeException(nameof(Qubits), Qubits, $"qubits must be between 1 and {Circuit.MaxQubits}");
        if (Layers < 0) throw new ArgumentOutOfRangeException(nameof(Layers), Layers, "layers must be non-negative");
        if (Encoding == EncodingKind.ReUploading && Layers < 1) throw new ArgumentOutOfRangeException(nameof(Layers), Layers, "re-uploading needs at least one layer");
        if (RotationAxes == null || (RotationAxes.Count == 0 && Layers > 0 && Entangler == EntanglerPattern.None))
            throw new ArgumentException("rotation axes must be given (a layer with no rotations and no entangler is empty)", nameof(RotationAxes));
        if (!double.IsFinite(InputScale)) throw new ArgumentOutOfRangeException(nameof(InputScale), InputScale, "input scale must be finite");
        if (inputCount < 1) throw new ArgumentOutOfRangeException(nameof(inputCount), inputCount, "input count must be at least 1");
        if (Encoding == EncodingKind.Basis && inputCount != 1)
            throw new ArgumentException($"basis encoding takes one input (the integer state index), got input count {inputCount}", nameof(inputCount));
    }
}
