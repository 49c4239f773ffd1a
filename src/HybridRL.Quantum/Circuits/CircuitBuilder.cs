namespace HybridRL.Quantum.Circuits;

/// <summary>Fluent builder of a <see cref="Circuit"/>; validates qubit indices and angles as gates are added.</summary>
public sealed class CircuitBuilder
{
    private readonly List<Operation> _ops = [];
    private readonly List<IInputAngleMap> _maps = [];
    private int _parameterCount;
    private int _inputCount;

    /// <param name="qubits">Register size, 1..<see cref="Circuit.MaxQubits"/>.</param>
    /// <param name="inputCount">Declared input features (at least the largest feature used + 1).</param>
    /// <param name="parameterCount">Declared trainable parameters (at least the largest index used + 1).</param>
    public CircuitBuilder(int qubits, int inputCount = 0, int parameterCount = 0)
    {
        if (qubits < 1 || qubits > Circuit.MaxQubits)
            throw new ArgumentOutOfRangeException(nameof(qubits), qubits, $"qubit count must be between 1 and {Circuit.MaxQubits} (state-vector memory grows as 2^qubits)");
        if (inputCount < 0) throw new ArgumentOutOfRangeException(nameof(inputCount), inputCount, "input count must be non-negative");
        if (parameterCount < 0) throw new ArgumentOutOfRangeException(nameof(parameterCount), parameterCount, "parameter count must be non-negative");
        Qubits = qubits;
        _inputCount = inputCount;
        _parameterCount = parameterCount;
    }

    public int Qubits { get; }
    /// <summary>Parameters referenced so far (largest index + 1, or the declared count).</summary>
    public int ParameterCount => _parameterCount;
    public int InputCount => _inputCount;
    public int OperationCount => _ops.Count;

    /// <summary>Index of the next unused trainable parameter (for builders that allocate parameters).</summary>
    public int NextParameter() => _parameterCount++;

    public CircuitBuilder ReserveParameters(int count)
    {
        if (count < 0) throw new ArgumentOutOfRangeException(nameof(count), count, "count must be non-negative");
        _parameterCount = Math.Max(_parameterCount, count);
        return this;
    }

    public CircuitBuilder ReserveInputs(int count)
    {
        if (count < 0) throw new ArgumentOutOfRangeException(nameof(count), count, "count must be non-negative");
        _inputCount = Math.Max(_inputCount, count);
        return this;
    }

    /// <summary>Registers an input-angle map; returns its index for <see cref="Angle.Mapped"/>.</summary>
    public int AddInputMap(IInputAngleMap map)
    {
        ArgumentNullException.ThrowIfNull(map);
        _maps.Add(map);
        _inputCount = Math.Max(_inputCount, map.InputCount);
        return _maps.Count - 1;
    }

    public CircuitBuilder Add(GateKind kind, ReadOnlySpan<int> qubits, ReadOnlySpan<Angle> angles)
    {
        foreach (int q in qubits)
            if (q < 0 || q >= Qubits)
                throw new ArgumentOutOfRangeException(nameof(qubits), q, $"qubit index {q} out of range for gate {kind} on a {Qubits}-qubit circuit (valid 0..{Qubits - 1})");
        foreach (var a in angles) Register(a, kind);
        _ops.Add(new Operation(kind, qubits, angles));
        return this;
    }

