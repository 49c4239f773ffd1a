namespace HybridRL.Experiments.Sweeps;

/// <summary>What a run folder says about its run.</summary>
public enum RunFolderState
{
    /// <summary>No run folder, or one with nothing in it that marks progress.</summary>
    Pending,
    /// <summary><c>run.lock</c> names a live process on this host, or a process on another host (cannot be checked from here).</summary>
    Running,
    /// <summary>Started but not finished: <c>checkpoints/</c> (or a stale <c>run.lock</c>) without <c>summary.json</c>; re-running resumes it.</summary>
    Interrupted,
    /// <summary><c>failed.json</c> is present (and no finished summary).</summary>
    Failed,
    /// <summary><c>summary.json</c> with <c>"status": "done"</c>.</summary>
    Done,
}
