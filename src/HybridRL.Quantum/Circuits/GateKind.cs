namespace HybridRL.Quantum.Circuits;

/// <summary>Gates with their textbook names (Nielsen &amp; Chuang §4.2–4.3).</summary>
public enum GateKind
{
    X, Y, Z, H, S, Sdg, T, Tdg,
    RX, RY, RZ,
    /// <summary>General single-qubit rotation RZ(ω)·RY(θ)·RZ(φ) (Euler ZYZ); angles in order φ, θ, ω (φ applied first).</summary>
    Rot,
    /// <summary>Phase gate diag(1, e^{iφ}).</summary>
    Phase,
    CNOT, CZ, SWAP,
    CRX, CRY, CRZ,
}
