namespace HybridRL.Experiments.Runs;

/// <summary>
/// The paths of one run folder <c>runs/&lt;name&gt;/&lt;run-id&gt;/</c> (see the shared run-folder contract):
/// config.yaml, resources.json, metrics.csv, log.json, checkpoints/, summary.json, eval-*.json, run.lock and failed.json.
/// </summary>
public sealed class RunFolder
{
    public RunFolder(string root)
    {
        ArgumentException.ThrowIfNullOrWhiteSpace(root);
        Root = Path.GetFullPath(root);
    }

    /// <summary>The folder for <paramref name="runId"/> of experiment <paramref name="name"/> under <paramref name="runsRoot"/>.</summary>
    public static RunFolder For(string runsRoot, string name, string runId)
    {
        if (!RunId.IsSafeSegment(name)) throw new ArgumentException($"experiment name '{name}' is not a safe folder name (use letters, digits, '.', '_' and '-')", nameof(name));
        if (!RunId.IsSafeSegment(runId)) throw new ArgumentException($"run id '{runId}' is not a safe folder name", nameof(runId));
        return new RunFolder(Path.Combine(runsRoot, name, runId));
    }

    public string Root { get; }
    public string ConfigPath => Path.Combine(Root, "config.yaml");
    /// <summary>What the run's model needs (circuit gate counts, depth, executions per update), written when the run starts.</summary>
    public string ResourcesPath => Path.Combine(Root, "resources.json");
    public string MetricsPath => Path.Combine(Root, "metrics.csv");
    public string LogPath => Path.Combine(Root, "log.json");
    public string CheckpointsDir => Path.Combine(Root, "checkpoints");
    public string SummaryPath => Path.Combine(Root, "summary.json");
    public string LockPath => Path.Combine(Root, "run.lock");
    public string FailedPath => Path.Combine(Root, "failed.json");

    /// <summary>Path of an evaluation result file <c>eval-&lt;label&gt;.json</c>.</summary>
    public string EvalPath(string label)
    {
        if (!RunId.IsSafeSegment(label)) throw new ArgumentException($"evaluation label '{label}' is not a safe file name part", nameof(label));
        return Path.Combine(Root, $"eval-{label}.json");
    }

    /// <summary>Creates the folder and its checkpoints/ directory if missing.</summary>
    public RunFolder EnsureCreated()
    {
        Directory.CreateDirectory(CheckpointsDir);
        return this;
    }

    /// <summary>What state the run is in, judged from the folder's contents.</summary>
    public RunStatus Status(TimeSpan? foreignLockStaleAfter = null) => RunStatus.Detect(this, foreignLockStaleAfter);

    public override string ToString() => Root;
}
