namespace HybridRL.Environments;

/// <summary>
/// Outcome of one environment step. <see cref="Terminal"/> means the task reached an absorbing
/// state (no future reward; do not bootstrap). <see cref="Truncated"/> means the episode was cut by a
/// time limit: the state is not terminal and a learner must still bootstrap from the next observation.
/// Both can never be true at once: a step that reaches a terminal state is reported as terminal only.
/// </summary>
public readonly struct StepResult
{
    public StepResult(double reward, bool terminal, bool truncated)
    {
        Reward = reward;
        Terminal = terminal;
        Truncated = truncated && !terminal;
    }

    public double Reward { get; }
    public bool Terminal { get; }
    public bool Truncated { get; }

    /// <summary>True when the episode is over for either reason.</summary>
    public bool Done => Terminal || Truncated;

    public override string ToString() => $"reward={Reward:R} terminal={Terminal} truncated={Truncated}";
}
