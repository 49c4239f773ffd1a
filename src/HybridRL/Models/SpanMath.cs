using System.Numerics;
using System.Runtime.InteropServices;

namespace HybridRL.Models;

/// <summary>Small SIMD kernels for the managed (no-autograd) model paths. Deterministic: fixed summation order for a given length.</summary>
internal static class SpanMath
{
    /// <summary>dst += c0·a + c1·b.</summary>
    public static void AddScaledPair(Span<double> dst, double c0, ReadOnlySpan<double> a, double c1, ReadOnlySpan<double> b)
    {
        int n = dst.Length, i = 0;
        if (Vector.IsHardwareAccelerated && n >= Vector<double>.Count)
        {
            var vd = MemoryMarshal.Cast<double, Vector<double>>(dst);
            var va = MemoryMarshal.Cast<double, Vector<double>>(a[..n]);
            var vb = MemoryMarshal.Cast<double, Vector<double>>(b[..n]);
            var s0 = new Vector<double>(c0);
            var s1 = new Vector<double>(c1);
            for (int k = 0; k < vd.Length; k++) vd[k] += s0 * va[k] + s1 * vb[k];
            i = vd.Length * Vector<double>.Count;
        }
        for (; i < n; i++) dst[i] += c0 * a[i] + c1 * b[i];
    }

    /// <summary>Σ a_i b_i with a fixed blocked order.</summary>
    public static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        int n = a.Length, i = 0;
        double s = 0;
        if (Vector.IsHardwareAccelerated && n >= Vector<double>.Count)
        {
            var va = MemoryMarshal.Cast<double, Vector<double>>(a);
            var vb = MemoryMarshal.Cast<double, Vector<double>>(b[..n]);
            var acc = Vector<double>.Zero;
            for (int k = 0; k < va.Length; k++) acc += va[k] * vb[k];
            s = Vector.Sum(acc);
            i = va.Length * Vector<double>.Count;
        }
        for (; i < n; i++) s += a[i] * b[i];
        return s;
    }
}
