using HybridRL.Tests.Support;

namespace HybridRL.Tests.Resume;

/// <summary>Resume refuses config changes that alter the computation (listing the keys) and accepts a larger budget.</summary>
public sealed class ConfigChangeOnResumeTests
{
    [Fact]
    public void ChangedTrainerSettingsAreRefusedAndALargerBudgetContinuesTheRun()
    {
        var scenario = ResumeScenario.For("dqn").With("experiment.budget.env_steps=120");
        using var tmp = new TempDirectory();
        string config = scenario.WriteConfig(tmp.Path);
        string runs = tmp.Combine("runs");
        scenario.RunToEnd(config, runs);
        string runDir = scenario.RunDir(runs);
        string metricsBefore = File.ReadAllText(Path.Combine(runDir, "metrics.csv"));

        var (code, stdout, stderr) = CliProcess.Run(ResumeScenario.ResumeArgs(runDir, "trainer.dqn.learning_rate=0.02", "trainer.dqn.gamma=0.9"));
        Assert.True(code == 2, $"resume with a changed learning rate exited {code}\n{stdout}\n{stderr}");
        Assert.Contains("trainer.dqn.learning_rate", stderr);
        Assert.Contains("trainer.dqn.gamma", stderr);
        Assert.Equal(metricsBefore, File.ReadAllText(Path.Combine(runDir, "metrics.csv"))); // nothing was touched

        (code, stdout, stderr) = CliProcess.Run(ResumeScenario.ResumeArgs(runDir, "experiment.budget.env_steps=200"));
        Assert.True(code == 0, $"resume with a larger budget exited {code}\n{stdout}\n{stderr}");
        string log = File.ReadAllText(Path.Combine(runDir, "log.json"));
        Assert.Contains("experiment.budget.env_steps", log);
        var rows = File.ReadAllLines(Path.Combine(runDir, "metrics.csv"));
        Assert.StartsWith("200,", rows[^1]);
        Assert.Contains(rows, r => r.StartsWith("120,", StringComparison.Ordinal)); // the rows of the first part stay
        Assert.Equal(rows.Length, rows.Distinct().Count());
        string summary = File.ReadAllText(Path.Combine(runDir, "summary.json"));
        Assert.Contains("\"env_steps\": 200", summary);
        Assert.Contains("env_steps: 200", File.ReadAllText(Path.Combine(runDir, "config.yaml")));
    }
}
