using HybridRL.Environments;

namespace HybridRL.Tests.Training.Grid;

/// <summary>
/// The evolution trainer runs the extra episodes genetic search asks for its carried-over elites
/// (trainer.genetic.elite_episodes), and the warehouse's exploring-starts option (start: random) spreads the start
/// distribution over every non-terminal cell.
/// </summary>
public sealed class EliteEpisodesTests
{
    [Fact]
    public void Elites_get_their_extra_episodes()
    {
        const string yaml = """
            experiment:
              name: elite-episodes
              seed: 3
              budget:
                generations: 3
            environment:
              kind: slippery-warehouse
              map: dock-3x4
              observation: binary
              max_steps: 30
            model:
              circuit:
                qubits: 4
                layers: 1
                encoding: angle
                input_squash: none
                readout: per_action
              simulation:
                mode: exact
                threads: 1
            trainer:
              kind: genetic
              genetic:
                population: 6
                elites: 2
                elite_episodes: 3
                episodes_per_member: 2
                eval_every: 0
            logging:
              metrics_every_steps: 1
            """;
        var r = GridTraining.Train(GridTraining.Spec(yaml), 0.99);
        // Hand-worked count: generation 0 has one elite (the initial vector), later generations two;
        // 6 members × 2 episodes + elites × 3 extra = 15, 18, 18 episodes, cumulative 15, 33, 51.
        Assert.Equal([15L, 33L, 51L], r.Rows.Select(x => x.Episodes).ToArray());
    }

    [Fact]
    public void Random_start_is_uniform_over_non_terminal_cells()
    {
        var p = new Dictionary<string, string> { ["map"] = "dock-3x4", ["start"] = "random" };
        var model = SlipperyWarehouseSettings.Parse(p).ToTabularModel();
        // Hand-worked from the map "R.#./..o./o..D": 11 open cells, 2 hatches and 1 dock are terminal, so 8 starts of 1/8.
        for (int s = 0; s < model.StateCount; s++)
            Assert.Equal(model.IsTerminal(s) ? 0.0 : 1.0 / 8, model.StartDistribution[s], 15);
        var fixedStart = SlipperyWarehouseSettings.Parse(new Dictionary<string, string> { ["map"] = "dock-3x4" }).ToTabularModel();
        Assert.Equal(1.0, fixedStart.StartDistribution[0], 15); // the map's R cell is state 0
        Assert.Throws<EnvironmentConfigException>(() => SlipperyWarehouseSettings.Parse(new Dictionary<string, string> { ["start"] = "corner" }));

        using var env = new SlipperyWarehouseEnvironment(SlipperyWarehouseSettings.Parse(p));
        var obs = new double[env.ObservationSize];
        var seen = new HashSet<int>();
        for (ulong seed = 1; seed <= 400; seed++)
        {
            env.Reset(seed, obs);
            Assert.False(model.IsTerminal(env.StateIndex));
            seen.Add(env.StateIndex);
        }
        Assert.Equal(8, seen.Count); // every non-terminal cell is drawn as a start (400 draws; miss chance 8·(7/8)^400 ≈ 0)
    }
}
