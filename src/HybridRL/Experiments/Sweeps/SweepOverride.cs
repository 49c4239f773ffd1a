namespace HybridRL.Experiments.Sweeps;

/// <summary>One <c>key=value</c> setting a sweep run applies on top of the base experiment (the same form as <c>--set</c>).</summary>
/// <param name="Key">Dotted config key, e.g. <c>model.circuit.layers</c>.</param>
/// <param name="Value">Value as YAML text (scalars as written; sequences in flow form <c>[a, b]</c>).</param>
public readonly record struct SweepOverride(string Key, string Value)
{
    public override string ToString() => $"{Key}={Value}";
}
