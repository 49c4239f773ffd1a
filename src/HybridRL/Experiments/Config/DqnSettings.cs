namespace HybridRL.Experiments.Config;

/// <summary><c>trainer.dqn</c>: deep Q-learning.</summary>
public sealed record DqnSettings
{
    public required int ReplayCapacity { get; init; }
    public required int WarmupSteps { get; init; }
    public required int UpdateEvery { get; init; }
    public required int BatchSize { get; init; }
    public required TargetUpdateKind TargetUpdate { get; init; }
    /// <summary>Env steps between hard target copies (TargetUpdate = hard).</summary>
    public required int TargetUpdateEvery { get; init; }
    /// <summary>Polyak averaging factor per update (TargetUpdate = polyak).</summary>
    public required double PolyakTau { get; init; }
    public required bool DoubleDqn { get; init; }
    public required DqnLoss Loss { get; init; }
    public required double Gamma { get; init; }
    public required double EpsilonStart { get; init; }
    public required double EpsilonEnd { get; init; }
    public required long EpsilonDecaySteps { get; init; }
    public required EpsilonDecay EpsilonDecay { get; init; }
    public required OptimizerKind Optimizer { get; init; }
    public required double LearningRate { get; init; }
    public required LearningRateSchedule LearningRateSchedule { get; init; }
    /// <summary>0 = no clipping.</summary>
    public required double GradientClipNorm { get; init; }
    /// <summary>Env steps between greedy evaluations; 0 = none.</summary>
    public required long EvalEvery { get; init; }
    public required int EvalEpisodes { get; init; }
}
