namespace HybridRL.Models;

/// <summary>Which function approximator to build (config key <c>model.kind</c>).</summary>
public enum ModelKind
{
    /// <summary>Compressor → variational circuit → trainable read-out.</summary>
    Hybrid,
    /// <summary>Plain fully connected network (baseline).</summary>
    Classical,
}
