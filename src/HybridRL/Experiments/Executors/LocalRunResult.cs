namespace HybridRL.Experiments.Executors;

/// <summary>What happened to one run during <c>sweep run</c>.</summary>
public enum LocalRunResult
{
    /// <summary>Exit code 0.</summary>
    Done,
    /// <summary>Exit code 3: interrupted after a checkpoint; the next <c>sweep run</c> resumes it.</summary>
    Interrupted,
    /// <summary>Any other exit code, or the child could not be started.</summary>
    Failed,
    /// <summary>Already finished (summary.json with status done); not started.</summary>
    SkippedDone,
    /// <summary>Another process holds the run (live run.lock); not started.</summary>
    SkippedRunning,
    /// <summary>Not started because the sweep was cancelled first.</summary>
    NotStarted,
}
