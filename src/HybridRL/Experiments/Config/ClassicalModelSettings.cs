namespace HybridRL.Experiments.Config;

/// <summary><c>model.classical</c>: the classical baseline network (model.kind: classical).</summary>
public sealed record ClassicalModelSettings
{
    public required EquatableList<int> HiddenSizes { get; init; }
    public required ActivationKind Activation { get; init; }
}
