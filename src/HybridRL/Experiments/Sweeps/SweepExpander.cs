using System.Globalization;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// Expands a <see cref="SweepDefinition"/> into runs: the cartesian product of, in this order (first slowest),
/// each grid axis, each zip group (its lists advanced together), the random samples, and the seeds.
/// Random sample <c>i</c> of key <c>k</c> is drawn from its own stream <c>RandomStream.SeedFor(seed, "sweep.random." + k, i)</c>,
/// so adding a key or raising the count leaves the existing samples unchanged.
/// </summary>
public static class SweepExpander
{
    /// <summary>The runs of a sweep, with stable ids; throws <see cref="SweepFileException"/> when two runs would be identical.</summary>
    public static IReadOnlyList<SweepRun> Expand(SweepDefinition sweep)
    {
        // Each factor is a list of "choices", each choice a list of overrides.
        var factors = new List<List<SweepOverride[]>>();
        foreach (var axis in sweep.Grid)
            factors.Add(axis.Values.Select(v => new[] { new SweepOverride(axis.Key, v) }).ToList());
        foreach (var group in sweep.ZipGroups)
        {
            int n = group[0].Values.Count;
            var f = new List<SweepOverride[]>(n);
            for (int i = 0; i < n; i++)
                f.Add(group.Select(a => new SweepOverride(a.Key, a.Values[i])).ToArray());
            factors.Add(f);
        }
        if (sweep.Random is { } random)
        {
            var f = new List<SweepOverride[]>(random.Count);
            for (int i = 0; i < random.Count; i++)
                f.Add(random.Keys.Select(k => new SweepOverride(k.Key, Sample(random.Seed, k, i))).ToArray());
            factors.Add(f);
        }
        if (sweep.Seeds.Count > 0)
            factors.Add(sweep.Seeds.Select(s => new[] { new SweepOverride(SweepDefinition.SeedKey, s.ToString(CultureInfo.InvariantCulture)) }).ToList());

        long total = 1;
        foreach (var f in factors)
        {
            total *= f.Count;
            if (total > 1_000_000)
                throw new SweepFileException($"{sweep.SourcePath}: the sweep expands to more than 1,000,000 runs") { FilePath = sweep.SourcePath };
        }

        var runs = new List<SweepRun>((int)total);
        var byId = new Dictionary<string, int>(StringComparer.Ordinal);
        var digits = new int[factors.Count];
        for (int index = 0; index < total; index++)
        {
            var overrides = new List<SweepOverride>();
            for (int f = 0; f < factors.Count; f++) overrides.AddRange(factors[f][digits[f]]);
            string slug = SweepRunId.Slug(overrides);
            string id = $"{slug}-{SweepRunId.Hash(overrides)}";
            if (byId.TryGetValue(id, out int other))
                throw new SweepFileException($"{sweep.SourcePath}: runs {other} and {index} get the same id '{id}' ({string.Join(" ", overrides)})") { FilePath = sweep.SourcePath };
            byId[id] = index;
            runs.Add(new SweepRun(index, id, slug, overrides));
            // advance the mixed-radix counter, last factor fastest
            for (int f = factors.Count - 1; f >= 0; f--)
            {
                if (++digits[f] < factors[f].Count) break;
                digits[f] = 0;
            }
        }
        return runs;
    }

    /// <summary>Sample <paramref name="index"/> of one random key, as override text (doubles round-trip, "R").</summary>
    public static string Sample(ulong seed, RandomKeySpec key, int index)
    {
        var rng = new RandomStream(RandomStream.SeedFor(seed, "sweep.random." + key.Key, index));
        switch (key.Distribution)
        {
            case RandomDistribution.Uniform:
                return (key.Low + (key.High - key.Low) * rng.NextDouble()).ToString("R", CultureInfo.InvariantCulture);
            case RandomDistribution.LogUniform:
            {
                double lo = Math.Log(key.Low), hi = Math.Log(key.High);
                double v = Math.Exp(lo + (hi - lo) * rng.NextDouble());
                return Math.Clamp(v, key.Low, key.High).ToString("R", CultureInfo.InvariantCulture);
            }
            case RandomDistribution.Choice:
                return key.Choices[rng.NextInt(key.Choices.Count)];
            default:
                throw new ArgumentOutOfRangeException(nameof(key), key.Distribution, "unknown distribution");
        }
    }
}
