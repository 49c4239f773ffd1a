namespace HybridRL.Experiments.Inspection;

/// <summary>Static facts about the variational circuit of a hybrid model, with a text drawing and optionally its OpenQASM 3 text.</summary>
public sealed record CircuitInspection
{
    public required int Qubits { get; init; }
    public required int Gates { get; init; }
    /// <summary>Gate count per kind (textbook names, e.g. RX, CNOT).</summary>
    public required IReadOnlyDictionary<string, int> GatesByKind { get; init; }
    public required int Depth { get; init; }
    public required int TwoQubitGates { get; init; }
    /// <summary>Trainable circuit parameters (input scales and rotation angles).</summary>
    public required int CircuitParameters { get; init; }
    /// <summary>Features fed into the circuit (after the compressor).</summary>
    public required int Inputs { get; init; }
    /// <summary>Observables read out (one expectation each).</summary>
    public required int Observables { get; init; }
    /// <summary>Distinct measurement settings needed per circuit evaluation (qubit-wise commuting groups).</summary>
    public required int MeasurementSettings { get; init; }
    /// <summary>Shifted evaluations one row's parameter-shift gradient needs (2 per variable rotation, 4 per controlled rotation).</summary>
    public required int ShiftEvaluationsPerRow { get; init; }
    public required string Drawing { get; init; }
    /// <summary>OpenQASM 3 program (parameters and inputs as named inputs); null unless requested.</summary>
    public string? Qasm { get; init; }
}
