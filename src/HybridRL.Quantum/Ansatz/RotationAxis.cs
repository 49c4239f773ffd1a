namespace HybridRL.Quantum.Ansatz;

/// <summary>Axis of a single-qubit Pauli rotation.</summary>
public enum RotationAxis { X, Y, Z }
