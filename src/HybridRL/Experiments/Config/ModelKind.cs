namespace HybridRL.Experiments.Config;

/// <summary>Kind of value/policy model (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum ModelKind
{
    Hybrid,
    Classical,
}
