namespace HybridRL.Experiments.Config;

/// <summary>How noise strengths change over the budget (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum NoiseSchedule
{
    Constant,
    Linear,
    Step,
}
