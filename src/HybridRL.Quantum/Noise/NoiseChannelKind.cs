namespace HybridRL.Quantum.Noise;

/// <summary>Kraus channels of Nielsen &amp; Chuang §8.3.</summary>
public enum NoiseChannelKind
{
    /// <summary>ρ → (1−p)ρ + p·I/2 on each qubit the gate touched (N&amp;C eq. 8.100).</summary>
    Depolarizing,
    /// <summary>ρ → (1−p)ρ + p·I/4 ⊗ Tr_pair ρ on the qubit pair of a two-qubit gate (two-qubit version of eq. 8.100).</summary>
    Depolarizing2,
    /// <summary>Kraus E0 = diag(1, √(1−γ)), E1 = √γ|0⟩⟨1| (N&amp;C eqs. 8.107–8.108).</summary>
    AmplitudeDamping,
    /// <summary>Kraus E0 = diag(1, √(1−λ)), E1 = √λ|1⟩⟨1| (N&amp;C eqs. 8.127–8.128).</summary>
    PhaseDamping,
    /// <summary>√(1−p)·I, √p·X (N&amp;C §8.3.3).</summary>
    BitFlip,
    /// <summary>√(1−p)·I, √p·Z (N&amp;C §8.3.3).</summary>
    PhaseFlip,
}
