using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Noise;

/// <summary>
/// Attach <see cref="Channel"/> with <see cref="Strength"/> after every gate whose kind is in
/// <see cref="AfterGates"/> (null: after every gate). Single-qubit channels act on each qubit the
/// gate touched; <see cref="NoiseChannelKind.Depolarizing2"/> acts on the pair of a two-qubit gate.
/// </summary>
public sealed record NoiseRule
{
    public NoiseRule(NoiseChannelKind channel, StrengthSchedule strength, IReadOnlyCollection<GateKind>? afterGates = null)
    {
        ArgumentNullException.ThrowIfNull(strength);
        if (channel == NoiseChannelKind.Depolarizing2 && afterGates != null && afterGates.Any(g => GateInfo.QubitCount(g) != 2))
            throw new ArgumentException($"two-qubit depolarising noise can only follow two-qubit gates, got {string.Join(", ", afterGates.Where(g => GateInfo.QubitCount(g) != 2))}", nameof(afterGates));
        Channel = channel;
        Strength = strength;
        AfterGates = afterGates?.ToHashSet();
    }

    public NoiseChannelKind Channel { get; }
    public StrengthSchedule Strength { get; }
    public IReadOnlySet<GateKind>? AfterGates { get; }

    public bool Applies(GateKind kind) =>
        (AfterGates == null || AfterGates.Contains(kind)) && (Channel != NoiseChannelKind.Depolarizing2 || GateInfo.QubitCount(kind) == 2);

    public static IReadOnlyCollection<GateKind> SingleQubitGates { get; } = Enum.GetValues<GateKind>().Where(g => GateInfo.QubitCount(g) == 1).ToArray();
    public static IReadOnlyCollection<GateKind> TwoQubitGates { get; } = Enum.GetValues<GateKind>().Where(g => GateInfo.QubitCount(g) == 2).ToArray();
}
