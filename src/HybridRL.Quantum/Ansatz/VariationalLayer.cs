using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Ansatz;

/// <summary>Appends one variational layer: chosen rotations on every qubit (one new parameter each), then an entangler.</summary>
public static class VariationalLayer
{
    /// <summary>Appends the layer; returns the parameter indices it allocated, in order (qubit-major, then axis).</summary>
    public static int[] Append(CircuitBuilder b, IReadOnlyList<RotationAxis> axes, EntanglerPattern pattern, EntanglingGate gate)
    {
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(axes);
        var used = new List<int>();
        for (int q = 0; q < b.Qubits; q++)
            foreach (var axis in axes)
            {
                int p = b.NextParameter();
                used.Add(p);
                switch (axis)
                {
                    case RotationAxis.X: b.RX(q, Angle.Parameter(p)); break;
                    case RotationAxis.Y: b.RY(q, Angle.Parameter(p)); break;
                    case RotationAxis.Z: b.RZ(q, Angle.Parameter(p)); break;
                    default: throw new ArgumentOutOfRangeException(nameof(axes), axis, "unknown rotation axis");
                }
            }
        AppendEntangler(b, pattern, gate);
        return [.. used];
    }

    public static void AppendEntangler(CircuitBuilder b, EntanglerPattern pattern, EntanglingGate gate)
    {
        int n = b.Qubits;
        void E(int i, int j) { if (gate == EntanglingGate.CNOT) b.CNOT(i, j); else b.CZ(i, j); }
        switch (pattern)
        {
            case EntanglerPattern.None: break;
            case EntanglerPattern.Chain:
                for (int i = 0; i + 1 < n; i++) E(i, i + 1);
                break;
            case EntanglerPattern.Ring:
                for (int i = 0; i + 1 < n; i++) E(i, i + 1);
                if (n > 2) E(n - 1, 0);
                break;
            case EntanglerPattern.AllToAll:
                for (int i = 0; i < n; i++)
                    for (int j = i + 1; j < n; j++) E(i, j);
                break;
            default: throw new ArgumentOutOfRangeException(nameof(pattern), pattern, "unknown entangler pattern");
        }
    }
}
