namespace HybridRL.Experiments.Config;

/// <summary>Training algorithm (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum TrainerKind
{
    Dqn,
    Genetic,
    EvolutionStrategies,
    CmaEs,
}
