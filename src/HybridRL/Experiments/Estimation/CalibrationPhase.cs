namespace HybridRL.Experiments.Estimation;

/// <summary>
/// What the calibration measured in one phase of training (deep Q: warm-up without updates, then learning;
/// evolution: generations): units of work, their wall time and the counters they advanced.
/// </summary>
public sealed record CalibrationPhase(string Name, long Units, double Seconds, long EnvSteps, long Episodes, long Generations,
    long CircuitExecutions, long HardwareExecutions)
{
    public double SecondsPerUnit => Units > 0 ? Seconds / Units : double.NaN;
    public double UnitsPerSecond => Seconds > 0 ? Units / Seconds : double.NaN;
    public double EnvStepsPerUnit => Units > 0 ? (double)EnvSteps / Units : double.NaN;
    public double EpisodesPerUnit => Units > 0 ? (double)Episodes / Units : double.NaN;
    public double GenerationsPerUnit => Units > 0 ? (double)Generations / Units : double.NaN;
    public double CircuitExecutionsPerUnit => Units > 0 ? (double)CircuitExecutions / Units : double.NaN;
    public double HardwareExecutionsPerUnit => Units > 0 ? (double)HardwareExecutions / Units : double.NaN;
}
