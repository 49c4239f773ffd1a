using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

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

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
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

    /// <summary>
    /// A run of single-qubit primitives on the same qubit, processed in one pass over amplitude pairs (each pair
    /// is closed under gates on that qubit). Entries are in backward order: entry 0 is the latest gate. For each
    /// entry the derivative term (modes 'X', 'Y', 'Z', 'P'; 'N' for none) is added to acc[e], then U†_e is applied to ψ and λ.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void StepRun(double[] psiRe, double[] psiIm, double[] lamRe, double[] lamIm, int bits, int q, ReadOnlySpan<char> modes, ReadOnlySpan<Mat2> invs, Span<double> acc)
    {
        long stride = 1L << q, dim = 1L << bits;
        int count = modes.Length;
        acc[..count].Clear();
        fixed (double* pr = psiRe, pi = psiIm, lr = lamRe, li = lamIm)
        fixed (Mat2* inv = invs)
        fixed (char* md = modes)
        fixed (double* ac = acc)
        {
            if (stride >= 4 && Vector256.IsHardwareAccelerated)
            {
                StepRunVector(pr, pi, lr, li, dim, stride, count, md, inv, ac);
                return;
            }
            if (stride < 4 && dim >= 4 && Vector256.IsHardwareAccelerated)
            {
                if (q == 0) StepRunLow<Lane0>(pr, pi, lr, li, dim, count, md, inv, ac);
                else StepRunLow<Lane1>(pr, pi, lr, li, dim, count, md, inv, ac);
                return;
            }
            for (long bas = 0; bas < dim; bas += 2 * stride)
                for (long i0 = bas; i0 < bas + stride; i0++)
                {
                    long i1 = i0 + stride;
                    double p0r = pr[i0], p0i = pi[i0], p1r = pr[i1], p1i = pi[i1];
                    double l0r = lr[i0], l0i = li[i0], l1r = lr[i1], l1i = li[i1];
                    for (int e = 0; e < count; e++)
                    {
                        switch (md[e])
                        {
                            case 'Z': ac[e] += ZTerm.Of(l0r, l0i, l1r, l1i, p0r, p0i, p1r, p1i); break;
                            case 'X': ac[e] += XTerm.Of(l0r, l0i, l1r, l1i, p0r, p0i, p1r, p1i); break;
                            case 'Y': ac[e] += YTerm.Of(l0r, l0i, l1r, l1i, p0r, p0i, p1r, p1i); break;
                            case 'P': ac[e] += PTerm.Of(l0r, l0i, l1r, l1i, p0r, p0i, p1r, p1i); break;
                        }
                        ref readonly Mat2 m = ref inv[e];
                        if (m.IsDiagonal)
                        {
                            (p0r, p0i) = (m.Ar * p0r - m.Ai * p0i, m.Ar * p0i + m.Ai * p0r);
                            (p1r, p1i) = (m.Dr * p1r - m.Di * p1i, m.Dr * p1i + m.Di * p1r);
                            (l0r, l0i) = (m.Ar * l0r - m.Ai * l0i, m.Ar * l0i + m.Ai * l0r);
                            (l1r, l1i) = (m.Dr * l1r - m.Di * l1i, m.Dr * l1i + m.Di * l1r);
                            continue;
                        }
                        if (m.Ai == 0 && m.Bi == 0 && m.Ci == 0 && m.Di == 0)
                        {
                            (p0r, p1r) = (m.Ar * p0r + m.Br * p1r, m.Cr * p0r + m.Dr * p1r);
                            (p0i, p1i) = (m.Ar * p0i + m.Br * p1i, m.Cr * p0i + m.Dr * p1i);
                            (l0r, l1r) = (m.Ar * l0r + m.Br * l1r, m.Cr * l0r + m.Dr * l1r);
                            (l0i, l1i) = (m.Ar * l0i + m.Br * l1i, m.Cr * l0i + m.Dr * l1i);
                            continue;
                        }
                        double n0r = m.Ar * p0r - m.Ai * p0i + m.Br * p1r - m.Bi * p1i;
                        double n0i = m.Ar * p0i + m.Ai * p0r + m.Br * p1i + m.Bi * p1r;
                        double n1r = m.Cr * p0r - m.Ci * p0i + m.Dr * p1r - m.Di * p1i;
                        double n1i = m.Cr * p0i + m.Ci * p0r + m.Dr * p1i + m.Di * p1r;
                        p0r = n0r; p0i = n0i; p1r = n1r; p1i = n1i;
                        n0r = m.Ar * l0r - m.Ai * l0i + m.Br * l1r - m.Bi * l1i;
                        n0i = m.Ar * l0i + m.Ai * l0r + m.Br * l1i + m.Bi * l1r;
                        n1r = m.Cr * l0r - m.Ci * l0i + m.Dr * l1r - m.Di * l1i;
                        n1i = m.Cr * l0i + m.Ci * l0r + m.Dr * l1i + m.Di * l1r;
                        l0r = n0r; l0i = n0i; l1r = n1r; l1i = n1i;
                    }
                    pr[i0] = p0r; pi[i0] = p0i; pr[i1] = p1r; pi[i1] = p1i;
                    lr[i0] = l0r; li[i0] = l0i; lr[i1] = l1r; li[i1] = l1i;
                }
        }
    }

    /// <summary>Vector256 version of <see cref="StepRun"/> for strides of at least 4 (four pairs per step; lanes summed in a fixed order).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void StepRunVector(double* pr, double* pi, double* lr, double* li, long dim, long stride, int count, char* md, Mat2* inv, double* ac)
    {
        Span<Vector256<double>> vacc = stackalloc Vector256<double>[16];
        vacc[..count].Clear();
        for (long bas = 0; bas < dim; bas += 2 * stride)
            for (long i0 = bas; i0 < bas + stride; i0 += 4)
            {
                long i1 = i0 + stride;
                var p0r = Vector256.Load(pr + i0); var p0i = Vector256.Load(pi + i0);
                var p1r = Vector256.Load(pr + i1); var p1i = Vector256.Load(pi + i1);
                var l0r = Vector256.Load(lr + i0); var l0i = Vector256.Load(li + i0);
                var l1r = Vector256.Load(lr + i1); var l1i = Vector256.Load(li + i1);
                for (int e = 0; e < count; e++)
                {
                    switch (md[e])
                    {
                        case 'Z': vacc[e] += (l0r * p0i - l0i * p0r) - (l1r * p1i - l1i * p1r); break;
                        case 'X': vacc[e] += (l0r * p1i - l0i * p1r) + (l1r * p0i - l1i * p0r); break;
                        case 'Y': vacc[e] += (l1r * p0r + l1i * p0i) - (l0r * p1r + l0i * p1i); break;
                        case 'P': vacc[e] += Vector256.Create(-2.0) * (l1r * p1i - l1i * p1r); break;
                    }
                    ref readonly Mat2 m = ref inv[e];
                    if (m.IsDiagonal)
                    {
                        // diag(a, d): four real products per amplitude pair and state
                        var ar = Vector256.Create(m.Ar); var ai = Vector256.Create(m.Ai);
                        var dr = Vector256.Create(m.Dr); var di = Vector256.Create(m.Di);
                        (p0r, p0i) = (ar * p0r - ai * p0i, ar * p0i + ai * p0r);
                        (p1r, p1i) = (dr * p1r - di * p1i, dr * p1i + di * p1r);
                        (l0r, l0i) = (ar * l0r - ai * l0i, ar * l0i + ai * l0r);
                        (l1r, l1i) = (dr * l1r - di * l1i, dr * l1i + di * l1r);
                        continue;
                    }
                    if (m.Ai == 0 && m.Bi == 0 && m.Ci == 0 && m.Di == 0)
                    {
                        // real matrix (RY and friends)
                        var ar = Vector256.Create(m.Ar); var br = Vector256.Create(m.Br);
                        var cr = Vector256.Create(m.Cr); var dr = Vector256.Create(m.Dr);
                        (p0r, p1r) = (ar * p0r + br * p1r, cr * p0r + dr * p1r);
                        (p0i, p1i) = (ar * p0i + br * p1i, cr * p0i + dr * p1i);
                        (l0r, l1r) = (ar * l0r + br * l1r, cr * l0r + dr * l1r);
                        (l0i, l1i) = (ar * l0i + br * l1i, cr * l0i + dr * l1i);
                        continue;
                    }
                    {
                    var ar = Vector256.Create(m.Ar); var ai = Vector256.Create(m.Ai);
                    var br = Vector256.Create(m.Br); var bi = Vector256.Create(m.Bi);
                    var cr = Vector256.Create(m.Cr); var ci = Vector256.Create(m.Ci);
                    var dr = Vector256.Create(m.Dr); var di = Vector256.Create(m.Di);
                    var n0r = ar * p0r - ai * p0i + br * p1r - bi * p1i;
                    var n0i = ar * p0i + ai * p0r + br * p1i + bi * p1r;
                    var n1r = cr * p0r - ci * p0i + dr * p1r - di * p1i;
                    var n1i = cr * p0i + ci * p0r + dr * p1i + di * p1r;
                    p0r = n0r; p0i = n0i; p1r = n1r; p1i = n1i;
                    n0r = ar * l0r - ai * l0i + br * l1r - bi * l1i;
                    n0i = ar * l0i + ai * l0r + br * l1i + bi * l1r;
                    n1r = cr * l0r - ci * l0i + dr * l1r - di * l1i;
                    n1i = cr * l0i + ci * l0r + dr * l1i + di * l1r;
                    l0r = n0r; l0i = n0i; l1r = n1r; l1i = n1i;
                    }
                }
                p0r.Store(pr + i0); p0i.Store(pi + i0); p1r.Store(pr + i1); p1i.Store(pi + i1);
                l0r.Store(lr + i0); l0i.Store(li + i0); l1r.Store(lr + i1); l1i.Store(li + i1);
            }
        for (int e = 0; e < count; e++)
        {
            var v = vacc[e];
            ac[e] = (v.GetElement(0) + v.GetElement(1)) + (v.GetElement(2) + v.GetElement(3));
        }
    }

    /// <summary>Lane layout of amplitude pairs inside one Vector256 of four consecutive amplitudes, for q = 0 or q = 1.</summary>
    private interface ILane
    {
        /// <summary>Swaps the two members of every pair.</summary>
        static abstract Vector256<double> Swap(Vector256<double> v);
        /// <summary>1 where the lane holds the q = 0 member, 0 where it holds the q = 1 member.</summary>
        static abstract Vector256<double> IsZero { get; }
    }

    private struct Lane0 : ILane
    {
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public static Vector256<double> Swap(Vector256<double> v) => Vector256.Shuffle(v, Vector256.Create(1L, 0L, 3L, 2L));
        public static Vector256<double> IsZero => Vector256.Create(1.0, 0.0, 1.0, 0.0);
    }

    private struct Lane1 : ILane
    {
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public static Vector256<double> Swap(Vector256<double> v) => Vector256.Shuffle(v, Vector256.Create(2L, 3L, 0L, 1L));
        public static Vector256<double> IsZero => Vector256.Create(1.0, 1.0, 0.0, 0.0);
    }

    /// <summary>
    /// <see cref="StepRun"/> for q = 0 or 1: each Vector256 holds two whole pairs. With s the pair-swapped vector,
    /// U x = M1·x + M2·s where M1 = (A on q=0 lanes, D on q=1 lanes) and M2 = (B, C); terms are lane-masked sums.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void StepRunLow<L>(double* pr, double* pi, double* lr, double* li, long dim, int count, char* md, Mat2* inv, double* ac) where L : struct, ILane
    {
        Span<Vector256<double>> vacc = stackalloc Vector256<double>[16];
        vacc[..count].Clear();
        var z = L.IsZero;
        var one = Vector256<double>.One;
        var o = one - z;                      // 1 on q = 1 lanes
        var zSign = z - o;                    // +1 / −1
        for (long i = 0; i < dim; i += 4)
        {
            var xr = Vector256.Load(pr + i); var xi = Vector256.Load(pi + i);
            var yr = Vector256.Load(lr + i); var yi = Vector256.Load(li + i);
            for (int e = 0; e < count; e++)
            {
                switch (md[e])
                {
                    case 'Z': vacc[e] += zSign * (yr * xi - yi * xr); break;
                    case 'X': { var sr = L.Swap(xr); var si = L.Swap(xi); vacc[e] += yr * si - yi * sr; break; }
                    case 'Y': { var sr = L.Swap(xr); var si = L.Swap(xi); vacc[e] -= zSign * (yr * sr + yi * si); break; }
                    case 'P': vacc[e] += Vector256.Create(-2.0) * o * (yr * xi - yi * xr); break;
                }
                ref readonly Mat2 m = ref inv[e];
                var m1r = z * Vector256.Create(m.Ar) + o * Vector256.Create(m.Dr);
                var m1i = z * Vector256.Create(m.Ai) + o * Vector256.Create(m.Di);
                if (m.IsDiagonal)
                {
                    (xr, xi) = (m1r * xr - m1i * xi, m1r * xi + m1i * xr);
                    (yr, yi) = (m1r * yr - m1i * yi, m1r * yi + m1i * yr);
                    continue;
                }
                var m2r = z * Vector256.Create(m.Br) + o * Vector256.Create(m.Cr);
                var m2i = z * Vector256.Create(m.Bi) + o * Vector256.Create(m.Ci);
                var sxr = L.Swap(xr); var sxi = L.Swap(xi);
                var syr = L.Swap(yr); var syi = L.Swap(yi);
                (xr, xi) = (m1r * xr - m1i * xi + m2r * sxr - m2i * sxi, m1r * xi + m1i * xr + m2r * sxi + m2i * sxr);
                (yr, yi) = (m1r * yr - m1i * yi + m2r * syr - m2i * syi, m1r * yi + m1i * yr + m2r * syi + m2i * syr);
            }
            xr.Store(pr + i); xi.Store(pi + i);
            yr.Store(lr + i); yi.Store(li + i);
        }
        for (int e = 0; e < count; e++)
        {
            var v = vacc[e];
            ac[e] = (v.GetElement(0) + v.GetElement(1)) + (v.GetElement(2) + v.GetElement(3));
        }
    }
}
