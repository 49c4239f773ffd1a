namespace HybridRL.Training.DeepQ;

/// <summary>Regression loss on the temporal-difference error.</summary>
public enum TdLoss
{
    /// <summary>Huber loss with threshold 1 (Mnih et al. 2015 clip the TD error to [-1, 1], which this equals in gradient).</summary>
    Huber,
    Squared,
}

/// <summary>Gradient optimiser (TorchSharp's implementations).</summary>
public enum OptimizerKind
{
    Adam,
    RmsProp,
}

/// <summary>Deep Q-learning settings (Mnih et al. 2015; Double DQN: van Hasselt et al. 2016).</summary>
public sealed record DeepQSettings
{
    public int ReplayCapacity { get; init; } = 20_000;
    public int WarmupSteps { get; init; } = 200;
    public int UpdateEvery { get; init; } = 1;
    public int BatchSize { get; init; } = 32;

    /// <summary>Hard copy of the online parameters into the target every N environment steps (when <see cref="PolyakTau"/> is 0).</summary>
    public int TargetUpdateEvery { get; init; } = 250;

    /// <summary>When above 0, the target follows θ' ← τθ + (1−τ)θ' after every update instead of hard copies.</summary>
    public double PolyakTau { get; init; }

    public bool DoubleDqn { get; init; } = true;
    public TdLoss Loss { get; init; } = TdLoss.Huber;
    public double Gamma { get; init; } = 0.99;
    public ExplorationSchedule Exploration { get; init; } = new(1.0, 0.05, 2_000, DecayShape.Linear);
    public OptimizerKind Optimizer { get; init; } = OptimizerKind.Adam;
    public LearningRateSchedule LearningRate { get; init; } = new(0.01, LearningRateShape.Constant);

    /// <summary>Global gradient-norm clip; 0 disables.</summary>
    public double GradientClipNorm { get; init; } = 10.0;

    /// <summary>Greedy evaluation every N environment steps on separate environment copies; 0 disables.</summary>
    public long EvalEvery { get; init; } = 1_000;

    public int EvalEpisodes { get; init; } = 10;

    /// <summary>Episodes in the training-return window.</summary>
    public int ReturnWindow { get; init; } = 20;
}
