namespace HybridRL.Models;

/// <summary>Axis of a trainable single-qubit rotation in each variational layer (config key <c>model.circuit.rotations</c>).</summary>
public enum RotationAxis
{
    X,
    Y,
    Z,
}
