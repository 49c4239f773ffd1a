using System.Globalization;
using System.Text;

namespace HybridRL.Experiments.Estimation;

/// <summary>Plain-text rendering of run and sweep cost estimates for the terminal.</summary>
public static class CostEstimateText
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    public static string Format(RunCostEstimate e)
    {
        var sb = new StringBuilder();
        sb.AppendLine($"Estimate for {e.Label} ({e.TrainerKind}; budget {e.Budget}; predicted to stop by {e.LimitedBy})");
        sb.AppendLine($"  calibration: {Seconds(e.CalibrationSeconds)} of real training on this node");
        foreach (var p in e.Phases.Where(p => p.Units > 0))
            sb.AppendLine($"    {p.Name}: {p.Units} unit(s) in {Seconds(p.Seconds)} = {Rate(p)}");
        sb.AppendLine($"  predicted wall time: {Seconds(e.PredictedWallSeconds)}{(e.LowerBound ? " (lower bound)" : "")}" +
            $" for {Count(e.PredictedEnvSteps)} environment steps, {e.Checkpoints} checkpoint(s)");
        sb.AppendLine($"  predicted circuit executions: {Count(e.PredictedCircuitExecutions)} simulated, {Count(e.PredictedHardwareExecutions)} hardware-equivalent");
        sb.AppendLine($"  predicted peak memory: {Bytes(e.PredictedPeakMemoryBytes)} (measured {Bytes(e.MeasuredPeakMemoryBytes)} during calibration)");
        sb.AppendLine($"  predicted checkpoint size: {Bytes(e.PredictedCheckpointBytes)} each (measured {Bytes(e.MeasuredCheckpointBytes)}), " +
            $"{Bytes(e.PredictedCheckpointDiskBytes)} on disk with {e.KeptCheckpoints} kept");
        sb.AppendLine($"  suggested Slurm time limit: --time={e.SuggestedTime}");
        sb.AppendLine($"  method: {e.Method}");
        return sb.ToString();
    }

    public static string Format(SweepCostEstimate s)
    {
        var sb = new StringBuilder();
        sb.AppendLine($"Estimate for sweep {s.SweepName}: {s.Runs.Count} run(s), {s.CalibratedConfigurations} configuration(s) calibrated (runs differing only by seed share one)");
        int w = Math.Max(3, s.Runs.Count == 0 ? 3 : s.Runs.Max(r => r.Label.Length));
        sb.AppendLine($"  {"run".PadRight(w)}  {"wall time",12}  {"peak memory",12}  {"checkpoint",12}  --time");
        foreach (var r in s.Runs)
            sb.AppendLine($"  {r.Label.PadRight(w)}  {Seconds(r.PredictedWallSeconds),12}  {Bytes(r.PredictedPeakMemoryBytes),12}  {Bytes(r.PredictedCheckpointBytes),12}  {r.SuggestedTime}");
        sb.AppendLine($"  total wall time (one run after another): {Seconds(s.TotalWallSeconds)}; longest run: {Seconds(s.MaxWallSeconds)}{(s.AnyLowerBound ? " (some are lower bounds)" : "")}");
        sb.AppendLine($"  largest peak memory per run: {Bytes(s.MaxPeakMemoryBytes)}; largest checkpoint: {Bytes(s.MaxCheckpointBytes)}; checkpoints on disk, all runs: {Bytes(s.TotalCheckpointDiskBytes)}");
        sb.AppendLine($"  predicted hardware-equivalent circuit executions, all runs: {Count(s.TotalHardwareExecutions)}");
        sb.AppendLine($"  suggested Slurm time limit per array task: --time={s.SuggestedTimePerTask}");
        if (s.Runs.Count > 0) sb.AppendLine($"  method: {s.Runs[0].Method}");
        return sb.ToString();
    }

    private static string Rate(CalibrationPhase p)
    {
        string perSecond = p.UnitsPerSecond.ToString("0.##", Inv);
        return p.Generations > 0
            ? $"{perSecond} generations/s ({p.EnvStepsPerUnit.ToString("0.#", Inv)} steps per generation)"
            : $"{perSecond} steps/s";
    }

    public static string Seconds(double s)
    {
        if (double.IsNaN(s)) return "–";
        if (s < 60) return s.ToString("0.0", Inv) + " s";
        var t = TimeSpan.FromSeconds(Math.Ceiling(s));
        return t.TotalHours >= 1 ? $"{(long)t.TotalHours}h {t.Minutes:00}m {t.Seconds:00}s" : $"{t.Minutes}m {t.Seconds:00}s";
    }

    public static string Bytes(long b) => b switch
    {
        < 1024 => b.ToString(Inv) + " B",
        < 1024 * 1024 => (b / 1024.0).ToString("0.0", Inv) + " KiB",
        < 1024L * 1024 * 1024 => (b / (1024.0 * 1024)).ToString("0.0", Inv) + " MiB",
        _ => (b / (1024.0 * 1024 * 1024)).ToString("0.00", Inv) + " GiB",
    };

    private static string Count(double v) => double.IsNaN(v) ? "–" : Math.Round(v).ToString("N0", Inv);
}
