namespace HybridRL.Quantum.Circuits;

/// <summary>One gate application: kind, qubits (control first for controlled gates) and angles.</summary>
public sealed class Operation
{
    private readonly int[] _qubits;
    private readonly Angle[] _angles;

    public Operation(GateKind kind, ReadOnlySpan<int> qubits, ReadOnlySpan<Angle> angles)
    {
        if (qubits.Length != GateInfo.QubitCount(kind))
            throw new ArgumentException($"gate {kind} acts on {GateInfo.QubitCount(kind)} qubit(s), got {qubits.Length}", nameof(qubits));
        if (angles.Length != GateInfo.AngleCount(kind))
            throw new ArgumentException($"gate {kind} takes {GateInfo.AngleCount(kind)} angle(s), got {angles.Length}", nameof(angles));
        if (qubits.Length == 2 && qubits[0] == qubits[1])
            throw new ArgumentException($"gate {kind} needs two different qubits, got {qubits[0]} twice", nameof(qubits));
        Kind = kind;
        _qubits = qubits.ToArray();
        _angles = angles.ToArray();
    }

    public GateKind Kind { get; }
    public IReadOnlyList<int> Qubits => _qubits;
    public IReadOnlyList<Angle> Angles => _angles;
    public int Qubit0 => _qubits[0];
    public int Qubit1 => _qubits.Length > 1 ? _qubits[1] : -1;
    internal ReadOnlySpan<Angle> AngleSpan => _angles;

    public override string ToString() =>
        _angles.Length == 0 ? $"{Kind} q{string.Join(",q", _qubits)}" : $"{Kind}({string.Join(", ", _angles)}) q{string.Join(",q", _qubits)}";
}
