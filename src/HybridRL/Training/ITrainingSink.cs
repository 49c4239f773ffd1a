namespace HybridRL.Training;

/// <summary>Where the loop's output goes: the run folder (metrics file, checkpoints) and the progress display.</summary>
public interface ITrainingSink
{
    /// <summary>A metrics row; <paramref name="rowIndex"/> counts rows from 0 across resumes.</summary>
    void OnMetrics(MetricsRow row, long rowIndex);

    /// <summary>Write a checkpoint now: the trainer's sections plus the loop's own state (<paramref name="loop"/>).</summary>
    void OnCheckpoint(ITrainer trainer, Action<BinaryWriter> loop, double? score);

    /// <summary>Called after every unit; cheap (throttle display inside).</summary>
    void OnProgress(ITrainer trainer, double progress);
}
