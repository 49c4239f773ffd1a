namespace HybridRL.Models;

/// <summary>How circuit inputs become rotation angles (config key <c>model.circuit.encoding</c>).</summary>
public enum EncodingKind
{
    /// <summary>One feature per qubit as RX(λ·x).</summary>
    AngleX,
    /// <summary>One feature per qubit as RY(λ·x).</summary>
    AngleY,
    /// <summary>Two features per qubit as RY(λ·x₂ᵢ) then RZ(λ·x₂ᵢ₊₁).</summary>
    DenseAngle,
}
