namespace HybridRL.Experiments.Config;

/// <summary>Shape of the epsilon-greedy schedule (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum EpsilonDecay
{
    Linear,
    Exponential,
}
