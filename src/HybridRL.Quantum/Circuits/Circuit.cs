namespace HybridRL.Quantum.Circuits;

/// <summary>
/// An immutable ordered list of gate applications on <see cref="Qubits"/> qubits (qubit 0 is the
/// least significant bit of a basis-state index). Angles refer to trainable parameters
/// 0..ParameterCount-1, input features 0..InputCount-1 and outputs of <see cref="InputMaps"/>.
/// Build with <see cref="CircuitBuilder"/>.
/// </summary>
public sealed class Circuit
{
    /// <summary>Largest register the state-vector simulator accepts.</summary>
    public const int MaxQubits = 24;

    private readonly Operation[] _ops;
    private readonly IInputAngleMap[] _maps;

    internal Circuit(int qubits, Operation[] ops, int parameterCount, int inputCount, IInputAngleMap[] maps)
    {
        Qubits = qubits;
        _ops = ops;
        _maps = maps;
        ParameterCount = parameterCount;
        InputCount = inputCount;
        Resources = ResourceCounts.Of(qubits, ops, parameterCount, inputCount);
    }

    public int Qubits { get; }
    public IReadOnlyList<Operation> Operations => _ops;
    public int ParameterCount { get; }
    public int InputCount { get; }
    public IReadOnlyList<IInputAngleMap> InputMaps => _maps;
    public ResourceCounts Resources { get; }

    /// <summary>A new circuit with the operations of <paramref name="other"/> appended (same qubits; counts are the maximum of both).</summary>
    public Circuit Then(Circuit other)
    {
        ArgumentNullException.ThrowIfNull(other);
        if (other.Qubits != Qubits) throw new ArgumentException($"cannot append a {other.Qubits}-qubit circuit to a {Qubits}-qubit circuit", nameof(other));
        if (other._maps.Length > 0 && _maps.Length > 0) throw new ArgumentException("cannot append two circuits that both carry input maps", nameof(other));
        return new Circuit(Qubits, [.. _ops, .. other._ops], Math.Max(ParameterCount, other.ParameterCount), Math.Max(InputCount, other.InputCount), [.. _maps, .. other._maps]);
    }

    public override string ToString() => $"Circuit({Resources})";
}
