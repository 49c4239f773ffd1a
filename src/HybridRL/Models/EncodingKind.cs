namespace HybridRL.Models;

/// <summary>
/// How circuit inputs enter the circuit (config key <c>model.circuit.encoding</c>). Angle encodings honour
/// re-uploading and trainable input scaling; basis, amplitude and product encodings are prepared once at the
/// start and have no input scales.
/// </summary>
public enum EncodingKind
{
    /// <summary>One feature per qubit as RX(λ·x).</summary>
    AngleX,
    /// <summary>One feature per qubit as RY(λ·x).</summary>
    AngleY,
    /// <summary>Two features per qubit as RY(λ·x₂ᵢ) then RZ(λ·x₂ᵢ₊₁).</summary>
    DenseAngle,
    /// <summary>One input, an integer state index written as a bit string (needs <c>model.compressor.kind: none</c>).</summary>
    Basis,
    /// <summary>Up to 2^qubits features as real amplitudes (normalised), prepared once before the layers.</summary>
    Amplitude,
    /// <summary>Second-order product encoding (H, RZ(x_i), ZZ(x_i·x_j)), one feature per qubit, prepared once.</summary>
    ProductZz,
}
