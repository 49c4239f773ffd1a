namespace HybridRL.Models;

/// <summary>Two-qubit gate of the entangler (config key <c>model.circuit.entangling_gate</c>).</summary>
public enum EntanglingGate
{
    CZ,
    CNOT,
}
