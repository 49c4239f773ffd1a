using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Quantum.Tests;

/// <summary>Random circuits using every gate kind and every angle kind (test fixtures, invented).</summary>
internal static class TestCircuits
{
    public static Circuit Random(int qubits, int gates, RandomStream rng, int inputs, int parameters)
    {
        var b = new CircuitBuilder(qubits, inputs, parameters);
        var kinds = Enum.GetValues<GateKind>().Where(k => qubits >= 2 || GateInfo.QubitCount(k) == 1).ToArray();
        for (int g = 0; g < gates; g++)
        {
            var kind = kinds[rng.NextInt(kinds.Length)];
            int q0 = rng.NextInt(qubits), q1 = -1;
            if (GateInfo.QubitCount(kind) == 2) { do q1 = rng.NextInt(qubits); while (q1 == q0); }
            var angles = Enumerable.Range(0, GateInfo.AngleCount(kind)).Select(_ => RandomAngle(rng, inputs, parameters)).ToArray();
            b.Add(kind, q1 < 0 ? [q0] : [q0, q1], angles);
        }
        return b.Build();
    }

    public static Angle RandomAngle(RandomStream rng, int inputs, int parameters)
    {
        int k = rng.NextInt(6);
        return k switch
        {
            0 => Angle.Constant(4 * rng.NextDouble() - 2),
            1 or 2 => Angle.Parameter(rng.NextInt(parameters)),
            3 => Angle.Input(rng.NextInt(inputs), 0.5 + rng.NextDouble(), rng.NextInt(2) == 0 ? InputSquash.None : InputSquash.Arctan),
            4 => Angle.ScaledInput(rng.NextInt(inputs), rng.NextInt(parameters), rng.NextInt(2) == 0 ? InputSquash.None : InputSquash.Arctan),
            _ => Angle.InputProduct(rng.NextInt(inputs), rng.NextInt(inputs), 0.7),
        };
    }

    public static double[] Uniform(RandomStream rng, int n, double lo = -2, double hi = 2) =>
        Enumerable.Range(0, n).Select(_ => lo + (hi - lo) * rng.NextDouble()).ToArray();
}
