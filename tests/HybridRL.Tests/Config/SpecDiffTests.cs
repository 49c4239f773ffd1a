using HybridRL.Experiments.Config;

namespace HybridRL.Tests.Config;

public sealed class SpecDiffTests
{
    private static ExperimentSpec Quickstart(params string[] sets) =>
        ExperimentSpecLoader.Load([ConfigTestPaths.SmallWarehouseDqn], sets, new Dictionary<string, string>(), null);

    [Fact]
    public void Budget_and_logging_changes_are_safe_on_resume()
    {
        var diff = SpecDiff.Compare(Quickstart(), Quickstart("experiment.budget.env_steps=6000", "logging.progress_seconds=2", "logging.metrics_every_steps=100"));
        Assert.Equal(["experiment.budget.env_steps", "logging.metrics_every_steps", "logging.progress_seconds"], diff.Differences.Select(d => d.Key));
        Assert.True(diff.IsSafeForResume);
        var first = diff.Differences[0];
        Assert.Equal(("3000", "6000"), (first.Before, first.After));
    }

    [Fact]
    public void Model_trainer_and_environment_changes_are_not_safe()
    {
        var diff = SpecDiff.Compare(Quickstart(), Quickstart("trainer.dqn.gamma=0.9", "environment.slip_probability=0.3", "model.circuit.layers=3"));
        Assert.False(diff.IsSafeForResume);
        Assert.Equal(["environment.slip_probability", "model.circuit.layers", "trainer.dqn.gamma"], diff.UnsafeDifferences.Select(d => d.Key));
        Assert.Equal("\"0.2\"", diff.Differences[0].Before);
    }

    [Fact]
    public void Keys_that_appear_or_disappear_are_listed_as_absent()
    {
        var diff = SpecDiff.Compare(Quickstart(), Quickstart("trainer.dqn.target_update=polyak", "trainer.dqn.target_update_every=~"));
        Assert.Contains(diff.Differences, d => d.Key == "trainer.dqn.polyak_tau" && d.Before is null && d.After == "0.005");
        Assert.Contains(diff.Differences, d => d.Key == "trainer.dqn.target_update_every" && d.Before == "200" && d.After is null);
        Assert.Contains(diff.Differences, d => d.Key == "trainer.dqn.target_update" && d.Before == "hard" && d.After == "polyak");
    }

    [Fact]
    public void Safe_key_list_holds_budgets_logging_and_nothing_that_changes_training()
    {
        var safe = SpecDiff.SafeOnResumeKeys;
        Assert.Contains("experiment.budget.wall_seconds", safe);
        Assert.Contains("logging.checkpoint_every_steps", safe);
        Assert.DoesNotContain("experiment.seed", safe);
        Assert.DoesNotContain(safe, k => k.StartsWith("trainer.", StringComparison.Ordinal) || k.StartsWith("environment.", StringComparison.Ordinal));
    }
}
