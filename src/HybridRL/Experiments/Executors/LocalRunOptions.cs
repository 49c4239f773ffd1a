namespace HybridRL.Experiments.Executors;

/// <summary>Options of <c>sweep run</c>.</summary>
public sealed record LocalRunOptions
{
    /// <summary>Child processes at a time (default: the number of cores).</summary>
    public int Jobs { get; init; } = Environment.ProcessorCount;

    /// <summary>Signal sent to running children when the sweep is cancelled (default SIGTERM: checkpoint and exit 3).</summary>
    public int StopSignal { get; init; } = ProcessSignals.SIGTERM;

    /// <summary>How long children may take to exit after the stop signal before they are killed (default: wait for ever).</summary>
    public TimeSpan? StopGrace { get; init; }

    /// <summary>Where each child's stdout/stderr is appended (<c>task-&lt;index&gt;.out</c>); default <c>&lt;sweep folder&gt;/logs</c>.</summary>
    public string? LogDir { get; init; }

    /// <summary>Only these run indices (default: all).</summary>
    public IReadOnlyCollection<int>? Indices { get; init; }
}
