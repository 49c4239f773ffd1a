namespace HybridRL.Experiments.Sweeps;

/// <summary>A key and the list of values it takes (one <c>grid:</c> entry or one member of a <c>zip:</c> group).</summary>
public sealed record SweepAxis(string Key, IReadOnlyList<string> Values);
