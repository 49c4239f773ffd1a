namespace HybridRL.Training;

/// <summary>
/// When a run stops: whichever limit is reached first. Zero means "no limit" for that measure;
/// at least one limit must be set.
/// </summary>
public sealed record TrainingBudget(long EnvSteps = 0, long Episodes = 0, long Generations = 0, long CircuitExecutions = 0, double WallSeconds = 0)
{
    public bool IsUnlimited => EnvSteps <= 0 && Episodes <= 0 && Generations <= 0 && CircuitExecutions <= 0 && WallSeconds <= 0;

    /// <summary>The name of the first limit reached, or null while the run should go on.</summary>
    public string? ReachedBy(TrainingCounters c)
    {
        if (EnvSteps > 0 && c.EnvSteps >= EnvSteps) return "env_steps";
        if (Episodes > 0 && c.Episodes >= Episodes) return "episodes";
        if (Generations > 0 && c.Generations >= Generations) return "generations";
        if (CircuitExecutions > 0 && c.CircuitExecutions >= CircuitExecutions) return "circuit_executions";
        if (WallSeconds > 0 && c.WallSeconds >= WallSeconds) return "wall_seconds";
        return null;
    }

    /// <summary>Fraction of the budget used, by the measure closest to its limit (for progress bars and schedules).</summary>
    public double Progress(TrainingCounters c)
    {
        double p = 0;
        if (EnvSteps > 0) p = Math.Max(p, (double)c.EnvSteps / EnvSteps);
        if (Episodes > 0) p = Math.Max(p, (double)c.Episodes / Episodes);
        if (Generations > 0) p = Math.Max(p, (double)c.Generations / Generations);
        if (CircuitExecutions > 0) p = Math.Max(p, (double)c.CircuitExecutions / CircuitExecutions);
        if (WallSeconds > 0) p = Math.Max(p, c.WallSeconds / WallSeconds);
        return Math.Clamp(p, 0, 1);
    }

    /// <summary>Progress without the wall-clock measure: schedules use this so results do not depend on machine speed.</summary>
    public double DeterministicProgress(TrainingCounters c) => (this with { WallSeconds = 0 }).Progress(c);
}
