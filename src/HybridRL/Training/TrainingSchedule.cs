namespace HybridRL.Training;

/// <summary>How often the loop writes metrics rows and checkpoints, in environment steps (a unit that crosses a boundary triggers it).</summary>
public sealed record TrainingSchedule(long MetricsEverySteps, long CheckpointEverySteps);
