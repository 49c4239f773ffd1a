using System.Text.Json;
using HybridRL.Experiments;
using HybridRL.Experiments.Config;
using HybridRL.Logging;
using HybridRL.Tests.Config;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Experiments;

/// <summary>
/// resources.json of a classical run: like <c>hybridrl inspect</c>, it names the model and leaves out the circuit and
/// the circuit executions (hybrid runs are checked against inspect in ReportTests).
/// </summary>
public sealed class RunResourcesOnRunTests
{
    [Fact]
    public void Classical_run_writes_resources_without_a_circuit()
    {
        using var dir = new TempDirectory();
        var spec = ExperimentSpecLoader.Load([Path.Combine(ConfigTestPaths.ConfigsFolder, "classical-baseline.yaml")],
        [
            "experiment.budget.env_steps=40", "trainer.dqn.warmup_steps=32", "trainer.dqn.replay_capacity=100", "trainer.dqn.eval_every=0",
            "logging.metrics_every_steps=20", "logging.checkpoint_every_steps=40", "logging.final_eval_episodes=1",
        ], new Dictionary<string, string>());
        var session = TrainingSession.Create(spec, dir.Path, null, null, Verbosity.Quiet, TextWriter.Null);
        Assert.Equal(ExitCodes.Done, session.Run(CancellationToken.None));

        var resources = JsonDocument.Parse(File.ReadAllText(session.Folder.ResourcesPath)).RootElement;
        Assert.Equal("classical", resources.GetProperty("model").GetString());
        Assert.False(resources.TryGetProperty("circuit", out _));
        Assert.False(resources.TryGetProperty("executions", out _));
    }
}
