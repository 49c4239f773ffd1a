namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// Trains (or resumes) one run of a sweep. Implemented by the application with train/resume; must take the run folder's lock,
/// write the run folder <c>&lt;runsDir&gt;/&lt;runName&gt;/&lt;runId&gt;/</c>, and return the shared exit codes
/// (0 done, 1 failure, 2 invalid input, 3 interrupted after a checkpoint).
/// </summary>
public interface ITrainTask
{
    /// <param name="baseConfigPath">Absolute path of the base experiment file.</param>
    /// <param name="overrides"><c>key=value</c> settings applied on top of the base, as with <c>--set</c>.</param>
    /// <param name="runsDir">Absolute runs folder.</param>
    /// <param name="runName">Run name (the sweep name).</param>
    /// <param name="runId">Run id (stable, from the sweep).</param>
    /// <param name="ct">Cancelled on SIGINT/SIGTERM/SIGUSR1: checkpoint and return 3.</param>
    int Run(string baseConfigPath, IReadOnlyList<string> overrides, string runsDir, string runName, string runId, CancellationToken ct);
}
