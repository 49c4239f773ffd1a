namespace HybridRL.Experiments.Config;

/// <summary>DQN target-network update (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum TargetUpdateKind
{
    Hard,
    Polyak,
}
