namespace HybridRL.Experiments.Sweeps;

/// <summary>One run of an expanded sweep.</summary>
/// <param name="Index">Position in the expansion (0-based); the Slurm array task id.</param>
/// <param name="Id">Stable run id: <see cref="Slug"/> plus a short hash of the sorted overrides.</param>
/// <param name="Slug">Readable part of the id built from the override values.</param>
/// <param name="Overrides">Settings in axis order (grid, zip, random, seed).</param>
public sealed record SweepRun(int Index, string Id, string Slug, IReadOnlyList<SweepOverride> Overrides)
{
    /// <summary>The overrides as <c>key=value</c> strings, in axis order.</summary>
    public IReadOnlyList<string> OverrideStrings => Overrides.Select(o => o.ToString()).ToArray();

    /// <summary>The value this run sets for <paramref name="key"/>, or null.</summary>
    public string? ValueOf(string key)
    {
        foreach (var o in Overrides)
            if (o.Key == key) return o.Value;
        return null;
    }
}
