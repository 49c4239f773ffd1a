namespace HybridRL.Experiments.Sweeps;

/// <summary>How a <c>random:</c> key draws its values.</summary>
public enum RandomDistribution
{
    /// <summary>Uniform on [low, high).</summary>
    Uniform,
    /// <summary>exp of a uniform draw on [ln low, ln high): uniform in order of magnitude.</summary>
    LogUniform,
    /// <summary>One of a list, each with equal probability.</summary>
    Choice,
}
