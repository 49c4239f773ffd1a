using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Noise;

/// <summary>
/// Gate noise (Kraus channels attached after gates by kind, strengths following schedules over
/// training progress) plus optional read-out confusion.
/// </summary>
public sealed class NoiseModel
{
    public NoiseModel(IEnumerable<NoiseRule> rules, ReadoutError? readout = null)
    {
        ArgumentNullException.ThrowIfNull(rules);
        Rules = rules.ToArray();
        Readout = readout;
    }

    public IReadOnlyList<NoiseRule> Rules { get; }
    public ReadoutError? Readout { get; }

    public static NoiseModel None { get; } = new([]);

    /// <summary>Same channel and constant strength after every gate (two-qubit depolarising after every two-qubit gate).</summary>
    public static NoiseModel Uniform(NoiseChannelKind channel, double strength) => new([new NoiseRule(channel, strength)]);

    public bool HasGateNoise => Rules.Count > 0;

    /// <summary>The model with every schedule replaced by its constant value at training progress t ∈ [0, 1].</summary>
    public NoiseModel At(double progress) =>
        new(Rules.Select(r => new NoiseRule(r.Channel, StrengthSchedule.Constant(r.Strength.ValueAt(progress)), r.AfterGates)), Readout);

    /// <summary>Effective strength of each rule at progress t (same order as <see cref="Rules"/>).</summary>
    public double[] StrengthsAt(double progress) => Rules.Select(r => r.Strength.ValueAt(progress)).ToArray();

    internal void Validate(int qubits)
    {
        if (Readout != null && Readout.Qubits != qubits)
            throw new ArgumentException($"readout error lists {Readout.Qubits} qubits but the circuit has {qubits}");
    }

    public override string ToString() =>
        string.Join("; ", Rules.Select(r => $"{r.Channel}({r.Strength}) after {(r.AfterGates == null ? "all gates" : string.Join(",", r.AfterGates))}")) +
        (Readout != null ? "; readout error" : "");
}
