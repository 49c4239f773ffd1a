namespace HybridRL.Experiments.Config;

/// <summary><c>model.simulation.noise</c>: per-gate error probabilities and their schedule over the budget.</summary>
public sealed record NoiseSettings
{
    public required double Depolarizing { get; init; }
    public required double TwoQubitDepolarizing { get; init; }
    public required double AmplitudeDamping { get; init; }
    public required double PhaseDamping { get; init; }
    public required double BitFlip { get; init; }
    public required double PhaseFlip { get; init; }
    public required double ReadoutError { get; init; }
    public required NoiseSchedule Schedule { get; init; }
    /// <summary>Multiplier on all probabilities at the end of the budget (linear) or after <see cref="StepAt"/> (step).</summary>
    public required double EndScale { get; init; }
    /// <summary>Fraction of the budget at which a step schedule switches to <see cref="EndScale"/>.</summary>
    public required double StepAt { get; init; }

    /// <summary>True when no gate channel is active (readout error aside).</summary>
    public bool HasGateNoise => Depolarizing > 0 || TwoQubitDepolarizing > 0 || AmplitudeDamping > 0
        || PhaseDamping > 0 || BitFlip > 0 || PhaseFlip > 0;

    public bool IsNoiseFree => !HasGateNoise && ReadoutError == 0;
}
