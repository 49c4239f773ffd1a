using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Encodings;

/// <summary>
/// Amplitude encoding by the real state-preparation circuit of Möttönen et al. (2004): features padded to
/// 2^n and normalised become the amplitudes of |ψ⟩ (qubit 0 = least significant index bit). Uses 2^n − 1 RY
/// and 2^n − 2 CNOT gates, so resource counts are those of a real device.
/// </summary>
public static class AmplitudeEncoding
{
    /// <summary>Qubits needed for the given number of features: ⌈log2(features)⌉ (at least 1).</summary>
    public static int QubitsFor(int features)
    {
        if (features < 1) throw new ArgumentOutOfRangeException(nameof(features), features, "need at least one feature");
        int n = 1;
        while ((1 << n) < features) n++;
        return n;
    }

    /// <summary>Appends the preparation on qubits 0..n−1 (n = ⌈log2 inputCount⌉, must fit the builder); returns the map.</summary>
    public static AmplitudeAngleMap Append(CircuitBuilder b, int inputCount, Action<string>? warning = null)
    {
        ArgumentNullException.ThrowIfNull(b);
        int n = QubitsFor(inputCount);
        if (n > b.Qubits)
            throw new ArgumentException($"amplitude encoding of {inputCount} features needs {n} qubits, the circuit has {b.Qubits}", nameof(inputCount));
        var map = new AmplitudeAngleMap(n, inputCount, warning);
        int m = b.AddInputMap(map);
        for (int t = n - 1; t >= 0; t--)
        {
            int k = n - 1 - t, count = 1 << k, off = map.LevelOffset(t);
            for (int i = 0; i < count; i++)
            {
                b.RY(t, Angle.Mapped(m, off + i));
                if (k == 0) continue;
                int g = i ^ (i >> 1), g2 = ((i + 1) % count) ^ (((i + 1) % count) >> 1);
                int bit = System.Numerics.BitOperations.TrailingZeroCount(g ^ g2);
                b.CNOT(t + 1 + bit, t);
            }
        }
        return map;
    }

    /// <summary>Warnings for one input row (tiny norm, mostly zeros), without building anything.</summary>
    public static IReadOnlyList<string> Inspect(ReadOnlySpan<double> features, double tinyNorm = 1e-8)
    {
        var list = new List<string>();
        double ss = 0; int zeros = 0;
        foreach (double x in features) { ss += x * x; if (x == 0) zeros++; }
        double norm = Math.Sqrt(ss);
        if (norm == 0) list.Add("input norm is 0: amplitude encoding is undefined");
        else if (norm < tinyNorm) list.Add($"input norm {norm:E3} is below {tinyNorm:E1}");
        if (2 * zeros > features.Length) list.Add($"{zeros} of {features.Length} features are zero");
        return list;
    }
}
