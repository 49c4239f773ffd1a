using HybridRL.Experiments.Runs;

namespace HybridRL.Analysis;

/// <summary>
/// What a finished or partial run left in its folder (<c>runs/&lt;name&gt;/&lt;run-id&gt;/</c>), as read by the analysis:
/// resolved config.yaml (flattened to dotted keys), metrics.csv, summary.json when present, eval-*.json files and
/// resources.json when present (runs started before it was written lack it). Paths come from <see cref="RunFolder"/>, the writer's layout of the same folder.
/// </summary>
public sealed class RunRecord
{
    private static readonly IReadOnlyDictionary<string, string> Empty = new Dictionary<string, string>();

    private RunRecord(string path, IReadOnlyDictionary<string, string> config, MetricsTable metrics,
        IReadOnlyDictionary<string, string> summary, IReadOnlyList<KeyValuePair<string, IReadOnlyDictionary<string, string>>> evaluations,
        IReadOnlyDictionary<string, string> resources, string status)
    {
        Path = path;
        Config = config;
        Metrics = metrics;
        Summary = summary;
        Evaluations = evaluations;
        Resources = resources;
        Status = status;
        Id = summary.TryGetValue("run_id", out var id) && id.Length > 0 ? id : System.IO.Path.GetFileName(path);
    }

    public string Path { get; }
    public string Id { get; }
    public IReadOnlyDictionary<string, string> Config { get; }
    public MetricsTable Metrics { get; }

    /// <summary>summary.json flattened (empty when the run has not finished).</summary>
    public IReadOnlyDictionary<string, string> Summary { get; }

    /// <summary>eval-*.json files, by file name, flattened.</summary>
    public IReadOnlyList<KeyValuePair<string, IReadOnlyDictionary<string, string>>> Evaluations { get; }

    /// <summary>resources.json flattened (empty when absent).</summary>
    public IReadOnlyDictionary<string, string> Resources { get; }

    /// <summary>"done"/summary status, "failed" (failed.json), "running" (run.lock) or "incomplete".</summary>
    public string Status { get; }

    public bool HasSummary => Summary.Count > 0;

    /// <summary>Config value for a dotted key, or null.</summary>
    public string? ConfigValue(string dottedKey) => Config.TryGetValue(dottedKey, out var v) ? v : null;

    /// <summary>Number from summary.json (dotted key), or NaN.</summary>
    public double SummaryNumber(string key) => FlatJson.Number(Summary, key);

    /// <summary>Total trainable parameters: summary.json parameter_count, else the last metrics value.</summary>
    public double ParameterCount
    {
        get
        {
            double p = SummaryNumber("parameter_count");
            return double.IsNaN(p) ? Metrics.LastValue("parameter_count") : p;
        }
    }

    /// <summary>summary.json parameter_counts as component → count.</summary>
    public IReadOnlyList<KeyValuePair<string, double>> ParameterCounts =>
        Summary.Where(kv => kv.Key.StartsWith("parameter_counts.", StringComparison.Ordinal))
            .Select(kv => new KeyValuePair<string, double>(kv.Key["parameter_counts.".Length..], FlatJson.Number(Summary, kv.Key)))
            .ToArray();

    /// <summary>Whether <paramref name="dir"/> holds a run's metrics.csv (the one file every started run has).</summary>
    public static bool IsRunFolder(string dir) => File.Exists(new RunFolder(dir).MetricsPath);

    public static RunRecord Load(string dir)
    {
        var folder = new RunFolder(dir);
        string full = folder.Root;
        if (!Directory.Exists(full)) throw new DirectoryNotFoundException($"run folder not found: {dir}");
        string metricsPath = folder.MetricsPath;
        if (!File.Exists(metricsPath)) throw new FileNotFoundException($"{full}: not a run folder (no metrics.csv)", metricsPath);
        var metrics = MetricsCsvReader.Read(metricsPath);
        var config = File.Exists(folder.ConfigPath) ? FlatYaml.Load(folder.ConfigPath) : Empty;
        var summary = File.Exists(folder.SummaryPath) ? FlatJson.Load(folder.SummaryPath) : Empty;
        var resources = File.Exists(folder.ResourcesPath) ? FlatJson.Load(folder.ResourcesPath) : Empty;
        var evals = Directory.GetFiles(full, "eval-*.json").OrderBy(f => f, StringComparer.Ordinal)
            .Select(f => new KeyValuePair<string, IReadOnlyDictionary<string, string>>(System.IO.Path.GetFileName(f), FlatJson.Load(f)))
            .ToArray();
        string status = summary.TryGetValue("status", out var st) && st.Length > 0 ? st
            : File.Exists(folder.FailedPath) ? "failed"
            : File.Exists(folder.LockPath) ? "running"
            : "incomplete";
        return new RunRecord(full, config, metrics, summary, evals, resources, status);
    }

    /// <summary>
    /// Resolves arguments that are run folders or sweep folders (any folder whose descendants hold run folders)
    /// into run folders, sorted by path. Throws naming the argument when it holds no run.
    /// </summary>
    public static IReadOnlyList<RunRecord> Discover(IEnumerable<string> paths)
    {
        var found = new SortedSet<string>(StringComparer.Ordinal);
        foreach (string p in paths)
        {
            string full = System.IO.Path.GetFullPath(p);
            if (!Directory.Exists(full)) throw new DirectoryNotFoundException($"not a folder: {p}");
            int before = found.Count;
            Collect(full, found, depth: 0);
            if (found.Count == before) throw new InvalidDataException($"{p}: no run folders (folders with metrics.csv) found");
        }
        return found.Select(Load).ToArray();
    }

    private static void Collect(string dir, SortedSet<string> into, int depth)
    {
        if (IsRunFolder(dir)) { into.Add(dir); return; }
        if (depth >= 6) return;
        foreach (string sub in Directory.GetDirectories(dir))
        {
            string name = System.IO.Path.GetFileName(sub);
            if (name.StartsWith('.') || name == "checkpoints") continue;
            Collect(sub, into, depth + 1);
        }
    }
}
