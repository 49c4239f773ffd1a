namespace HybridRL.Quantum.Circuits;

/// <summary>
/// A differentiable function from one input row to a block of gate angles, owned by a circuit
/// (for encodings whose angles depend on the whole row, e.g. amplitude encoding).
/// Implementations must be thread-safe (no mutable state) and allocation-free.
/// </summary>
public interface IInputAngleMap
{
    /// <summary>Short description used in exports and messages.</summary>
    string Name { get; }
    /// <summary>Number of input features read (indices 0..InputCount-1 of the row).</summary>
    int InputCount { get; }
    /// <summary>Number of angles produced.</summary>
    int AngleCount { get; }
    /// <summary>Whether the angles have a useful gradient with respect to the inputs.</summary>
    bool IsDifferentiable { get; }
    /// <summary>Computes the angles for one input row.</summary>
    void Compute(ReadOnlySpan<double> inputs, Span<double> angles);
    /// <summary>Adds gradAngles·∂angles/∂inputs into <paramref name="gradInputs"/>.</summary>
    void Backprop(ReadOnlySpan<double> inputs, ReadOnlySpan<double> gradAngles, Span<double> gradInputs);
}
