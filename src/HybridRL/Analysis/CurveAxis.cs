namespace HybridRL.Analysis;

/// <summary>The x axis learning curves are aligned on: one metrics.csv column.</summary>
public enum CurveAxis
{
    EnvSteps,
    Episodes,
    CircuitExecutions,
    HardwareExecutions,
    Shots,
    WallSeconds,
}
