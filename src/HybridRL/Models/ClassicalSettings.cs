namespace HybridRL.Models;

/// <summary>Classical baseline network (config section <c>model.classical</c>).</summary>
public sealed record ClassicalSettings
{
    /// <summary><c>model.classical.hidden</c>.</summary>
    public IReadOnlyList<int> Hidden { get; init; } = [64, 64];
    /// <summary><c>model.classical.activation</c>.</summary>
    public Activation Activation { get; init; } = Activation.Relu;
}
