namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// An expanded sweep with its folders: runs go to <c>&lt;RunsDir&gt;/&lt;Name&gt;/&lt;run id&gt;/</c>; Slurm scripts, job ids and
/// task logs to the sweep folder <c>&lt;RunsDir&gt;/&lt;Name&gt;/</c> (plain files only, safe on a shared filesystem).
/// </summary>
public sealed class SweepPlan
{
    /// <summary>Default runs folder when the sweep file has no <c>runs_dir</c>: <c>runs</c> under the current directory.</summary>
    public const string DefaultRunsDirName = "runs";

    public SweepPlan(SweepDefinition definition, IReadOnlyList<SweepRun> runs, string runsDir)
    {
        Definition = definition;
        Runs = runs;
        RunsDir = Path.GetFullPath(runsDir);
    }

    /// <summary>Reads, validates and expands a sweep file. <paramref name="defaultRunsDir"/> applies when the file has no <c>runs_dir</c> (default: ./runs).</summary>
    public static SweepPlan Load(string sweepFile, string? defaultRunsDir = null)
    {
        var def = SweepFileParser.Load(sweepFile);
        return new SweepPlan(def, SweepExpander.Expand(def), def.RunsDir ?? defaultRunsDir ?? Path.GetFullPath(DefaultRunsDirName));
    }

    public SweepDefinition Definition { get; }
    public IReadOnlyList<SweepRun> Runs { get; }

    /// <summary>Sweep name: the run name of every run.</summary>
    public string Name => Definition.Name;

    /// <summary>Absolute sweep file path.</summary>
    public string SweepFile => Definition.SourcePath;

    /// <summary>Absolute base experiment path.</summary>
    public string BasePath => Definition.BasePath;

    /// <summary>Absolute runs folder (the parent of the sweep folder).</summary>
    public string RunsDir { get; }

    /// <summary><c>&lt;RunsDir&gt;/&lt;Name&gt;</c>.</summary>
    public string SweepDir => Path.Combine(RunsDir, Name);

    /// <summary>The run folder of <paramref name="run"/>.</summary>
    public string RunDir(SweepRun run) => Path.Combine(SweepDir, run.Id);

    /// <summary>Run <paramref name="index"/>, or a <see cref="SweepFileException"/> naming the valid range.</summary>
    public SweepRun Run(int index)
    {
        if (index < 0 || index >= Runs.Count)
            throw new SweepFileException($"{SweepFile}: run index {index} is out of range (the sweep has {Runs.Count} runs, 0..{Runs.Count - 1})") { FilePath = SweepFile, Key = "index" };
        return Runs[index];
    }
}
