namespace HybridRL.Experiments.Executors;

/// <summary>Options of <c>sweep submit</c> (each maps to an <c>#SBATCH</c> line).</summary>
public sealed record SlurmSubmitOptions
{
    /// <summary><c>--partition</c>; null: the cluster's default.</summary>
    public string? Partition { get; init; }

    /// <summary><c>--time</c> per task in Slurm's format (e.g. <c>4:00:00</c>, <c>1-00:00:00</c>); null: the partition's default.</summary>
    public string? Time { get; init; }

    /// <summary>Array throttle: at most this many tasks at once (<c>--array=...%M</c>); null: no limit.</summary>
    public int? MaxParallel { get; init; }

    /// <summary>Seconds before the time limit at which the batch shell gets USR1 (<c>--signal=B:USR1@N</c>) to checkpoint. Default 180 (common practice: a few minutes).</summary>
    public int SignalLeadSeconds { get; init; } = 180;

    /// <summary><c>--cpus-per-task</c>; null: not set.</summary>
    public int? CpusPerTask { get; init; }

    /// <summary><c>--mem</c> (e.g. <c>4G</c>); null: not set.</summary>
    public string? Memory { get; init; }

    /// <summary>Further raw <c>#SBATCH</c> options, e.g. <c>--account=abc</c>.</summary>
    public IReadOnlyList<string> ExtraOptions { get; init; } = [];

    /// <summary>Submit only runs that are not done and not running (default); false submits every index.</summary>
    public bool OnlyUnfinished { get; init; } = true;

    /// <summary>Working directory of the tasks (<c>--chdir</c>); default: the current directory at submission.</summary>
    public string? WorkingDirectory { get; init; }
}
