namespace HybridRL.Experiments.Runs;

/// <summary>Lifecycle state of a run folder.</summary>
public enum RunState
{
    /// <summary>Nothing has run yet (no checkpoint, no metrics, no result).</summary>
    Pending,
    /// <summary>A live process holds run.lock.</summary>
    Running,
    /// <summary>Started, not finished, nobody holds it: resumable from its checkpoints.</summary>
    Interrupted,
    /// <summary>failed.json is present and nobody is retrying it.</summary>
    Failed,
    /// <summary>summary.json says "done".</summary>
    Done,
}
