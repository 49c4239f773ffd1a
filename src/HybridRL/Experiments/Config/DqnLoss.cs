namespace HybridRL.Experiments.Config;

/// <summary>DQN temporal-difference loss (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum DqnLoss
{
    Huber,
    Squared,
}
