using System.Text.Json;
using HybridRL.Experiments.Evaluation;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary>The quickstart end to end (reduced budget), reproduction from the saved config.yaml, and `hybridrl eval` on the run.</summary>
[Collection(ConsoleCollection.Name)]
public sealed class TrainEvalCliTests(QuickstartRunFixture run) : IClassFixture<QuickstartRunFixture>
{
    private const string Header = "env_steps,episodes,updates,generations,wall_seconds,train_return,eval_return,loss,fitness_mean,fitness_best,fitness_std,epsilon,sigma,circuit_executions,shots,hardware_executions,parameter_count";

    private JsonElement Summary() => JsonDocument.Parse(File.ReadAllText(Path.Combine(run.RunDir, "summary.json"))).RootElement;

    [Fact]
    public void Quickstart_trains_end_to_end()
    {
        Assert.True(run.ExitCode == 0, run.Stderr);
        var s = Summary();
        Assert.Equal("done", s.GetProperty("status").GetString());
        Assert.Equal(400, s.GetProperty("env_steps").GetInt64());
        Assert.Equal(Header, File.ReadLines(Path.Combine(run.RunDir, "metrics.csv")).First());
        Assert.True(File.Exists(Path.Combine(run.RunDir, "config.yaml")));
        Assert.False(File.Exists(Path.Combine(run.RunDir, "run.lock")));
    }

    [Fact]
    public void Saved_config_reproduces_the_same_run()
    {
        Assert.True(run.ExitCode == 0, run.Stderr);
        string again = run.Scratch("again");
        var (code, stdout, stderr) = CliProcess.Run(["train", Path.Combine(run.RunDir, "config.yaml"), "--runs-dir", again, "--quiet"]);
        Assert.True(code == 0, stderr);
        string dir2 = stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)[0];
        Assert.Equal(Path.GetFileName(run.RunDir), Path.GetFileName(dir2));                  // same run id (from the config hash)
        var json2 = JsonDocument.Parse(File.ReadAllText(Path.Combine(dir2, "summary.json"))).RootElement;
        Assert.Equal(Summary().GetProperty("config_hash").GetString(), json2.GetProperty("config_hash").GetString());
        static IEnumerable<string> WithoutWall(string file) => File.ReadLines(file).Select(l =>
        {
            var cells = l.Split(',');
            cells[4] = "";                                                                     // wall_seconds differs between runs
            return string.Join(',', cells);
        });
        Assert.Equal(WithoutWall(Path.Combine(run.RunDir, "metrics.csv")), WithoutWall(Path.Combine(dir2, "metrics.csv")));
    }

    [Fact]
    public void Eval_of_the_final_checkpoint_repeats_the_runs_final_evaluation()
    {
        Assert.True(run.ExitCode == 0, run.Stderr);
        var (code, stdout, stderr) = InProcessCli.Run("eval", run.RunDir, "--checkpoint", "latest");
        Assert.True(code == 0, stderr);
        var r = EvaluationResult.FromJson(File.ReadAllText(Path.Combine(run.RunDir, "eval-latest.json")));
        // Same parameters, same episode seeds (root "final-evaluation"), exact simulation: the mean must equal
        // summary.json's final_return bit for bit.
        Assert.Equal(Summary().GetProperty("final_return").GetDouble(), r.Mean);
        Assert.Equal(20, r.Episodes);                                                          // logging.final_eval_episodes of the quickstart
        Assert.Equal(20, r.Returns.Count);
        Assert.Equal(r.Returns.Average(), r.Mean, 12);
        Assert.Equal(r.Returns.Min(), r.Min);
        Assert.Equal(r.Returns.Max(), r.Max);
        Assert.Equal("model.online", r.ParameterSection);
        Assert.Equal(400, r.CheckpointStep);
        Assert.Empty(r.SettingsChanged);
        Assert.Contains("eval-latest.json", stdout);
    }

    [Fact]
    public void Eval_under_shots_records_the_changed_settings()
    {
        Assert.True(run.ExitCode == 0, run.Stderr);
        var (code, stdout, stderr) = InProcessCli.Run("eval", run.RunDir, "--episodes", "3",
            "--set", "model.simulation.mode=shots", "--set", "model.simulation.shots=100", "--set", "model.simulation.gradient=parameter_shift");
        Assert.True(code == 0, stderr);
        string file = Path.Combine(run.RunDir, "eval-best-mode-shots-shots-100-gradient-parameter_shift.json");
        Assert.True(File.Exists(file), stdout);
        var r = EvaluationResult.FromJson(File.ReadAllText(file));
        Assert.Equal(3, r.Episodes);
        Assert.Equal("100", r.SettingsChanged["model.simulation.shots"].After);
        Assert.Equal("shots", r.SettingsChanged["model.simulation.mode"].After);
        // Every greedy step is one forward row of one measurement setting with 100 shots.
        Assert.Equal(r.EnvSteps, r.CircuitExecutions);
        Assert.Equal(100 * r.EnvSteps, r.Shots);
        Assert.NotNull(r.CheckpointNote);                                                      // 400 < eval_every: no best pointer, newest used
    }

    [Fact]
    public void Eval_under_noise_records_the_changed_settings()
    {
        Assert.True(run.ExitCode == 0, run.Stderr);
        var (code, stdout, stderr) = InProcessCli.Run("eval", run.RunDir, "--episodes", "3", "--checkpoint", "latest",
            "--set", "model.simulation.mode=density_matrix", "--set", "model.simulation.noise.depolarizing=0.3", "--set", "model.simulation.gradient=parameter_shift");
        Assert.True(code == 0, stderr);
        var file = Assert.Single(Directory.GetFiles(run.RunDir, "eval-latest-*depolarizing*.json"));
        var r = EvaluationResult.FromJson(File.ReadAllText(file));
        Assert.Equal(3, r.Episodes);
        Assert.Equal("0.3", r.SettingsChanged["model.simulation.noise.depolarizing"].After);
        Assert.Equal("density_matrix", r.SettingsChanged["model.simulation.mode"].After);
        Assert.Equal(r.EnvSteps, r.CircuitExecutions); // exact expectations of the noisy state: one execution per step, no shots
        Assert.Equal(0, r.Shots);
        Assert.Contains(Path.GetFileName(file), stdout);
    }

    [Fact]
    public void Eval_refuses_a_changed_training_key_and_names_it()
    {
        Assert.True(run.ExitCode == 0, run.Stderr);
        var before = Directory.GetFiles(run.RunDir, "eval-*.json").Length;
        var (code, _, stderr) = InProcessCli.Run("eval", run.RunDir, "--set", "trainer.dqn.gamma=0.5");
        Assert.Equal(2, code);
        Assert.Contains("trainer.dqn.gamma", stderr);
        Assert.Equal(before, Directory.GetFiles(run.RunDir, "eval-*.json").Length);
    }

    [Fact]
    public void Eval_of_a_folder_that_is_not_a_run_exits_2()
    {
        var (code, _, stderr) = InProcessCli.Run("eval", run.Scratch("nothing-here"));
        Assert.Equal(2, code);
        Assert.Contains("not a run folder", stderr);
    }
}
