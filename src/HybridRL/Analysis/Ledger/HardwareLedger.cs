namespace HybridRL.Analysis.Ledger;

/// <summary>
/// Hardware-cost ledger of one run: what was actually simulated (circuit executions, shots) and the
/// hardware-equivalent count (executions a device would have needed, with parameter-shift gradients and
/// <see cref="ShotsPerExecution"/> shots per expectation). <see cref="Estimate"/> turns it into device time and cost:
/// seconds = E·s·t_shot + E·t_circuit + ⌈E / circuits_per_job⌉·t_queue, cost = E·s·price_per_shot.
/// </summary>
public sealed record HardwareLedger(double CircuitExecutions, double Shots, double HardwareExecutions, double ShotsPerExecution)
{
    /// <summary>Sentence every output that shows estimates must carry.</summary>
    public const string Disclaimer =
        "Device time and cost are estimates computed from the user-supplied hardware profile; they are not vendor quotes.";

    public HardwareEstimate Estimate(HardwareProfile profile)
    {
        ArgumentNullException.ThrowIfNull(profile);
        if (double.IsNaN(HardwareExecutions) || HardwareExecutions < 0)
            throw new InvalidOperationException("hardware_executions is unknown or negative; cannot estimate device time");
        if (double.IsNaN(ShotsPerExecution) || ShotsPerExecution <= 0)
            throw new InvalidOperationException("shots per execution is unknown; give it explicitly (hardware accounting needs a finite shot count)");
        double e = HardwareExecutions;
        double shots = e * ShotsPerExecution;
        double jobs = Math.Ceiling(e / profile.CircuitsPerJob);
        return new HardwareEstimate(profile.Name, e, shots, jobs,
            shots * profile.SecondsPerShot,
            e * profile.PerCircuitOverheadSeconds,
            jobs * profile.QueueLatencySeconds,
            profile.PricePerShot is double p ? shots * p : null,
            profile.Currency);
    }

    /// <summary>Sum of per-run estimates (each run submits its own jobs, so job rounding is per run).</summary>
    public static HardwareEstimate Total(IReadOnlyList<HardwareEstimate> perRun, HardwareProfile profile)
    {
        double? cost = profile.PricePerShot is null ? null : perRun.Sum(r => r.Cost ?? 0);
        return new HardwareEstimate(profile.Name, perRun.Sum(r => r.HardwareExecutions), perRun.Sum(r => r.HardwareShots),
            perRun.Sum(r => r.Jobs), perRun.Sum(r => r.ShotSeconds), perRun.Sum(r => r.OverheadSeconds), perRun.Sum(r => r.QueueSeconds),
            cost, profile.Currency);
    }

    /// <summary>
    /// Ledger of a run from summary.json (falling back to the last metrics row). Shots per execution: the override,
    /// else summary ledger.shots_per_execution, else NaN (unknown).
    /// </summary>
    public static HardwareLedger FromRun(RunFolder run, double? shotsPerExecution = null)
    {
        ArgumentNullException.ThrowIfNull(run);
        double Get(string key)
        {
            double v = run.SummaryNumber(key);
            return double.IsNaN(v) ? run.Metrics.LastValue(key) : v;
        }
        double spe = shotsPerExecution ?? run.SummaryNumber("ledger.shots_per_execution");
        return new HardwareLedger(Get("circuit_executions"), Get("shots"), Get("hardware_executions"), spe);
    }
}
