using HybridRL.Checkpoints;
using HybridRL.Experiments.Config;
using HybridRL.Training;

namespace HybridRL.Experiments;

/// <summary>
/// The one way a run's checkpoint is assembled: every trainer section, the training loop's state and the
/// resolved config, under a header naming trainer kind, config hash and step. Used by training sessions and
/// by the cost estimate (which measures the size of a real checkpoint).
/// </summary>
public static class RunCheckpoint
{
    /// <summary>Writes a checkpoint of <paramref name="trainer"/> into <paramref name="checkpointsDir"/> and returns its path.</summary>
    public static string Save(ITrainer trainer, Action<BinaryWriter> loopState, ExperimentSpec spec, string checkpointsDir, double? score,
        params (string Name, Action<BinaryWriter> Write)[] extraSections)
    {
        ArgumentNullException.ThrowIfNull(trainer);
        ArgumentNullException.ThrowIfNull(loopState);
        ArgumentNullException.ThrowIfNull(spec);
        var writer = new CheckpointWriter();
        trainer.Save((name, write) => writer.AddSection(name, write));
        writer.AddSection("loop", loopState);
        foreach (var (name, write) in extraSections) writer.AddSection(name, write);
        writer.AddSection("config", w => w.Write(spec.ToYaml()));
        var header = new CheckpointHeader { TrainerKind = trainer.Kind, ConfigHash = spec.Hash(), Step = trainer.Counters.EnvSteps };
        return writer.Save(checkpointsDir, trainer.Counters.EnvSteps, header, score, spec.Logging.KeepCheckpoints);
    }
}
