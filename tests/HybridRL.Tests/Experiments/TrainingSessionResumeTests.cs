using HybridRL.Experiments;
using HybridRL.Experiments.Config;
using HybridRL.Experiments.Runs;
using HybridRL.Logging;
using HybridRL.Tests.Sweeps;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Experiments;

public class TrainingSessionResumeTests
{
    [Fact]
    public void A_run_folder_with_checkpoints_is_not_resumed_under_a_changed_config()
    {
        using var dir = new TempDirectory();
        string basePath = dir.Combine("tiny.yaml");
        File.Copy(SweepTestFiles.TinyWarehousePath, basePath);
        var env = new Dictionary<string, string>();
        var original = ExperimentSpecLoader.Load([basePath], [], env);
        // a run folder as an interrupted run leaves it: its resolved config and a checkpoint
        var folder = RunFolder.For(dir.Path, "tiny", "fixed-id").EnsureCreated();
        File.WriteAllText(folder.ConfigPath, original.ToAnnotatedYaml());
        File.WriteAllText(Path.Combine(folder.CheckpointsDir, "ckpt-000000000100.hrlc"), "x");

        var changed = ExperimentSpecLoader.Load([basePath], ["model.circuit.layers=2"], env);
        var session = TrainingSession.Create(changed, dir.Path, "tiny", "fixed-id", Verbosity.Quiet, TextWriter.Null);
        var e = Assert.Throws<ConfigException>(() => session.Run(CancellationToken.None));
        Assert.Contains("model.circuit.layers", e.Message);
        Assert.Contains("different config", e.Message);
        Assert.Equal(original.ToAnnotatedYaml(), File.ReadAllText(folder.ConfigPath)); // the saved config is left as it was
        Assert.False(File.Exists(folder.LockPath)); // and the lock released
    }
}
