namespace HybridRL.Quantum.Circuits;

/// <summary>Static resource counts of one circuit.</summary>
public sealed record ResourceCounts(
    int Qubits,
    int TotalGates,
    IReadOnlyDictionary<GateKind, int> GatesByKind,
    int SingleQubitGates,
    int TwoQubitGates,
    int Depth,
    int ParameterCount,
    int InputCount,
    int VariableAngleCount,
    int ControlledRotationCount)
{
    public static ResourceCounts Of(int qubits, IReadOnlyList<Operation> ops, int parameterCount, int inputCount)
    {
        var byKind = new SortedDictionary<GateKind, int>();
        var level = new int[qubits];
        int depth = 0, two = 0, variable = 0, controlled = 0;
        foreach (var op in ops)
        {
            byKind[op.Kind] = byKind.TryGetValue(op.Kind, out int c) ? c + 1 : 1;
            int l = 0;
            foreach (int q in op.Qubits) l = Math.Max(l, level[q]);
            l++;
            foreach (int q in op.Qubits) level[q] = l;
            depth = Math.Max(depth, l);
            if (op.Qubits.Count == 2) two++;
            foreach (var a in op.Angles)
                if (a.IsVariable)
                {
                    variable++;
                    if (GateInfo.IsControlledRotation(op.Kind)) controlled++;
                }
        }
        return new ResourceCounts(qubits, ops.Count, byKind, ops.Count - two, two, depth, parameterCount, inputCount, variable, controlled);
    }

    public override string ToString() =>
        $"qubits={Qubits} gates={TotalGates} two-qubit={TwoQubitGates} depth={Depth} parameters={ParameterCount} inputs={InputCount} [{string.Join(", ", GatesByKind.Select(kv => $"{kv.Key}:{kv.Value}"))}]";
}
