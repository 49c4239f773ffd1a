namespace HybridRL.Models;

/// <summary>How circuit inputs become rotation angles (config key <c>model.circuit.encoding</c>).</summary>
public enum EncodingKind
{
    /// <summary>
    /// Basis encoding of bit features: feature f ∈ {0, 1} on qubit f as RX(π·x) (= X up to a global phase, Nielsen &amp; Chuang §4.2),
    /// so a bit string |b⟩ is prepared exactly. Encoded once before the first layer; no input scales.
    /// </summary>
    Basis,
    /// <summary>One feature per qubit as RX(λ·x).</summary>
    AngleX,
    /// <summary>One feature per qubit as RY(λ·x).</summary>
    AngleY,
    /// <summary>Two features per qubit as RY(λ·x₂ᵢ) then RZ(λ·x₂ᵢ₊₁).</summary>
    DenseAngle,
}
