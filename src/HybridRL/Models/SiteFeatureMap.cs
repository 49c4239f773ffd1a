namespace HybridRL.Models;

/// <summary>Per-site feature map of the matrix product state compressor (config key <c>model.compressor.feature_map</c>).</summary>
public enum SiteFeatureMap
{
    /// <summary>φ(x) = [cos(πx/2), sin(πx/2)] (Stoudenmire &amp; Schwab 2016, eq. 3).</summary>
    Trigonometric,
    /// <summary>φ(x) = [1, x].</summary>
    Linear,
}
