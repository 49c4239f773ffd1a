namespace HybridRL.Experiments.Config;

/// <summary>Activation of dense layers (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum ActivationKind
{
    Tanh,
    Relu,
}
