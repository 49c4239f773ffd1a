namespace HybridRL.Experiments.Config;

/// <summary>The <c>logging</c> section: metrics, progress, checkpoints and the final evaluation.</summary>
public sealed record LoggingSettings
{
    /// <summary>Env steps between metrics rows (evolution trainers write at the first generation end past each interval).</summary>
    public required long MetricsEverySteps { get; init; }
    public required double ProgressSeconds { get; init; }
    /// <summary>Env steps between checkpoints (evolution trainers checkpoint at generation ends); 0 = only at the end.</summary>
    public required long CheckpointEverySteps { get; init; }
    public required int KeepCheckpoints { get; init; }
    /// <summary>Episodes of the greedy evaluation at the end of the run (eval-final.json); 0 = skip.</summary>
    public required int FinalEvalEpisodes { get; init; }
}
