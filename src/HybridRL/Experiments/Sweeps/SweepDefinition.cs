namespace HybridRL.Experiments.Sweeps;

/// <summary>A parsed, validated sweep file (before expansion).</summary>
/// <param name="SourcePath">Absolute path of the sweep file.</param>
/// <param name="Name">Sweep name (<c>name:</c>, default the file stem); the run name of every run.</param>
/// <param name="BasePath">Absolute path of the base experiment file (<c>base:</c>, relative to the sweep file).</param>
/// <param name="RunsDir">Absolute runs folder from <c>runs_dir:</c> (relative to the sweep file), or null for the caller's default.</param>
/// <param name="Grid">Axes whose cartesian product is taken (first key slowest).</param>
/// <param name="ZipGroups">Groups of equal-length axes advanced together; each group is one factor of the product.</param>
/// <param name="Random">Random samples (one factor of the product), or null.</param>
/// <param name="Seeds">Values for <c>experiment.seed</c> (innermost factor), or empty.</param>
public sealed record SweepDefinition(
    string SourcePath,
    string Name,
    string BasePath,
    string? RunsDir,
    IReadOnlyList<SweepAxis> Grid,
    IReadOnlyList<IReadOnlyList<SweepAxis>> ZipGroups,
    RandomSampling? Random,
    IReadOnlyList<long> Seeds)
{
    /// <summary>The config key that <c>seeds:</c> sets.</summary>
    public const string SeedKey = "experiment.seed";
}
