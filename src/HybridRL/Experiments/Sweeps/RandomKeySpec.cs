namespace HybridRL.Experiments.Sweeps;

/// <summary>One key under <c>random: keys:</c>: a distribution with its bounds, or a list of choices.</summary>
public sealed record RandomKeySpec(string Key, RandomDistribution Distribution, double Low, double High, IReadOnlyList<string> Choices);
