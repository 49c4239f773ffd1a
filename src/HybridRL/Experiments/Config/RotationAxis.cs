namespace HybridRL.Experiments.Config;

/// <summary>Single-qubit trainable rotation axes (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum RotationAxis
{
    Rx,
    Ry,
    Rz,
}
