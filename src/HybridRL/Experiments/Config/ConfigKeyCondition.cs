namespace HybridRL.Experiments.Config;

/// <summary>A key applies only while the choice key <paramref name="Key"/> has one of <paramref name="Values"/>.</summary>
public sealed record ConfigKeyCondition(string Key, IReadOnlyList<string> Values);
