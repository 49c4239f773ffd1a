using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Noise;

namespace HybridRL.Quantum.Simulation;

/// <summary>The channels to apply after each operation of a circuit, at the current noise progress.</summary>
internal sealed class NoiseProgram
{
    public NoiseProgram(Circuit circuit, NoiseModel model, double progress)
    {
        Model = model;
        var effective = model.StrengthsAt(progress);
        var sets = new KrausSet?[model.Rules.Count];
        for (int r = 0; r < sets.Length; r++)
            if (effective[r] > 0) sets[r] = new KrausSet(model.Rules[r].Channel, effective[r]);
        After = new (KrausSet set, int q0, int q1)[circuit.Operations.Count][];
        for (int o = 0; o < circuit.Operations.Count; o++)
        {
            var op = circuit.Operations[o];
            var list = new List<(KrausSet, int, int)>();
            for (int r = 0; r < sets.Length; r++)
            {
                var set = sets[r];
                if (set == null || !model.Rules[r].Applies(op.Kind)) continue;
                if (set.Qubits == 2) list.Add((set, op.Qubit0, op.Qubit1));
                else foreach (int q in op.Qubits) list.Add((set, q, -1));
            }
            After[o] = [.. list];
        }
        if (model.Readout != null && !model.Readout.IsZero)
        {
            P01 = [.. model.Readout.P01];
            P10 = [.. model.Readout.P10];
        }
    }

    public NoiseModel Model { get; }
    /// <summary>For each operation index: channels with their qubits (q1 = −1 for single-qubit channels).</summary>
    public (KrausSet set, int q0, int q1)[][] After { get; }
    public double[]? P01 { get; }
    public double[]? P10 { get; }
}
