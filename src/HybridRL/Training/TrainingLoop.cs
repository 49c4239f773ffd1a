using System.Diagnostics;

namespace HybridRL.Training;

/// <summary>
/// Drives any <see cref="ITrainer"/> to its budget: units of work, metrics rows and checkpoints at
/// step boundaries, a NaN/Inf guard, and cancellation that finishes the current unit, writes a
/// checkpoint and returns <see cref="TrainingOutcome.Interrupted"/>. The loop's own state (next
/// boundaries) and the metrics cursor in the counters are part of every checkpoint, so a resumed run writes exactly the
/// rows an uninterrupted one would.
/// </summary>
public sealed class TrainingLoop(ITrainer trainer, TrainingBudget budget, TrainingSchedule schedule, ITrainingSink sink)
{
    private long _nextMetricsAt = schedule.MetricsEverySteps;
    private long _nextCheckpointAt = schedule.CheckpointEverySteps;

    public void SaveState(BinaryWriter w)
    {
        w.Write(_nextMetricsAt);
        w.Write(_nextCheckpointAt);
    }

    public void LoadState(BinaryReader r)
    {
        _nextMetricsAt = r.ReadInt64();
        _nextCheckpointAt = r.ReadInt64();
    }

    public TrainingOutcome Run(CancellationToken cancel)
    {
        if (budget.IsUnlimited) throw new ArgumentException("the budget has no limit: set one of experiment.budget.env_steps, episodes, generations, circuit_executions or wall_seconds");
        var c = trainer.Counters;
        var clock = Stopwatch.StartNew();
        double wallAtStart = c.WallSeconds;
        while (budget.ReachedBy(c) is null)
        {
            if (cancel.IsCancellationRequested)
            {
                Checkpoint();
                return TrainingOutcome.Interrupted;
            }
            trainer.RunUnit(budget);
            c.WallSeconds = wallAtStart + clock.Elapsed.TotalSeconds;
            trainer.CheckFinite();

            bool final = budget.ReachedBy(c) is not null;
            if (c.EnvSteps >= _nextMetricsAt || final)
            {
                WriteRow();
                while (_nextMetricsAt <= c.EnvSteps) _nextMetricsAt += Math.Max(1, schedule.MetricsEverySteps);
            }
            if (c.EnvSteps >= _nextCheckpointAt || final)
            {
                while (_nextCheckpointAt <= c.EnvSteps) _nextCheckpointAt += Math.Max(1, schedule.CheckpointEverySteps);
                Checkpoint();
            }
            sink.OnProgress(trainer, budget.Progress(c));
        }
        return TrainingOutcome.Completed;
    }

    private void WriteRow()
    {
        var row = trainer.Metrics(MetricsRow.FromCounters(trainer.Counters, trainer.ParameterCount));
        sink.OnMetrics(row, trainer.Counters.MetricsRows);
        trainer.Counters.MetricsRows++;
    }

    private void Checkpoint() => sink.OnCheckpoint(trainer, SaveState, trainer.LatestEvaluation);
}