    private void Register(Angle a, GateKind kind)
    {
        switch (a.Kind)
        {
            case AngleKind.Constant:
                if (!double.IsFinite(a.Value)) throw new ArgumentException($"angle of gate {kind} is not finite ({a.Value})");
                break;
            case AngleKind.Parameter:
                _parameterCount = Math.Max(_parameterCount, a.Index + 1);
                break;
            case AngleKind.Input:
                _inputCount = Math.Max(_inputCount, a.Index + 1);
                if (a.ScaleParameter >= 0) _parameterCount = Math.Max(_parameterCount, a.ScaleParameter + 1);
                break;
            case AngleKind.InputProduct:
                _inputCount = Math.Max(_inputCount, Math.Max(a.Index, a.Index2) + 1);
                break;
            case AngleKind.Mapped:
                if (a.Index >= _maps.Count) throw new ArgumentException($"gate {kind} refers to input map {a.Index}, but only {_maps.Count} map(s) are registered");
                if (a.Index2 >= _maps[a.Index].AngleCount) throw new ArgumentException($"gate {kind} refers to output {a.Index2} of map '{_maps[a.Index].Name}', which has {_maps[a.Index].AngleCount} outputs");
                break;
            default:
                throw new ArgumentException($"gate {kind} has an angle of unknown kind (default-initialised Angle?)");
        }
    }

    private CircuitBuilder One(GateKind k, int q) => Add(k, [q], []);
    private CircuitBuilder OneA(GateKind k, int q, Angle a) => Add(k, [q], [a]);
    private CircuitBuilder Two(GateKind k, int a, int b) => Add(k, [a, b], []);
    private CircuitBuilder TwoA(GateKind k, int c, int t, Angle a) => Add(k, [c, t], [a]);

    public CircuitBuilder X(int q) => One(GateKind.X, q);
    public CircuitBuilder Y(int q) => One(GateKind.Y, q);
    public CircuitBuilder Z(int q) => One(GateKind.Z, q);
    public CircuitBuilder H(int q) => One(GateKind.H, q);
    public CircuitBuilder S(int q) => One(GateKind.S, q);
    public CircuitBuilder Sdg(int q) => One(GateKind.Sdg, q);
    public CircuitBuilder T(int q) => One(GateKind.T, q);
    public CircuitBuilder Tdg(int q) => One(GateKind.Tdg, q);
    public CircuitBuilder RX(int q, Angle theta) => OneA(GateKind.RX, q, theta);
    public CircuitBuilder RY(int q, Angle theta) => OneA(GateKind.RY, q, theta);
    public CircuitBuilder RZ(int q, Angle theta) => OneA(GateKind.RZ, q, theta);
    public CircuitBuilder Phase(int q, Angle phi) => OneA(GateKind.Phase, q, phi);
    /// <summary>RZ(ω)·RY(θ)·RZ(φ): φ is applied first.</summary>
    public CircuitBuilder Rot(int q, Angle phi, Angle theta, Angle omega) => Add(GateKind.Rot, [q], [phi, theta, omega]);
    public CircuitBuilder CNOT(int control, int target) => Two(GateKind.CNOT, control, target);
    public CircuitBuilder CZ(int a, int b) => Two(GateKind.CZ, a, b);
    public CircuitBuilder SWAP(int a, int b) => Two(GateKind.SWAP, a, b);
    public CircuitBuilder CRX(int control, int target, Angle theta) => TwoA(GateKind.CRX, control, target, theta);
    public CircuitBuilder CRY(int control, int target, Angle theta) => TwoA(GateKind.CRY, control, target, theta);
    public CircuitBuilder CRZ(int control, int target, Angle theta) => TwoA(GateKind.CRZ, control, target, theta);

    /// <summary>Appends every operation of <paramref name="circuit"/> (which must not carry input maps).</summary>
    public CircuitBuilder Append(Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        if (circuit.Qubits > Qubits) throw new ArgumentException($"cannot append a {circuit.Qubits}-qubit circuit to a {Qubits}-qubit builder", nameof(circuit));
        if (circuit.InputMaps.Count > 0) throw new ArgumentException("cannot append a circuit that carries input maps; build it in this builder instead", nameof(circuit));
        foreach (var op in circuit.Operations) Add(op.Kind, op.Qubits.ToArray(), op.AngleSpan);
        ReserveParameters(circuit.ParameterCount);
        ReserveInputs(circuit.InputCount);
        return this;
    }

    public Circuit Build() => new(Qubits, [.. _ops], _parameterCount, _inputCount, [.. _maps]);
}
