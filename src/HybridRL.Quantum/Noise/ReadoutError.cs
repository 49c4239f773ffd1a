namespace HybridRL.Quantum.Noise;

/// <summary>
/// Classical read-out confusion per qubit: P01[q] = P(read 1 | state 0), P10[q] = P(read 0 | state 1).
/// </summary>
public sealed class ReadoutError
{
    private readonly double[] _p01, _p10;

    public ReadoutError(IReadOnlyList<double> p01, IReadOnlyList<double> p10)
    {
        ArgumentNullException.ThrowIfNull(p01);
        ArgumentNullException.ThrowIfNull(p10);
        if (p01.Count != p10.Count) throw new ArgumentException($"readout error lists differ in length ({p01.Count} vs {p10.Count})");
        for (int q = 0; q < p01.Count; q++)
        {
            if (!(p01[q] >= 0 && p01[q] <= 1)) throw new ArgumentOutOfRangeException(nameof(p01), p01[q], $"readout P(1|0) of qubit {q} must be in [0, 1]");
            if (!(p10[q] >= 0 && p10[q] <= 1)) throw new ArgumentOutOfRangeException(nameof(p10), p10[q], $"readout P(0|1) of qubit {q} must be in [0, 1]");
        }
        _p01 = [.. p01];
        _p10 = [.. p10];
    }

    /// <summary>The same confusion probabilities on every one of <paramref name="qubits"/> qubits.</summary>
    public static ReadoutError Uniform(int qubits, double p01, double p10) =>
        new(Enumerable.Repeat(p01, qubits).ToArray(), Enumerable.Repeat(p10, qubits).ToArray());

    public int Qubits => _p01.Length;
    public IReadOnlyList<double> P01 => _p01;
    public IReadOnlyList<double> P10 => _p10;
    public bool IsZero => _p01.All(p => p == 0) && _p10.All(p => p == 0);
}
