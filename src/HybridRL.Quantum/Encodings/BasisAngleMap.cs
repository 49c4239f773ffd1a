using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Encodings;

/// <summary>Maps one input (an integer state index) to n angles π·bit_k(index); not differentiable.</summary>
public sealed class BasisAngleMap : IInputAngleMap
{
    public BasisAngleMap(int qubits)
    {
        if (qubits < 1 || qubits > 30) throw new ArgumentOutOfRangeException(nameof(qubits), qubits, "basis encoding needs 1..30 qubits");
        AngleCount = qubits;
    }

    public string Name => "basis";
    public int InputCount => 1;
    public int AngleCount { get; }
    public bool IsDifferentiable => false;

    public void Compute(ReadOnlySpan<double> inputs, Span<double> angles)
    {
        double x = inputs[0];
        double r = Math.Round(x);
        if (Math.Abs(x - r) > 1e-9 || r < 0 || r >= (1L << AngleCount))
            throw new ArgumentException($"basis encoding expects an integer state index in [0, {(1L << AngleCount) - 1}], got {x}");
        long s = (long)r;
        for (int k = 0; k < AngleCount; k++) angles[k] = ((s >> k) & 1) != 0 ? Math.PI : 0.0;
    }

    public void Backprop(ReadOnlySpan<double> inputs, ReadOnlySpan<double> gradAngles, Span<double> gradInputs) { }
}
