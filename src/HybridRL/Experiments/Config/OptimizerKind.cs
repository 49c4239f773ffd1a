namespace HybridRL.Experiments.Config;

/// <summary>Gradient optimiser (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum OptimizerKind
{
    Adam,
    Rmsprop,
}
