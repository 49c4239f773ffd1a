using HybridRL.Quantum.Noise;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// Kraus operators of one channel at a fixed strength, as dense complex matrices on 1 or 2 qubits
/// (local index: first qubit is the least significant bit), plus the density-matrix superoperator
/// S = Σ_k K_k ⊗ conj(K_k) on bits (row bits…, column bits…).
/// </summary>
internal sealed class KrausSet
{
    public KrausSet(NoiseChannelKind kind, double p)
    {
        Kind = kind;
        Strength = p;
        var ops = new List<(double[] re, double[] im)>();
        switch (kind)
        {
            case NoiseChannelKind.Depolarizing:
                // (1−p)ρ + p·I/2 = (1 − 3p/4)ρ + (p/4)(XρX + YρY + ZρZ)   (Nielsen & Chuang eqs. 8.100–8.101)
                Qubits = 1;
                AddPauliProducts(ops, 1, 1 - 3 * p / 4, p / 4);
                break;
            case NoiseChannelKind.Depolarizing2:
                // (1−p)ρ + p·I/4 ⊗ Tr_pair ρ = (1 − 15p/16)ρ + (p/16) Σ_{P≠II} PρP  (two-qubit version of eq. 8.100)
                Qubits = 2;
                AddPauliProducts(ops, 2, 1 - 15 * p / 16, p / 16);
                break;
            case NoiseChannelKind.AmplitudeDamping:
                Qubits = 1;
                ops.Add(([1, 0, 0, Math.Sqrt(1 - p)], new double[4]));
                ops.Add(([0, Math.Sqrt(p), 0, 0], new double[4]));
                break;
            case NoiseChannelKind.PhaseDamping:
                Qubits = 1;
                ops.Add(([1, 0, 0, Math.Sqrt(1 - p)], new double[4]));
                ops.Add(([0, 0, 0, Math.Sqrt(p)], new double[4]));
                break;
            case NoiseChannelKind.BitFlip:
                Qubits = 1;
                ops.Add(([Math.Sqrt(1 - p), 0, 0, Math.Sqrt(1 - p)], new double[4]));
                ops.Add(([0, Math.Sqrt(p), Math.Sqrt(p), 0], new double[4]));
                break;
            case NoiseChannelKind.PhaseFlip:
                Qubits = 1;
                ops.Add(([Math.Sqrt(1 - p), 0, 0, Math.Sqrt(1 - p)], new double[4]));
                ops.Add(([Math.Sqrt(p), 0, 0, -Math.Sqrt(p)], new double[4]));
                break;
            default: throw new ArgumentOutOfRangeException(nameof(kind), kind, "unknown noise channel");
        }
        Operators = [.. ops];
        int d = 1 << Qubits, D = d * d;
        SuperRe = new double[D * D];
        SuperIm = new double[D * D];
        // S[(a + d·b), (a' + d·b')] = Σ_k K[a,a'] · conj(K[b,b'])
        foreach (var (kr, ki) in Operators)
            for (int a = 0; a < d; a++)
                for (int b = 0; b < d; b++)
                    for (int a2 = 0; a2 < d; a2++)
                        for (int b2 = 0; b2 < d; b2++)
                        {
                            double xr = kr[a * d + a2], xi = ki[a * d + a2];
                            double yr = kr[b * d + b2], yi = -ki[b * d + b2];
                            int r = a + d * b, c = a2 + d * b2;
                            SuperRe[r * D + c] += xr * yr - xi * yi;
                            SuperIm[r * D + c] += xr * yi + xi * yr;
                        }
        Mats = Qubits == 1 ? Operators.Select(o => new Mat2(o.re[0], o.im[0], o.re[1], o.im[1], o.re[2], o.im[2], o.re[3], o.im[3])).ToArray() : [];
        if (kind == NoiseChannelKind.Depolarizing2)
        {
            IdentityProbability = 1 - 15 * p / 16;
        }
    }

    private static void AddPauliProducts(List<(double[] re, double[] im)> ops, int qubits, double identityWeight, double otherWeight)
    {
        Mat2[] paulis = [Mat2.Identity, Mat2.X, Mat2.Y, Mat2.Z];
        int count = qubits == 1 ? 4 : 16;
        for (int idx = 0; idx < count; idx++)
        {
            double w = Math.Sqrt(idx == 0 ? identityWeight : otherWeight);
            if (qubits == 1)
            {
                var m = paulis[idx];
                ops.Add(([w * m.Ar, w * m.Br, w * m.Cr, w * m.Dr], [w * m.Ai, w * m.Bi, w * m.Ci, w * m.Di]));
            }
            else
            {
                // P = P_hi ⊗ P_lo on local index (lo bit = first qubit).
                var lo = paulis[idx & 3]; var hi = paulis[idx >> 2];
                var re = new double[16]; var im = new double[16];
                for (int r = 0; r < 4; r++)
                    for (int c = 0; c < 4; c++)
                    {
                        Get(lo, r & 1, c & 1, out double lr, out double li);
                        Get(hi, r >> 1, c >> 1, out double hr, out double hi2);
                        re[r * 4 + c] = w * (lr * hr - li * hi2);
                        im[r * 4 + c] = w * (lr * hi2 + li * hr);
                    }
                ops.Add((re, im));
            }
        }
    }

    internal static void Get(in Mat2 m, int r, int c, out double re, out double im)
    {
        (re, im) = (r, c) switch { (0, 0) => (m.Ar, m.Ai), (0, 1) => (m.Br, m.Bi), (1, 0) => (m.Cr, m.Ci), _ => (m.Dr, m.Di) };
    }

    public NoiseChannelKind Kind { get; }
    public double Strength { get; }
    public int Qubits { get; }
    public (double[] re, double[] im)[] Operators { get; }
    /// <summary>Single-qubit Kraus operators as 2×2 matrices (empty for two-qubit channels).</summary>
    public Mat2[] Mats { get; }
    public double[] SuperRe { get; }
    public double[] SuperIm { get; }
    /// <summary>Probability of no error for the mixed-unitary two-qubit depolarising channel.</summary>
    public double IdentityProbability { get; }
}
