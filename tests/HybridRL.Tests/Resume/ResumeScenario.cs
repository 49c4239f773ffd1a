using System.Diagnostics;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Resume;

/// <summary>
/// A tiny experiment (config file plus --set overrides) run through the real CLI into a run folder,
/// with helpers to train, resume, kill and read the result.
/// Configs are small versions of configs/quickstart.yaml (slippery warehouse, an invented scenario) and the
/// cart-pole evolution examples, with checkpoints at (almost) every unit so kills often land mid-write.
/// </summary>
public sealed class ResumeScenario
{
    public const string RunId = "r";

    private ResumeScenario(string name, string yaml, string[] sets)
    {
        Name = name;
        Yaml = yaml;
        Sets = sets;
    }

    public string Name { get; }
    public string Yaml { get; }
    public string[] Sets { get; }

    public static ResumeScenario For(string trainer) => trainer switch
    {
        "dqn" => new ResumeScenario(trainer, DqnYaml, []),
        "genetic" => new ResumeScenario(trainer, Evolution("genetic", "population: 8\n    truncation: 0.25\n    mutation_sigma: 0.1\n    elites: 1\n    episodes_per_member: 1"), []),
        "evolution_strategies" => new ResumeScenario(trainer, Evolution("evolution_strategies", "population: 8\n    sigma: 0.1\n    learning_rate: 0.05\n    episodes_per_member: 1"), []),
        "cma_es" => new ResumeScenario(trainer, Evolution("cma_es", "population: 8\n    sigma0: 0.5\n    episodes_per_member: 1"), []),
        _ => throw new ArgumentException(trainer),
    };

    public ResumeScenario With(params string[] sets) => new(Name, Yaml, [.. Sets, .. sets]);

    private const string DqnYaml = """
        experiment:
          name: resume-dqn
          seed: 11
          budget:
            env_steps: 300
        environment:
          kind: slippery-warehouse
          map: dock-3x4
          observation: binary
          slip_probability: 0.2
          step_cost: 0.01
          max_steps: 40
        model:
          circuit:
            qubits: 4
            layers: 2
            encoding: angle
            rotations: [ry, rz]
            entangler: ring
            readout: per_action
          simulation:
            mode: exact
            gradient: adjoint
        trainer:
          kind: dqn
          dqn:
            replay_capacity: 400
            warmup_steps: 50
            batch_size: 8
            target_update: hard
            target_update_every: 50
            gamma: 0.95
            epsilon_decay_steps: 200
            optimizer: adam
            learning_rate: 0.01
            learning_rate_schedule: cosine
            eval_every: 100
            eval_episodes: 3
        logging:
          metrics_every_steps: 25
          checkpoint_every_steps: 5
          keep_checkpoints: 3
          final_eval_episodes: 5
        """;

    private static string Evolution(string kind, string settings) => $"""
        experiment:
          name: resume-{kind.Replace('_', '-')}
          seed: 5
          budget:
            generations: 40
        environment:
          kind: cart-pole
          max_steps: 60
        model:
          circuit:
            qubits: 4
            layers: 2
            encoding: reuploading
            rotations: [ry, rz]
            entangler: ring
            readout: linear
          simulation:
            mode: exact
        trainer:
          kind: {kind}
          {kind}:
            {settings}
            eval_every: 4
            eval_episodes: 2
        logging:
          metrics_every_steps: 1
          checkpoint_every_steps: 1
          keep_checkpoints: 3
          final_eval_episodes: 3
        """;

    /// <summary>Writes the config into <paramref name="dir"/> and returns its path.</summary>
    public string WriteConfig(string dir)
    {
        Directory.CreateDirectory(dir);
        string path = Path.Combine(dir, Name + ".yaml");
        File.WriteAllText(path, Yaml);
        return path;
    }

    /// <summary>The run folder under <paramref name="runsDir"/>.</summary>
    public string RunDir(string runsDir) => Path.Combine(runsDir, "resume-" + Name.Replace('_', '-'), RunId);

    /// <summary>Arguments that start (or, with checkpoints present, continue) the run.</summary>
    public IEnumerable<string> TrainArgs(string config, string runsDir, IEnumerable<string>? extraSets = null)
    {
        var args = new List<string> { "train", config, "--runs-dir", runsDir, "--run-id", RunId };
        foreach (var s in Sets.Concat(extraSets ?? [])) { args.Add("--set"); args.Add(s); }
        return args;
    }

    public static IEnumerable<string> ResumeArgs(string runDir, params string[] sets)
    {
        var args = new List<string> { "resume", runDir };
        foreach (var s in sets) { args.Add("--set"); args.Add(s); }
        return args;
    }

    /// <summary>Runs to completion; asserts exit code 0 and returns the wall time of the whole process.</summary>
    public TimeSpan RunToEnd(string config, string runsDir) => TimeRunToEnd(config, runsDir).Total;

    /// <summary>
    /// Runs to completion (asserting exit code 0) and returns when, after the process start, the first checkpoint
    /// file appeared (training is under way) and when the process ended.
    /// </summary>
    public (TimeSpan FirstCheckpoint, TimeSpan Total) TimeRunToEnd(string config, string runsDir)
    {
        var clock = Stopwatch.StartNew();
        using var cli = CliProcess.Start(TrainArgs(config, runsDir));
        string dir = Path.Combine(RunDir(runsDir), "checkpoints");
        TimeSpan? first = null;
        while (!cli.HasExited)
        {
            if (first is null && HybridRL.Checkpoints.CheckpointStore.List(dir).Count > 0) first = clock.Elapsed;
            Thread.Sleep(5);
            Assert.True(clock.Elapsed < TimeSpan.FromMinutes(2), $"{Name}: the run did not finish within 2 minutes");
        }
        int code = cli.WaitForExit(TimeSpan.FromSeconds(30));
        var total = clock.Elapsed;
        Assert.True(code == 0, $"{Name}: train exited {code}\n{cli.Stdout}\n{cli.Stderr}");
        return (first ?? total, total);
    }

    /// <summary>
    /// The command that continues the run in its current state: `resume` once the run folder has its config,
    /// otherwise `train` again (a kill can land before config.yaml is written).
    /// </summary>
    public IEnumerable<string> ContinueArgs(string config, string runsDir) =>
        File.Exists(Path.Combine(RunDir(runsDir), "config.yaml")) ? ResumeArgs(RunDir(runsDir)) : TrainArgs(config, runsDir);

    /// <summary>Waits (polling) until the run has at least <paramref name="count"/> checkpoint files, or the process exits.</summary>
    public void WaitForCheckpoints(string runsDir, CliProcess process, int count, TimeSpan timeout)
    {
        var clock = Stopwatch.StartNew();
        string dir = Path.Combine(RunDir(runsDir), "checkpoints");
        while (HybridRL.Checkpoints.CheckpointStore.List(dir).Count < count)
        {
            Assert.False(process.HasExited, $"{Name}: the run exited before writing {count} checkpoints\n{process.Stdout}\n{process.Stderr}");
            if (clock.Elapsed > timeout) throw new TimeoutException($"{Name}: no {count} checkpoints after {timeout}\n{process.Stderr}");
            Thread.Sleep(20);
        }
    }
}
