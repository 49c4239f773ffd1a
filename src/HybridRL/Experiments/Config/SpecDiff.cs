namespace HybridRL.Experiments.Config;

/// <summary>Key-by-key comparison of two resolved specs (used by resume to refuse changes that alter the computation).</summary>
public sealed class SpecDiff
{
    private SpecDiff(IReadOnlyList<SpecDifference> differences) => Differences = differences;

    /// <summary>Every differing key, in key-table order.</summary>
    public IReadOnlyList<SpecDifference> Differences { get; }

    /// <summary>Differences that are not safe on resume.</summary>
    public IReadOnlyList<SpecDifference> UnsafeDifferences => Differences.Where(d => !d.SafeOnResume).ToList();

    public bool IsEmpty => Differences.Count == 0;

    /// <summary>True when every difference is to a key in <see cref="SafeOnResumeKeys"/>.</summary>
    public bool IsSafeForResume => Differences.All(d => d.SafeOnResume);

    /// <summary>Keys that may change on resume: budgets, logging intervals, progress, simulator threads, hardware costing.</summary>
    public static IReadOnlyList<string> SafeOnResumeKeys => ConfigKeyTable.SafeOnResumeKeys;

    public static SpecDiff Compare(ExperimentSpec before, ExperimentSpec after)
    {
        var a = SpecYamlWriter.Flatten(before);
        var b = SpecYamlWriter.Flatten(after);
        var aMap = a.ToDictionary(x => x.Path, x => x.Value, StringComparer.Ordinal);
        var bMap = b.ToDictionary(x => x.Path, x => x.Value, StringComparer.Ordinal);
        var order = a.Select(x => x.Path).Concat(b.Select(x => x.Path)).Distinct(StringComparer.Ordinal)
            .OrderBy(p => IndexOf(p)).ThenBy(p => p, StringComparer.Ordinal);
        var diffs = new List<SpecDifference>();
        foreach (var path in order)
        {
            var x = aMap.GetValueOrDefault(path);
            var y = bMap.GetValueOrDefault(path);
            if (string.Equals(x, y, StringComparison.Ordinal)) continue;
            diffs.Add(new SpecDifference(path, x, y, ConfigKeyTable.Find(path)?.SafeOnResume ?? false));
        }
        return new SpecDiff(diffs);
    }

    private static int IndexOf(string path)
    {
        var key = ConfigKeyTable.Find(path);
        if (key is not null) return IndexTable.Value[key.Path];
        return IndexTable.Value["environment.kind"]; // environment parameters sit right after the kind
    }

    private static readonly Lazy<Dictionary<string, int>> IndexTable = new(() =>
        ConfigKeyTable.All.Select((k, i) => (k.Path, i)).ToDictionary(t => t.Path, t => t.i, StringComparer.Ordinal));

    public override string ToString() => IsEmpty
        ? "no differences"
        : string.Join(Environment.NewLine, Differences.Select(d => $"{d.Key}: {d.Before ?? "(absent)"} → {d.After ?? "(absent)"}{(d.SafeOnResume ? "" : " [not safe on resume]")}"));
}
