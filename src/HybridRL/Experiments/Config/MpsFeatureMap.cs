namespace HybridRL.Experiments.Config;

/// <summary>Local feature map of the matrix-product-state compressor (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum MpsFeatureMap
{
    CosSin,
    Linear,
}
