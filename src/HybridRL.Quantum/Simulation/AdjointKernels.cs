using System.Runtime.CompilerServices;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// One backward step of adjoint differentiation in a single pass over amplitude pairs: returns the
/// derivative term from ⟨λ|G|ψ⟩ at the point just after the gate, then applies U† to both ψ and λ.
/// </summary>
internal static unsafe class AdjointKernels
{
    private interface ITerm
    {
        /// <summary>Contribution of one amplitude pair (index 0: qubit q = 0, index 1: q = 1).</summary>
        static abstract double Of(double l0r, double l0i, double l1r, double l1i, double p0r, double p0i, double p1r, double p1i);
    }

    // Im⟨λ|Z|ψ⟩ per pair
    private struct ZTerm : ITerm
    {
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public static double Of(double l0r, double l0i, double l1r, double l1i, double p0r, double p0i, double p1r, double p1i) =>
            (l0r * p0i - l0i * p0r) - (l1r * p1i - l1i * p1r);
    }

    // Im⟨λ|X|ψ⟩ per pair
    private struct XTerm : ITerm
    {
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public static double Of(double l0r, double l0i, double l1r, double l1i, double p0r, double p0i, double p1r, double p1i) =>
            (l0r * p1i - l0i * p1r) + (l1r * p0i - l1i * p0r);
    }

    // Im⟨λ|Y|ψ⟩ per pair: (Yψ)₀ = −iψ₁, (Yψ)₁ = iψ₀
    private struct YTerm : ITerm
    {
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public static double Of(double l0r, double l0i, double l1r, double l1i, double p0r, double p0i, double p1r, double p1i) =>
            -(l0r * p1r + l0i * p1i) + (l1r * p0r + l1i * p0i);
    }

    // −2·Im⟨λ|Π₁|ψ⟩ per pair (phase gate)
    private struct PTerm : ITerm
    {
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public static double Of(double l0r, double l0i, double l1r, double l1i, double p0r, double p0i, double p1r, double p1i) =>
            -2 * (l1r * p1i - l1i * p1r);
    }

    /// <summary>
    /// For U = exp(−iθP/2) on qubit q (optionally controlled by every bit of controlMask, which must not include q):
    /// returns Im⟨λ|Π P|ψ⟩ (mode 'X', 'Y', 'Z') or −2·Im⟨λ|Π₁|ψ⟩ (mode 'P', phase gate), then, when
    /// <paramref name="undo"/>, ψ ← U†ψ and λ ← U†λ with U† given as <paramref name="inv"/>.
    /// </summary>
    public static double Step(double[] psiRe, double[] psiIm, double[] lamRe, double[] lamIm, int bits, int q, long controlMask, char mode, in Mat2 inv, bool undo) => mode switch
    {
        'Z' => Run<ZTerm>(psiRe, psiIm, lamRe, lamIm, bits, q, controlMask, inv, undo),
        'X' => Run<XTerm>(psiRe, psiIm, lamRe, lamIm, bits, q, controlMask, inv, undo),
        'Y' => Run<YTerm>(psiRe, psiIm, lamRe, lamIm, bits, q, controlMask, inv, undo),
        _ => Run<PTerm>(psiRe, psiIm, lamRe, lamIm, bits, q, controlMask, inv, undo),
    };

    private static double Run<T>(double[] psiRe, double[] psiIm, double[] lamRe, double[] lamIm, int bits, int q, long controlMask, in Mat2 inv, bool undo) where T : struct, ITerm
    {
        long stride = 1L << q, dim = 1L << bits;
        double ar = inv.Ar, ai = inv.Ai, br = inv.Br, bi = inv.Bi, cr = inv.Cr, ci = inv.Ci, dr = inv.Dr, di = inv.Di;
        double acc = 0;
        fixed (double* pr = psiRe, pi = psiIm, lr = lamRe, li = lamIm)
        {
            for (long bas = 0; bas < dim; bas += 2 * stride)
                for (long i0 = bas; i0 < bas + stride; i0++)
                {
                    if ((i0 & controlMask) != controlMask) continue;
                    long i1 = i0 + stride;
                    double p0r = pr[i0], p0i = pi[i0], p1r = pr[i1], p1i = pi[i1];
                    double l0r = lr[i0], l0i = li[i0], l1r = lr[i1], l1i = li[i1];
                    acc += T.Of(l0r, l0i, l1r, l1i, p0r, p0i, p1r, p1i);
                    if (!undo) continue;
                    pr[i0] = ar * p0r - ai * p0i + br * p1r - bi * p1i;
                    pi[i0] = ar * p0i + ai * p0r + br * p1i + bi * p1r;
                    pr[i1] = cr * p0r - ci * p0i + dr * p1r - di * p1i;
                    pi[i1] = cr * p0i + ci * p0r + dr * p1i + di * p1r;
                    lr[i0] = ar * l0r - ai * l0i + br * l1r - bi * l1i;
                    li[i0] = ar * l0i + ai * l0r + br * l1i + bi * l1r;
                    lr[i1] = cr * l0r - ci * l0i + dr * l1r - di * l1i;
                    li[i1] = cr * l0i + ci * l0r + dr * l1i + di * l1r;
                }
        }
        return acc;
    }
}
