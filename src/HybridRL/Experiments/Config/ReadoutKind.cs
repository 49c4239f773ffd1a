namespace HybridRL.Experiments.Config;

/// <summary>How circuit expectations become action values (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum ReadoutKind
{
    PerAction,
    Linear,
}
