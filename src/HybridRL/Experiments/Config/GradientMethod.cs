namespace HybridRL.Experiments.Config;

/// <summary>Circuit gradient method (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum GradientMethod
{
    Adjoint,
    ParameterShift,
}
