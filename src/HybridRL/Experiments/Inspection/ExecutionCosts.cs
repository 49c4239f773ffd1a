namespace HybridRL.Experiments.Inspection;

/// <summary>
/// Circuit executions the run's trainer performs, counted the way the simulator's counters count
/// them: one execution per measurement setting of every forward row (and of every adjoint backward
/// row); hardware-equivalent executions price every gradient row by the parameter-shift rule.
/// Null fields do not apply to the trainer (or, for evolution, when the episode length has no bound).
/// </summary>
public sealed record ExecutionCosts
{
    /// <summary>Shots per circuit execution in the simulation (0 = exact expectations).</summary>
    public required int ShotsPerExecution { get; init; }
    /// <summary>Forward rows per environment step for acting (DQN: one, on greedy steps only; evolution: one per member step).</summary>
    public required int ActingForwardRowsPerStep { get; init; }
    public required long ActingExecutionsPerStep { get; init; }

    // Deep Q-learning
    public int? UpdateEvery { get; init; }
    /// <summary>Target rows (next states) + online rows for Double DQN action choice + online rows with gradient.</summary>
    public long? ForwardRowsPerUpdate { get; init; }
    public long? GradientRowsPerUpdate { get; init; }
    public long? ExecutionsPerUpdate { get; init; }
    public long? HardwareExecutionsPerUpdate { get; init; }

    // Evolution
    public int? Population { get; init; }
    public int? EpisodesPerMember { get; init; }
    /// <summary>Longest episode the environment allows (its max_steps or slices); null when unbounded or unknown.</summary>
    public int? MaxStepsPerEpisode { get; init; }
    /// <summary>Upper bound: population × episodes per member × longest episode.</summary>
    public long? ForwardRowsPerGeneration { get; init; }
    public long? ExecutionsPerGeneration { get; init; }
    /// <summary>Evaluation of the search centre after every generation: episodes × longest episode (upper bound).</summary>
    public long? EvaluationRowsPerGeneration { get; init; }
    /// <summary>Without gradients a device needs exactly the forward executions.</summary>
    public long? HardwareExecutionsPerGeneration { get; init; }
}
