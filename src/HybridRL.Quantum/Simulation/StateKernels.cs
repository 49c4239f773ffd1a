using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// In-place gate kernels on a state stored as separate real and imaginary arrays of length 2^bits
/// (bit q of an index is qubit q). Single-qubit kernels touch each amplitude once; diagonal kernels
/// touch only the amplitudes they change. Work is split over threads only for large registers, with
/// each amplitude computed by the same arithmetic whatever the split, so results do not depend on
/// the thread count.
/// </summary>
internal static unsafe class StateKernels
{
    /// <summary>Registers of at least this many bits are split over threads (when more than one is allowed).</summary>
    public const int ParallelBits = 14;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static long InsertZero(long k, int q) => ((k >> q) << (q + 1)) | (k & ((1L << q) - 1));

    private static int Parts(int bits, int threads) => threads > 1 && bits >= ParallelBits ? threads : 1;

    /// <summary>Runs body over [0, count) in <paramref name="parts"/> contiguous, fixed pieces.</summary>
    private static void Split(long count, int parts, Action<long, long> body)
    {
        if (parts <= 1) { body(0, count); return; }
        Parallel.For(0, parts, new ParallelOptions { MaxDegreeOfParallelism = parts }, p =>
        {
            long a = count * p / parts, b = count * (p + 1) / parts;
            body(a, b);
        });
    }

    // ---------------- general single-qubit gate ----------------

    public static void Apply1(double[] re, double[] im, int bits, int q, in Mat2 m, int threads = 1)
    {
        long pairs = 1L << (bits - 1);
        int parts = Parts(bits, threads);
        if (parts == 1) { fixed (double* r = re, i = im) Apply1Range(r, i, q, m, 0, pairs); return; }
        Apply1Parallel(re, im, q, m, pairs, parts);
    }

    private static void Apply1Parallel(double[] re, double[] im, int q, Mat2 m, long pairs, int parts) =>
        Split(pairs, parts, (a, b) => { fixed (double* r = re, i = im) Apply1Range(r, i, q, m, a, b); });

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Apply1Range(double* re, double* im, int q, in Mat2 m, long k0, long k1)
    {
        long stride = 1L << q;
        double ar = m.Ar, ai = m.Ai, br = m.Br, bi = m.Bi, cr = m.Cr, ci = m.Ci, dr = m.Dr, di = m.Di;
        if ((stride < 4 || !Vector256.IsHardwareAccelerated) && k0 == 0 && (k1 & (stride - 1)) == 0)
        {
            long end = 2 * k1;
            for (long bas = 0; bas < end; bas += 2 * stride)
                for (long i0 = bas; i0 < bas + stride; i0++)
                {
                    long i1 = i0 + stride;
                    double x0r = re[i0], x0i = im[i0], x1r = re[i1], x1i = im[i1];
                    re[i0] = ar * x0r - ai * x0i + br * x1r - bi * x1i;
                    im[i0] = ar * x0i + ai * x0r + br * x1i + bi * x1r;
                    re[i1] = cr * x0r - ci * x0i + dr * x1r - di * x1i;
                    im[i1] = cr * x0i + ci * x0r + dr * x1i + di * x1r;
                }
            return;
        }
        if (stride < 4 || !Vector256.IsHardwareAccelerated)
        {
            for (long k = k0; k < k1; k++)
            {
                long i0 = InsertZero(k, q), i1 = i0 | stride;
                double x0r = re[i0], x0i = im[i0], x1r = re[i1], x1i = im[i1];
                re[i0] = ar * x0r - ai * x0i + br * x1r - bi * x1i;
                im[i0] = ar * x0i + ai * x0r + br * x1i + bi * x1r;
                re[i1] = cr * x0r - ci * x0i + dr * x1r - di * x1i;
                im[i1] = cr * x0i + ci * x0r + dr * x1i + di * x1r;
            }
            return;
        }
        var vAr = Vector256.Create(ar); var vAi = Vector256.Create(ai);
        var vBr = Vector256.Create(br); var vBi = Vector256.Create(bi);
        var vCr = Vector256.Create(cr); var vCi = Vector256.Create(ci);
        var vDr = Vector256.Create(dr); var vDi = Vector256.Create(di);
        long kk = k0;
        while (kk < k1)
        {
            long low = kk & (stride - 1);
            long run = Math.Min(stride - low, k1 - kk);
            long i0 = InsertZero(kk, q);
            double* r0 = re + i0, m0 = im + i0, r1 = r0 + stride, m1 = m0 + stride;
            long j = 0;
            for (; j + 4 <= run; j += 4)
            {
                var x0r = Vector256.Load(r0 + j); var x0i = Vector256.Load(m0 + j);
                var x1r = Vector256.Load(r1 + j); var x1i = Vector256.Load(m1 + j);
                (vAr * x0r - vAi * x0i + vBr * x1r - vBi * x1i).Store(r0 + j);
                (vAr * x0i + vAi * x0r + vBr * x1i + vBi * x1r).Store(m0 + j);
                (vCr * x0r - vCi * x0i + vDr * x1r - vDi * x1i).Store(r1 + j);
                (vCr * x0i + vCi * x0r + vDr * x1i + vDi * x1r).Store(m1 + j);
            }
            for (; j < run; j++)
            {
                double x0r = r0[j], x0i = m0[j], x1r = r1[j], x1i = m1[j];
                r0[j] = ar * x0r - ai * x0i + br * x1r - bi * x1i;
                m0[j] = ar * x0i + ai * x0r + br * x1i + bi * x1r;
                r1[j] = cr * x0r - ci * x0i + dr * x1r - di * x1i;
                m1[j] = cr * x0i + ci * x0r + dr * x1i + di * x1r;
            }
            kk += run;
        }
    }

