using System.Runtime.CompilerServices;
namespace HybridRL.Quantum.Simulation;

/// <summary>Applies lowered primitives to a state vector (forward, fused forward, and inverse).</summary>
internal static class StateVectorOps
{
    public static void ResetToZero(double[] re, double[] im)
    {
        Array.Clear(re);
        Array.Clear(im);
        re[0] = 1;
    }

    public static void Apply1Smart(double[] re, double[] im, int bits, int q, in Mat2 m, int kt)
    {
        if (m.IsDiagonal)
        {
            if (!m.IsIdentity) StateKernels.ApplyDiag1(re, im, bits, q, m.Ar, m.Ai, m.Dr, m.Di, kt);
        }
        else StateKernels.Apply1(re, im, bits, q, m, kt);
    }

    /// <summary>Applies one primitive (or its inverse) with the given angle.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Apply(double[] re, double[] im, int bits, in Primitive p, double theta, bool inverse, int kt)
    {
        switch (p.Kind)
        {
            case PrimitiveKind.CNOT: StateKernels.ApplyCnot(re, im, bits, p.Q0, p.Q1, kt); return;
            case PrimitiveKind.CZ: StateKernels.ApplyCz(re, im, bits, p.Q0, p.Q1, kt); return;
            case PrimitiveKind.SWAP: StateKernels.ApplySwap(re, im, bits, p.Q0, p.Q1, kt); return;
            case PrimitiveKind.CRX or PrimitiveKind.CRY or PrimitiveKind.CRZ:
            {
                var m = p.Matrix(inverse ? -theta : theta);
                StateKernels.ApplyControlled1(re, im, bits, p.Q0, p.Q1, m, kt);
                return;
            }
            default:
            {
                var m = p.Kind == PrimitiveKind.Fixed1 ? (inverse ? p.Fixed.Adjoint() : p.Fixed) : p.Matrix(inverse ? -theta : theta);
                Apply1Smart(re, im, bits, p.Q0, m, kt);
                return;
            }
        }
    }

    /// <summary>
    /// Runs all primitives from |0…0⟩, fusing consecutive single-qubit primitives on the same qubit into one
    /// 2×2 matrix (flushed when a two-qubit primitive touches that qubit, and at the end); diagonal results
    /// are applied as phases.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void RunFused(Workspace ws, Primitive[] prims, ReadOnlySpan<double> theta, int qubits, int kt)
    {
        var re = ws.Re; var im = ws.Im;
        ResetToZero(re, im);
        var pend = ws.Pending; var has = ws.HasPending;
        Array.Clear(has);
        for (int i = 0; i < prims.Length; i++)
        {
            ref readonly var p = ref prims[i];
            if (p.IsSingleQubit)
            {
                var m = p.Kind == PrimitiveKind.Fixed1 ? p.Fixed : p.Matrix(theta[p.Slot]);
                int q = p.Q0;
                if (has[q]) pend[q] = Mat2.Mul(m, pend[q]);
                else { pend[q] = m; has[q] = true; }
                continue;
            }
            Flush(ws, p.Q0, qubits, kt);
            Flush(ws, p.Q1, qubits, kt);
            Apply(re, im, qubits, p, p.Slot >= 0 ? theta[p.Slot] : 0, false, kt);
        }
        for (int q = 0; q < qubits; q++) Flush(ws, q, qubits, kt);
    }

    private static void Flush(Workspace ws, int q, int bits, int kt)
    {
        if (!ws.HasPending[q]) return;
        ws.HasPending[q] = false;
        Apply1Smart(ws.Re, ws.Im, bits, q, ws.Pending[q], kt);
    }
}
