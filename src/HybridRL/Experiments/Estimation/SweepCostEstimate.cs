namespace HybridRL.Experiments.Estimation;

/// <summary>Predicted cost of every run of a sweep: sums (serial time, disk) and per-run maxima (array-task limits).</summary>
public sealed record SweepCostEstimate(string SweepName, IReadOnlyList<RunCostEstimate> Runs, int CalibratedConfigurations, string SuggestedTimePerTask)
{
    public double TotalWallSeconds => Runs.Sum(r => r.PredictedWallSeconds);
    public double MaxWallSeconds => Runs.Count == 0 ? 0 : Runs.Max(r => r.PredictedWallSeconds);
    public long MaxPeakMemoryBytes => Runs.Count == 0 ? 0 : Runs.Max(r => r.PredictedPeakMemoryBytes);
    public long MaxCheckpointBytes => Runs.Count == 0 ? 0 : Runs.Max(r => r.PredictedCheckpointBytes);
    public long TotalCheckpointDiskBytes => Runs.Sum(r => r.PredictedCheckpointDiskBytes);
    public double TotalHardwareExecutions => Runs.Sum(r => r.PredictedHardwareExecutions);
    public bool AnyLowerBound => Runs.Any(r => r.LowerBound);
}