    // ---------------- diagonal single-qubit gate ----------------

    /// <summary>Multiplies amplitudes with qubit q = 0 by d0 and with q = 1 by d1; skips the half whose factor is exactly 1.</summary>
    public static void ApplyDiag1(double[] re, double[] im, int bits, int q, double d0r, double d0i, double d1r, double d1i, int threads = 1)
    {
        bool skip0 = d0r == 1 && d0i == 0, skip1 = d1r == 1 && d1i == 0;
        if (skip0 && skip1) return;
        long pairs = 1L << (bits - 1);
        int parts = Parts(bits, threads);
        if (parts == 1) { fixed (double* r = re, i = im) DiagRange(r, i, q, d0r, d0i, d1r, d1i, skip0, skip1, 0, pairs); return; }
        DiagParallel(re, im, q, d0r, d0i, d1r, d1i, skip0, skip1, pairs, parts);
    }

    private static void DiagParallel(double[] re, double[] im, int q, double d0r, double d0i, double d1r, double d1i, bool skip0, bool skip1, long pairs, int parts) =>
        Split(pairs, parts, (a, b) => { fixed (double* r = re, i = im) DiagRange(r, i, q, d0r, d0i, d1r, d1i, skip0, skip1, a, b); });

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void DiagRange(double* re, double* im, int q, double d0r, double d0i, double d1r, double d1i, bool skip0, bool skip1, long k0, long k1)
    {
        long stride = 1L << q;
        long kk = k0;
        while (kk < k1)
        {
            long low = kk & (stride - 1);
            long run = Math.Min(stride - low, k1 - kk);
            long i0 = InsertZero(kk, q);
            if (!skip0) ScaleRun(re + i0, im + i0, run, d0r, d0i);
            if (!skip1) ScaleRun(re + i0 + stride, im + i0 + stride, run, d1r, d1i);
            kk += run;
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void ScaleRun(double* r, double* m, long n, double cr, double ci)
    {
        long j = 0;
        if (Vector256.IsHardwareAccelerated && n >= 4)
        {
            var vr = Vector256.Create(cr); var vi = Vector256.Create(ci);
            for (; j + 4 <= n; j += 4)
            {
                var xr = Vector256.Load(r + j); var xi = Vector256.Load(m + j);
                (vr * xr - vi * xi).Store(r + j);
                (vr * xi + vi * xr).Store(m + j);
            }
        }
        for (; j < n; j++)
        {
            double xr = r[j], xi = m[j];
            r[j] = cr * xr - ci * xi;
            m[j] = cr * xi + ci * xr;
        }
    }

    // ---------------- two-qubit gates ----------------

    /// <summary>Applies m to the target when the control qubit is 1 (CNOT, controlled rotations).</summary>
    public static void ApplyControlled1(double[] re, double[] im, int bits, int control, int target, in Mat2 m, int threads = 1)
    {
        long quads = 1L << (bits - 2);
        int parts = Parts(bits, threads);
        if (parts == 1) { fixed (double* r = re, i = im) ControlledRange(r, i, control, target, m, 0, quads); return; }
        ControlledParallel(re, im, control, target, m, quads, parts);
    }

    private static void ControlledParallel(double[] re, double[] im, int control, int target, Mat2 m, long quads, int parts) =>
        Split(quads, parts, (a, b) => { fixed (double* r = re, i = im) ControlledRange(r, i, control, target, m, a, b); });

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void ControlledRange(double* re, double* im, int c, int t, in Mat2 m, long k0, long k1)
    {
        int lo = Math.Min(c, t), hi = Math.Max(c, t);
        long cb = 1L << c, tb = 1L << t;
        double ar = m.Ar, ai = m.Ai, br = m.Br, bi = m.Bi, cr = m.Cr, ci = m.Ci, dr = m.Dr, di = m.Di;
        for (long k = k0; k < k1; k++)
        {
            long i0 = InsertZero(InsertZero(k, lo), hi) | cb, i1 = i0 | tb;
            double x0r = re[i0], x0i = im[i0], x1r = re[i1], x1i = im[i1];
            re[i0] = ar * x0r - ai * x0i + br * x1r - bi * x1i;
            im[i0] = ar * x0i + ai * x0r + br * x1i + bi * x1r;
            re[i1] = cr * x0r - ci * x0i + dr * x1r - di * x1i;
            im[i1] = cr * x0i + ci * x0r + dr * x1i + di * x1r;
        }
    }

    public static void ApplyCnot(double[] re, double[] im, int bits, int control, int target, int threads = 1)
    {
        long quads = 1L << (bits - 2);
        int parts = Parts(bits, threads);
        if (parts == 1) { fixed (double* r = re, i = im) CnotRange(r, i, control, target, 0, quads); return; }
        CnotParallel(re, im, control, target, quads, parts);
    }

    private static void CnotParallel(double[] re, double[] im, int control, int target, long quads, int parts) =>
        Split(quads, parts, (a, b) => { fixed (double* r = re, i = im) CnotRange(r, i, control, target, a, b); });

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void CnotRange(double* re, double* im, int c, int t, long k0, long k1)
    {
        int lo = Math.Min(c, t), hi = Math.Max(c, t);
        long cb = 1L << c, tb = 1L << t;
        for (long k = k0; k < k1; k++)
        {
            long i0 = InsertZero(InsertZero(k, lo), hi) | cb, i1 = i0 | tb;
            (re[i0], re[i1]) = (re[i1], re[i0]);
            (im[i0], im[i1]) = (im[i1], im[i0]);
        }
    }

    public static void ApplyCz(double[] re, double[] im, int bits, int a, int b, int threads = 1)
    {
        long quads = 1L << (bits - 2);
        int parts = Parts(bits, threads);
        if (parts == 1) { fixed (double* r = re, i = im) CzRange(r, i, a, b, 0, quads); return; }
        CzParallel(re, im, a, b, quads, parts);
    }

    private static void CzParallel(double[] re, double[] im, int a, int b, long quads, int parts) =>
        Split(quads, parts, (x, y) => { fixed (double* r = re, i = im) CzRange(r, i, a, b, x, y); });

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void CzRange(double* re, double* im, int a, int b, long k0, long k1)
    {
        int lo = Math.Min(a, b), hi = Math.Max(a, b);
        long both = (1L << a) | (1L << b);
        for (long k = k0; k < k1; k++)
        {
            long i = InsertZero(InsertZero(k, lo), hi) | both;
            re[i] = -re[i];
            im[i] = -im[i];
        }
    }

    public static void ApplySwap(double[] re, double[] im, int bits, int a, int b, int threads = 1)
    {
        long quads = 1L << (bits - 2);
        int parts = Parts(bits, threads);
        if (parts == 1) { fixed (double* r = re, i = im) SwapRange(r, i, a, b, 0, quads); return; }
        SwapParallel(re, im, a, b, quads, parts);
    }

    private static void SwapParallel(double[] re, double[] im, int a, int b, long quads, int parts) =>
        Split(quads, parts, (x, y) => { fixed (double* r = re, i = im) SwapRange(r, i, a, b, x, y); });

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void SwapRange(double* re, double* im, int a, int b, long k0, long k1)
    {
        int lo = Math.Min(a, b), hi = Math.Max(a, b);
        long ab = 1L << a, bb = 1L << b;
        for (long k = k0; k < k1; k++)
        {
            long bas = InsertZero(InsertZero(k, lo), hi);
            long i0 = bas | ab, i1 = bas | bb;
            (re[i0], re[i1]) = (re[i1], re[i0]);
            (im[i0], im[i1]) = (im[i1], im[i0]);
        }
    }

    /// <summary>CNOT on two states at once (ψ and λ of the adjoint sweep), single-threaded.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void ApplyCnotBoth(double[] re, double[] im, double[] re2, double[] im2, int bits, int c, int t)
    {
        int lo = Math.Min(c, t), hi = Math.Max(c, t);
        long cb = 1L << c, tb = 1L << t, quads = 1L << (bits - 2);
        fixed (double* r = re, m = im, r2 = re2, m2 = im2)
            for (long k = 0; k < quads; k++)
            {
                long i0 = InsertZero(InsertZero(k, lo), hi) | cb, i1 = i0 | tb;
                (r[i0], r[i1]) = (r[i1], r[i0]);
                (m[i0], m[i1]) = (m[i1], m[i0]);
                (r2[i0], r2[i1]) = (r2[i1], r2[i0]);
                (m2[i0], m2[i1]) = (m2[i1], m2[i0]);
            }
    }

    /// <summary>CZ on two states at once, single-threaded.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void ApplyCzBoth(double[] re, double[] im, double[] re2, double[] im2, int bits, int a, int b)
    {
        int lo = Math.Min(a, b), hi = Math.Max(a, b);
        long both = (1L << a) | (1L << b), quads = 1L << (bits - 2);
        fixed (double* r = re, m = im, r2 = re2, m2 = im2)
            for (long k = 0; k < quads; k++)
            {
                long i = InsertZero(InsertZero(k, lo), hi) | both;
                r[i] = -r[i]; m[i] = -m[i]; r2[i] = -r2[i]; m2[i] = -m2[i];
            }
    }

    // ---------------- dense k-bit operator (noise superoperators) ----------------

    /// <summary>
    /// Applies a dense 2^k × 2^k complex matrix (row-major, separate re/im) to the listed bits
    /// (bits[0] is the least significant bit of the local index). Used for noise superoperators.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void ApplyDense(double[] re, double[] im, int bits, ReadOnlySpan<int> targets, ReadOnlySpan<double> mre, ReadOnlySpan<double> mim, Span<double> scratch)
    {
        if (targets.Length == 2) { ApplyDense2(re, im, bits, targets[0], targets[1], mre, mim); return; }
        int k = targets.Length, d = 1 << k;
        Span<long> offs = stackalloc long[16];
        Span<int> sorted = stackalloc int[4];
        targets.CopyTo(sorted);
        sorted[..k].Sort();
        for (int l = 0; l < d; l++)
        {
            long o = 0;
            for (int b = 0; b < k; b++) if (((l >> b) & 1) != 0) o |= 1L << targets[b];
            offs[l] = o;
        }
        var xr = scratch[..d]; var xi = scratch.Slice(d, d);
        long bases = 1L << (bits - k);
        for (long kk = 0; kk < bases; kk++)
        {
            long bas = kk;
            for (int b = 0; b < k; b++) bas = InsertZero(bas, sorted[b]);
            for (int l = 0; l < d; l++) { xr[l] = re[bas + offs[l]]; xi[l] = im[bas + offs[l]]; }
            for (int r = 0; r < d; r++)
            {
                double sr = 0, si = 0;
                int row = r * d;
                for (int c = 0; c < d; c++)
                {
                    double a = mre[row + c], b = mim[row + c];
                    if (a == 0 && b == 0) continue;
                    sr += a * xr[c] - b * xi[c];
                    si += a * xi[c] + b * xr[c];
                }
                re[bas + offs[r]] = sr;
                im[bas + offs[r]] = si;
            }
        }
    }

    /// <summary>Dense 4×4 complex matrix on bits (b0, b1), local index = bit b0 + 2·bit b1 (single-qubit channel superoperators).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void ApplyDense2(double[] re, double[] im, int bits, int b0, int b1, ReadOnlySpan<double> mre, ReadOnlySpan<double> mim)
    {
        int lo = Math.Min(b0, b1), hi = Math.Max(b0, b1);
        long o1 = 1L << b0, o2 = 1L << b1, o3 = o1 | o2;
        Span<double> mr = stackalloc double[16];
        Span<double> mi = stackalloc double[16];
        mre[..16].CopyTo(mr);
        mim[..16].CopyTo(mi);
        bool real = true;
        for (int j = 0; j < 16; j++) if (mi[j] != 0) { real = false; break; }
        long quads = 1L << (bits - 2);
        fixed (double* r = re, m = im)
        {
            for (long k = 0; k < quads; k++)
            {
                long i0 = InsertZero(InsertZero(k, lo), hi);
                long i1 = i0 | o1, i2 = i0 | o2, i3 = i0 | o3;
                double x0r = r[i0], x1r = r[i1], x2r = r[i2], x3r = r[i3];
                double x0i = m[i0], x1i = m[i1], x2i = m[i2], x3i = m[i3];
                if (real)
                {
                    r[i0] = mr[0] * x0r + mr[1] * x1r + mr[2] * x2r + mr[3] * x3r;
                    m[i0] = mr[0] * x0i + mr[1] * x1i + mr[2] * x2i + mr[3] * x3i;
                    r[i1] = mr[4] * x0r + mr[5] * x1r + mr[6] * x2r + mr[7] * x3r;
                    m[i1] = mr[4] * x0i + mr[5] * x1i + mr[6] * x2i + mr[7] * x3i;
                    r[i2] = mr[8] * x0r + mr[9] * x1r + mr[10] * x2r + mr[11] * x3r;
                    m[i2] = mr[8] * x0i + mr[9] * x1i + mr[10] * x2i + mr[11] * x3i;
                    r[i3] = mr[12] * x0r + mr[13] * x1r + mr[14] * x2r + mr[15] * x3r;
                    m[i3] = mr[12] * x0i + mr[13] * x1i + mr[14] * x2i + mr[15] * x3i;
                    continue;
                }
                for (int row = 0; row < 4; row++)
                {
                    int a = 4 * row;
                    double sr = mr[a] * x0r - mi[a] * x0i + mr[a + 1] * x1r - mi[a + 1] * x1i + mr[a + 2] * x2r - mi[a + 2] * x2i + mr[a + 3] * x3r - mi[a + 3] * x3i;
                    double si = mr[a] * x0i + mi[a] * x0r + mr[a + 1] * x1i + mi[a + 1] * x1r + mr[a + 2] * x2i + mi[a + 2] * x2r + mr[a + 3] * x3i + mi[a + 3] * x3r;
                    long idx = row switch { 0 => i0, 1 => i1, 2 => i2, _ => i3 };
                    r[idx] = sr; m[idx] = si;
                }
            }
        }
    }

    // ---------------- Pauli strings ----------------

    /// <summary>i^{nY}: the phase of P = i^{nY} X^x Z^z for a Pauli string with nY factors Y.</summary>
    public static (double re, double im) YPhase(int yCount) => (yCount & 3) switch
    {
        0 => (1, 0), 1 => (0, 1), 2 => (-1, 0), _ => (0, -1),
    };

    /// <summary>
    /// ⟨a|P|b⟩ for P = i^{nY} X^xMask Z^zMask, summed in a fixed order
    /// (P|j⟩ = i^{nY} (−1)^{|j∧z|} |j⊕x⟩).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static (double re, double im) PauliInner(ReadOnlySpan<double> aRe, ReadOnlySpan<double> aIm, ReadOnlySpan<double> bRe, ReadOnlySpan<double> bIm, ulong xMask, ulong zMask)
    {
        long n = bRe.Length;
        double sr = 0, si = 0;
        long x = (long)xMask, z = (long)zMask;
        for (long j = 0; j < n; j++)
        {
            long t = j ^ x;
            double sgn = (System.Numerics.BitOperations.PopCount((ulong)(j & z)) & 1) == 0 ? 1.0 : -1.0;
            // conj(a_t) * b_j
            double pr = aRe[(int)t] * bRe[(int)j] + aIm[(int)t] * bIm[(int)j];
            double pi = aRe[(int)t] * bIm[(int)j] - aIm[(int)t] * bRe[(int)j];
            sr += sgn * pr;
            si += sgn * pi;
        }
        var (yr, yi) = YPhase(System.Numerics.BitOperations.PopCount(xMask & zMask));
        return (yr * sr - yi * si, yr * si + yi * sr);
    }

    /// <summary>Σ_j |ψ_j|² (−1)^{|j∧z|}: expectation of a Z string.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static double ZExpectation(ReadOnlySpan<double> re, ReadOnlySpan<double> im, ulong zMask)
    {
        double s = 0;
        long z = (long)zMask;
        for (int j = 0; j < re.Length; j++)
        {
            double p = re[j] * re[j] + im[j] * im[j];
            s += (System.Numerics.BitOperations.PopCount((ulong)(j & z)) & 1) == 0 ? p : -p;
        }
        return s;
    }

    /// <summary>dst += c · P src for P = i^{nY} X^x Z^z (c complex).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void AddPauli(Span<double> dRe, Span<double> dIm, ReadOnlySpan<double> sRe, ReadOnlySpan<double> sIm, ulong xMask, ulong zMask, double cr, double ci)
    {
        var (yr, yi) = YPhase(System.Numerics.BitOperations.PopCount(xMask & zMask));
        double fr = cr * yr - ci * yi, fi = cr * yi + ci * yr;
        long x = (long)xMask, z = (long)zMask;
        for (int j = 0; j < sRe.Length; j++)
        {
            int t = (int)(j ^ x);
            double sgn = (System.Numerics.BitOperations.PopCount((ulong)(j & z)) & 1) == 0 ? 1.0 : -1.0;
            double vr = sgn * sRe[j], vi = sgn * sIm[j];
            dRe[t] += fr * vr - fi * vi;
            dIm[t] += fr * vi + fi * vr;
        }
    }

    /// <summary>
    /// ⟨a| (Π_control ⊗ P_q) |b⟩ for a single-qubit Pauli P ∈ {X, Y, Z} on qubit q, restricted to indices with
    /// all bits of <paramref name="controlMask"/> set (0 for no control).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static (double re, double im) Pauli1Inner(ReadOnlySpan<double> aRe, ReadOnlySpan<double> aIm, ReadOnlySpan<double> bRe, ReadOnlySpan<double> bIm, int q, char pauli, long controlMask)
    {
        double sr = 0, si = 0;
        long qb = 1L << q;
        int n = bRe.Length;
        for (int j = 0; j < n; j++)
        {
            if ((j & controlMask) != controlMask) continue;
            // (P b)_j
            double vr, vi;
            bool one = (j & qb) != 0;
            switch (pauli)
            {
                case 'X': { int s = (int)(j ^ qb); vr = bRe[s]; vi = bIm[s]; break; }
                case 'Y':
                {
                    int s = (int)(j ^ qb);
                    // Y|0> = i|1>, Y|1> = -i|0>: (Yb)_j = i b_{j^q} if bit j is 1, -i b_{j^q} if 0.
                    if (one) { vr = -bIm[s]; vi = bRe[s]; } else { vr = bIm[s]; vi = -bRe[s]; }
                    break;
                }
                default: vr = one ? -bRe[j] : bRe[j]; vi = one ? -bIm[j] : bIm[j]; break;
            }
            sr += aRe[j] * vr + aIm[j] * vi;
            si += aRe[j] * vi - aIm[j] * vr;
        }
        return (sr, si);
    }

    /// <summary>⟨a| Π_{mask all set} |b⟩ (projector onto indices where every bit of mask is 1).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static (double re, double im) ProjectorInner(ReadOnlySpan<double> aRe, ReadOnlySpan<double> aIm, ReadOnlySpan<double> bRe, ReadOnlySpan<double> bIm, long mask)
    {
        double sr = 0, si = 0;
        for (int j = 0; j < bRe.Length; j++)
        {
            if ((j & mask) != mask) continue;
            sr += aRe[j] * bRe[j] + aIm[j] * bIm[j];
            si += aRe[j] * bIm[j] - aIm[j] * bRe[j];
        }
        return (sr, si);
    }
}
