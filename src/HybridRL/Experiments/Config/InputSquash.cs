namespace HybridRL.Experiments.Config;

/// <summary>Squashing applied to features before angle encoding (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum InputSquash
{
    None,
    Arctan,
}
