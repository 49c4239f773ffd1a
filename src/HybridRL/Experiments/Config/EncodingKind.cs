namespace HybridRL.Experiments.Config;

/// <summary>How classical features enter the circuit (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum EncodingKind
{
    Basis,
    Angle,
    Amplitude,
    Reuploading,
    ProductZz,
}
