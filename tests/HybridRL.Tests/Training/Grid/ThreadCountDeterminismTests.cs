namespace HybridRL.Tests.Training.Grid;

/// <summary>
/// DESIGN.md, Determinism: results for a seed must not depend on the number of threads. The same spec is trained
/// with model.simulation.threads = 1 and = 2 (evolution: that many population workers; deep Q: simulator threads)
/// and every metrics row must match exactly, apart from the wall-clock column.
/// </summary>
public sealed class ThreadCountDeterminismTests
{
    private const string Environment = """
        experiment:
          name: thread-determinism
          seed: 11
          budget:
            {0}
        environment:
          kind: slippery-warehouse
          map: dock-3x4
          observation: binary
          max_steps: 60
        model:
          circuit:
            qubits: 4
            layers: 2
            encoding: angle
            input_squash: none
            readout: per_action
          simulation:
            mode: exact
            threads: 1
        """;

    [Theory]
    [InlineData("cma_es", "cma_es:\n    population: 12\n    episodes_per_member: 3\n    eval_every: 2\n    eval_episodes: 3")]
    [InlineData("evolution_strategies", "evolution_strategies:\n    population: 12\n    episodes_per_member: 3\n    eval_every: 2\n    eval_episodes: 3")]
    [InlineData("genetic", "genetic:\n    population: 12\n    episodes_per_member: 3\n    eval_every: 2\n    eval_episodes: 3")]
    [InlineData("genetic", "genetic:\n    population: 12\n    elites: 2\n    elite_episodes: 4\n    episodes_per_member: 3\n    eval_every: 2\n    eval_episodes: 3")]
    public void Evolution_rows_are_identical_for_one_and_two_workers(string kind, string section)
    {
        string yaml = string.Format(Environment, "generations: 6") + $"\ntrainer:\n  kind: {kind}\n  {section}\nlogging:\n  metrics_every_steps: 1\n";
        var one = GridTraining.Train(GridTraining.Spec(yaml, "model.simulation.threads=1"), 0.99);
        var two = GridTraining.Train(GridTraining.Spec(yaml, "model.simulation.threads=2"), 0.99);
        Assert.Equal(6, one.Rows.Count); // one row per generation (metrics_every_steps: 1)
        Assert.Equal(GridTraining.WithoutWallClock(one.Rows), GridTraining.WithoutWallClock(two.Rows));
        Assert.Equal(one.Policy, two.Policy);
    }

    [Theory]
    [InlineData("shots", "model.simulation.shots=64")]
    [InlineData("trajectories", "model.simulation.noise.depolarizing=0.02")]
    public void Evolution_with_sampled_outputs_is_identical_for_one_two_and_three_workers(string mode, string extra)
    {
        // Shot and trajectory sampling draw random numbers inside the circuit engine: each member must draw the same ones
        // whichever worker evaluates it.
        string yaml = string.Format(Environment, "generations: 4") +
            "\ntrainer:\n  kind: cma_es\n  cma_es:\n    population: 10\n    episodes_per_member: 2\n    eval_every: 2\n    eval_episodes: 2\nlogging:\n  metrics_every_steps: 1\n";
        var runs = new[] { 1, 2, 3 }.Select(t => GridTraining.Train(GridTraining.Spec(yaml, $"model.simulation.mode={mode}", extra, $"model.simulation.threads={t}"), 0.99)).ToArray();
        Assert.Equal(4, runs[0].Rows.Count);
        Assert.True(runs[0].Rows[^1].Shots > 0 || mode == "trajectories");
        for (int i = 1; i < runs.Length; i++)
        {
            Assert.Equal(GridTraining.WithoutWallClock(runs[0].Rows), GridTraining.WithoutWallClock(runs[i].Rows));
            Assert.Equal(runs[0].Policy, runs[i].Policy);
        }
    }

    [Fact]
    public void Deep_q_rows_are_identical_for_one_and_two_simulator_threads()
    {
        string yaml = string.Format(Environment, "env_steps: 400") + """

            trainer:
              kind: dqn
              dqn:
                replay_capacity: 400
                warmup_steps: 50
                batch_size: 16
                target_update_every: 50
                epsilon_decay_steps: 300
                learning_rate: 0.02
                eval_every: 200
                eval_episodes: 3
            logging:
              metrics_every_steps: 50
            """;
        var one = GridTraining.Train(GridTraining.Spec(yaml, "model.simulation.threads=1"), 0.99);
        var two = GridTraining.Train(GridTraining.Spec(yaml, "model.simulation.threads=2"), 0.99);
        Assert.Equal(8, one.Rows.Count);
        Assert.Equal(GridTraining.WithoutWallClock(one.Rows), GridTraining.WithoutWallClock(two.Rows));
        Assert.Equal(one.Policy, two.Policy);
    }
}
