namespace HybridRL.Experiments.Executors;

/// <summary>All outcomes of a <c>sweep run</c>, in run order, and the exit code for the command.</summary>
public sealed record LocalSweepReport(IReadOnlyList<LocalRunOutcome> Outcomes, bool Cancelled)
{
    /// <summary>1 when any run failed; else 3 when any run was interrupted or not started (re-run to continue); else 0.</summary>
    public int ExitCode =>
        Outcomes.Any(o => o.Result == LocalRunResult.Failed) ? 1
        : Outcomes.Any(o => o.Result is LocalRunResult.Interrupted or LocalRunResult.NotStarted) || Cancelled ? 3
        : 0;

    /// <summary>Peak number of children that ran at once.</summary>
    public int PeakConcurrency { get; init; }
}
