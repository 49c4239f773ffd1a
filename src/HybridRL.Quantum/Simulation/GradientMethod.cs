namespace HybridRL.Quantum.Simulation;

public enum GradientMethod
{
    /// <summary>Adjoint for the exact state vector, parameter shift otherwise.</summary>
    Auto,
    /// <summary>Adjoint differentiation (Jones &amp; Gacon 2020): exact state vector only.</summary>
    Adjoint,
    /// <summary>Parameter-shift rule (two-term for Pauli rotations and phase, four-term for controlled rotations).</summary>
    ParameterShift,
}
