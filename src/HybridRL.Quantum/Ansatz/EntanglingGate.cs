namespace HybridRL.Quantum.Ansatz;

public enum EntanglingGate { CNOT, CZ }
