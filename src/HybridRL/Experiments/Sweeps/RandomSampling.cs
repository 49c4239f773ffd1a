namespace HybridRL.Experiments.Sweeps;

/// <summary>The <c>random:</c> section: <see cref="Count"/> samples of <see cref="Keys"/> drawn from streams seeded by <see cref="Seed"/>.</summary>
public sealed record RandomSampling(int Count, ulong Seed, IReadOnlyList<RandomKeySpec> Keys);
