namespace HybridRL.Training.Evolution;

/// <summary>Which covariance model CMA-ES adapts.</summary>
public enum CmaCovarianceMode
{
    /// <summary>Full covariance up to <see cref="CmaEsSettings.DiagonalAbove"/> dimensions, diagonal (separable) above.</summary>
    Auto,

    /// <summary>Full n × n covariance with periodic eigen-decomposition (Hansen 2016 tutorial).</summary>
    Full,

    /// <summary>Diagonal covariance: separable CMA-ES (Ros &amp; Hansen 2008), O(n) per member.</summary>
    Diagonal,
}
