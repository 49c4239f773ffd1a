namespace HybridRL.Analysis;

/// <summary>Names of <see cref="CurveAxis"/> values: the metrics column and a human axis label.</summary>
public static class CurveAxes
{
    public static string Column(CurveAxis axis) => axis switch
    {
        CurveAxis.EnvSteps => "env_steps",
        CurveAxis.Episodes => "episodes",
        CurveAxis.CircuitExecutions => "circuit_executions",
        CurveAxis.HardwareExecutions => "hardware_executions",
        CurveAxis.Shots => "shots",
        CurveAxis.WallSeconds => "wall_seconds",
        _ => throw new ArgumentOutOfRangeException(nameof(axis), axis, null),
    };

    public static string Label(CurveAxis axis) => axis switch
    {
        CurveAxis.EnvSteps => "Environment steps",
        CurveAxis.Episodes => "Episodes",
        CurveAxis.CircuitExecutions => "Circuit executions (simulated)",
        CurveAxis.HardwareExecutions => "Hardware-equivalent circuit executions",
        CurveAxis.Shots => "Shots",
        CurveAxis.WallSeconds => "Wall-clock seconds",
        _ => throw new ArgumentOutOfRangeException(nameof(axis), axis, null),
    };

    /// <summary>Parses a metrics column name (env_steps, episodes, circuit_executions, hardware_executions, shots, wall_seconds) or a short alias.</summary>
    public static CurveAxis Parse(string text)
    {
        ArgumentNullException.ThrowIfNull(text);
        return text.Trim().ToLowerInvariant().Replace('-', '_') switch
        {
            "env_steps" or "steps" => CurveAxis.EnvSteps,
            "episodes" => CurveAxis.Episodes,
            "circuit_executions" or "executions" => CurveAxis.CircuitExecutions,
            "hardware_executions" => CurveAxis.HardwareExecutions,
            "shots" => CurveAxis.Shots,
            "wall_seconds" or "seconds" => CurveAxis.WallSeconds,
            _ => throw new ArgumentException(
                $"unknown curve axis '{text}'; expected one of env_steps, episodes, circuit_executions, hardware_executions, shots, wall_seconds", nameof(text)),
        };
    }
}
