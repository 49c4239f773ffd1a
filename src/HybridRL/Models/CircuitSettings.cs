using HybridRL.Quantum.Circuits;

namespace HybridRL.Models;

/// <summary>Variational circuit settings (config section <c>model.circuit</c>).</summary>
public sealed record CircuitSettings
{
    /// <summary><c>model.circuit.qubits</c>.</summary>
    public int Qubits { get; init; } = 4;
    /// <summary><c>model.circuit.layers</c>: variational layers (each: encoding if re-uploading, rotations, entangler).</summary>
    public int Layers { get; init; } = 2;
    /// <summary><c>model.circuit.encoding</c>.</summary>
    public EncodingKind Encoding { get; init; } = EncodingKind.AngleX;
    /// <summary><c>model.circuit.reupload</c>: repeat the encoding before every layer (data re-uploading).</summary>
    public bool Reupload { get; init; } = true;
    /// <summary><c>model.circuit.rotations</c>: trainable rotations per qubit per layer, in order.</summary>
    public IReadOnlyList<RotationAxis> Rotations { get; init; } = [RotationAxis.Y, RotationAxis.Z];
    /// <summary><c>model.circuit.entangler</c>.</summary>
    public EntanglerPattern Entangler { get; init; } = EntanglerPattern.Ring;
    /// <summary><c>model.circuit.entangling_gate</c>.</summary>
    public EntanglingGate EntanglingGate { get; init; } = EntanglingGate.CZ;
    /// <summary><c>model.circuit.input_squash</c>: none | arctan, applied to each feature before its scale.</summary>
    public InputSquash InputSquash { get; init; } = InputSquash.None;
    /// <summary><c>model.circuit.trainable_input_scaling</c>: one trainable scale per feature occurrence (initial value 1).</summary>
    public bool TrainableInputScaling { get; init; } = true;
    /// <summary><c>model.circuit.readout</c>: per_action | linear.</summary>
    public ReadoutKind Readout { get; init; } = ReadoutKind.PerAction;
    /// <summary><c>model.circuit.trainable_output_weights</c>: false keeps the read-out at its initial values, with no parameters.</summary>
    public bool TrainableReadout { get; init; } = true;
}
