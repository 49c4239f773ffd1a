namespace HybridRL.Experiments.Config;

/// <summary>Learning-rate schedule over the budget (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum LearningRateSchedule
{
    Constant,
    Linear,
    Cosine,
}
