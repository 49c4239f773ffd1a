using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Encodings;

/// <summary>
/// Angles of the Möttönen et al. (2004) real state preparation for an input row padded to 2^n and
/// normalised. For target qubit t (from n−1 down to 0) with the k = n−1−t higher qubits as controls, the
/// uniformly controlled rotation needs α_c = 2·atan2(‖block(c,1)‖, ‖block(c,0)‖) (signed amplitudes at
/// t = 0); it is realised by 2^k RY(θ_i) and CNOTs in Gray-code order, θ = (1/2^k)·Mᵀα with
/// M[c,i] = (−1)^{c·gray(i)}. The angles are scale-free, so normalisation needs no separate gradient.
/// </summary>
public sealed class AmplitudeAngleMap : IInputAngleMap
{
    [ThreadStatic] private static double[]? t_v, t_norm, t_alpha, t_galpha;
    private long _tinyNormRows, _mostlyZeroRows;

    public AmplitudeAngleMap(int qubits, int inputCount, Action<string>? warning = null, double tinyNorm = 1e-8)
    {
        if (qubits < 1 || qubits > Circuit.MaxQubits) throw new ArgumentOutOfRangeException(nameof(qubits), qubits, $"amplitude encoding needs 1..{Circuit.MaxQubits} qubits");
        if (inputCount < 1 || inputCount > (1 << qubits))
            throw new ArgumentOutOfRangeException(nameof(inputCount), inputCount, $"amplitude encoding on {qubits} qubits takes 1..{1 << qubits} features");
        Qubits = qubits;
        InputCount = inputCount;
        AngleCount = (1 << qubits) - 1;
        Warning = warning;
        TinyNorm = tinyNorm;
    }

    public string Name => "amplitude";
    public int Qubits { get; }
    public int InputCount { get; }
    public int AngleCount { get; }
    public bool IsDifferentiable => true;
    public Action<string>? Warning { get; }
    public double TinyNorm { get; }
    /// <summary>Rows seen whose norm was below <see cref="TinyNorm"/>.</summary>
    public long TinyNormRows => Interlocked.Read(ref _tinyNormRows);
    /// <summary>Rows seen with more than half of their features exactly zero.</summary>
    public long MostlyZeroRows => Interlocked.Read(ref _mostlyZeroRows);

    /// <summary>Offset of the angles for target qubit t within the output block.</summary>
    public int LevelOffset(int t) => (1 << (Qubits - 1 - t)) - 1;

    private static double[] Buf(ref double[]? b, int n) => b != null && b.Length >= n ? b : (b = new double[n]);

    public void Compute(ReadOnlySpan<double> inputs, Span<double> angles)
    {
        int n = Qubits, dim = 1 << n;
        var v = Buf(ref t_v, dim);
        double ss = 0;
        int zeros = 0;
        for (int j = 0; j < dim; j++)
        {
            double x = j < InputCount ? inputs[j] : 0;
            v[j] = x;
            ss += x * x;
            if (j < InputCount && x == 0) zeros++;
        }
        double norm = Math.Sqrt(ss);
        if (norm == 0) throw new ArgumentException("amplitude encoding of an all-zero input row is undefined (norm 0)");
        if (norm < TinyNorm && Interlocked.Increment(ref _tinyNormRows) == 1)
            Warning?.Invoke($"amplitude encoding: input norm {norm:E3} is below {TinyNorm:E1}; the normalised state is dominated by rounding");
        if (2 * zeros > InputCount && Interlocked.Increment(ref _mostlyZeroRows) == 1)
            Warning?.Invoke($"amplitude encoding: {zeros} of {InputCount} features are zero; most of the state carries no information");
        var alpha = Buf(ref t_alpha, dim);
        var blk = Buf(ref t_norm, dim);
        for (int j = 0; j < dim; j++) blk[j] = v[j] * v[j];
        // blk holds, for the current level, squared norms of blocks of size 2^t: blk[j] for block index j.
        for (int t = 0; t < n; t++)
        {
            int k = n - 1 - t, count = 1 << k;
            for (int c = 0; c < count; c++)
            {
                double x, y;
                if (t == 0) { x = v[2 * c]; y = v[2 * c + 1]; }
                else { x = Math.Sqrt(blk[2 * c]); y = Math.Sqrt(blk[2 * c + 1]); }
                alpha[c] = (x == 0 && y == 0) ? 0 : 2 * Math.Atan2(y, x);
            }
            var outLevel = angles.Slice(LevelOffset(t), count);
            for (int i = 0; i < count; i++)
            {
                int g = i ^ (i >> 1);
                double s = 0;
                for (int c = 0; c < count; c++)
                    s += (System.Numerics.BitOperations.PopCount((uint)(c & g)) & 1) == 0 ? alpha[c] : -alpha[c];
                outLevel[i] = s / count;
            }
            // Squared norms of the blocks one level up.
            for (int c = 0; c < count; c++) blk[c] = blk[2 * c] + blk[2 * c + 1];
        }
    }

    public void Backprop(ReadOnlySpan<double> inputs, ReadOnlySpan<double> gradAngles, Span<double> gradInputs)
    {
        int n = Qubits, dim = 1 << n;
        var v = Buf(ref t_v, dim);
        for (int j = 0; j < dim; j++) v[j] = j < InputCount ? inputs[j] : 0;
        var gal = Buf(ref t_galpha, dim);
        var blk = Buf(ref t_norm, dim);
        for (int t = 0; t < n; t++)
        {
            int k = n - 1 - t, count = 1 << k, size = 1 << t;
            var gLevel = gradAngles.Slice(LevelOffset(t), count);
            for (int c = 0; c < count; c++)
            {
                double s = 0;
                for (int i = 0; i < count; i++)
                {
                    int g = i ^ (i >> 1);
                    s += (System.Numerics.BitOperations.PopCount((uint)(c & g)) & 1) == 0 ? gLevel[i] : -gLevel[i];
                }
                gal[c] = s / count;
            }
            for (int c = 0; c < count; c++)
            {
                if (gal[c] == 0) continue;
                int start0 = (2 * c) * size, start1 = (2 * c + 1) * size;
                if (t == 0)
                {
                    double x = v[start0], y = v[start1], r2 = x * x + y * y;
                    if (r2 == 0) continue;
                    // α = 2 atan2(y, x): ∂α/∂x = −2y/r², ∂α/∂y = 2x/r².
                    if (start0 < InputCount) gradInputs[start0] += gal[c] * (-2 * y / r2);
                    if (start1 < InputCount) gradInputs[start1] += gal[c] * (2 * x / r2);
                    continue;
                }
                double s0 = 0, s1 = 0;
                for (int j = 0; j < size; j++) { s0 += v[start0 + j] * v[start0 + j]; s1 += v[start1 + j] * v[start1 + j]; }
                double xn = Math.Sqrt(s0), yn = Math.Sqrt(s1), rr = s0 + s1;
                if (rr == 0) continue;
                double dax = -2 * yn / rr, day = 2 * xn / rr;
                if (xn > 0)
                    for (int j = 0; j < size && start0 + j < InputCount; j++) gradInputs[start0 + j] += gal[c] * dax * v[start0 + j] / xn;
                if (yn > 0)
                    for (int j = 0; j < size && start1 + j < InputCount; j++) gradInputs[start1 + j] += gal[c] * day * v[start1 + j] / yn;
            }
        }
        _ = blk;
    }
}
