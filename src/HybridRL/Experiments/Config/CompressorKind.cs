namespace HybridRL.Experiments.Config;

/// <summary>Compressor in front of the circuit (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum CompressorKind
{
    None,
    Mps,
    Dense,
}
