namespace HybridRL.Tests.Training.Grid;

/// <summary>
/// A circuit agent trained by DQN (Mnih et al. 2015; Double DQN, van Hasselt et al. 2016) on the dock-3x4
/// slippery-warehouse map learns a greedy policy whose exact expected return (policy evaluation on the
/// environment's tabular model, Sutton &amp; Barto 2018 §4.1) is within 5% of the optimum found by value
/// iteration (§4.4), for at least 4 of 5 seeds. Training and oracle use the same discount γ = 0.99; the
/// time limit (max_steps) is a truncation, which the trainer bootstraps through, so the infinite-horizon
/// oracle is the right reference. The settings are those of configs/quickstart.yaml with its
/// budget cut to 5000 steps (ε decay 2500, target copy every 100) to keep the test short.
/// </summary>
public sealed class DeepQGridLearningTests
{
    internal const double Gamma = 0.99;

    private static string QuickstartPath
    {
        get
        {
            var dir = new DirectoryInfo(AppContext.BaseDirectory);
            while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "configs", "quickstart.yaml"))) dir = dir.Parent;
            return Path.Combine(dir?.FullName ?? throw new DirectoryNotFoundException("configs/quickstart.yaml not found above the test folder"), "configs", "quickstart.yaml");
        }
    }

    [Fact]
    public void Quickstart_dqn_reaches_within_five_percent_of_optimal_for_four_of_five_seeds()
    {
        string yaml = File.ReadAllText(QuickstartPath);
        ulong[] seeds = [1, 2, 3, 4, 5];
        var results = new TrainedGrid[seeds.Length];
        // Two seeds at a time (two cores); each run is deterministic on its own, so the order does not matter.
        Parallel.For(0, seeds.Length, new ParallelOptions { MaxDegreeOfParallelism = 2 },
            i => results[i] = GridTraining.Train(GridTraining.Spec(yaml, $"experiment.seed={seeds[i]}", "experiment.budget.env_steps=5000",
                "trainer.dqn.epsilon_decay_steps=2500", "trainer.dqn.target_update_every=100", "trainer.dqn.replay_capacity=5000"), Gamma));
        // Reference optimum: exact value iteration on the same tabular model, 0.474298 at γ = 0.99 (docs, config comment).
        Assert.All(results, r => Assert.Equal(0.474298, r.OptimalReturn, 5));
        int within = results.Count(r => r.WithinOf(0.05));
        Assert.True(within >= 4, $"{within} of 5 seeds within 5% of optimal:\n" + string.Join("\n", results.Select((r, i) => $"seed {seeds[i]}: {r}")));
    }
}
