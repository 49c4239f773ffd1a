namespace HybridRL.Experiments.Config;

/// <summary>Which qubit pairs are entangled in each layer (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum EntanglerLayout
{
    Chain,
    Ring,
    AllToAll,
    None,
}
