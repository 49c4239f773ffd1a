using HybridRL.Experiments.Sweeps;
using Xunit.Abstractions;

namespace HybridRL.Tests.Sweeps;

/// <summary>The sweep commands through the real CLI on local cores (no Slurm needed).</summary>
public class SweepCommandTests(ITestOutputHelper output)
{
    [Fact]
    public void Plan_run_status_through_the_cli_train_every_run_once_and_reject_bad_input_with_exit_2()
    {
        var clock = System.Diagnostics.Stopwatch.StartNew();
        using var e2e = new SweepEndToEnd();
        string sweep = e2e.WriteSweep("local.yaml", "local-e2e", "runs", "grid:\n  trainer.kind: [cma_es]\nseeds: [1, 2]\n");
        var plan = SweepPlan.Load(sweep);

        var p = e2e.Cli("sweep", "plan", sweep);
        Assert.True(p.ExitCode == 0, p.Stderr);
        Assert.Contains("2 runs", p.Stdout);
        Assert.Contains("total experiment.budget.env_steps: 600", p.Stdout); // hand-worked: 2 runs x 300 steps from the base

        var s = e2e.Cli("sweep", "status", sweep);
        Assert.True(s.ExitCode == 0, s.Stderr);
        Assert.Equal(new Dictionary<int, string> { [0] = "pending", [1] = "pending" }, SweepEndToEnd.States(s.Stdout));

        var r = e2e.Cli("sweep", "run", sweep, "--jobs", "2");
        output.WriteLine(r.Stdout);
        Assert.True(r.ExitCode == 0, r.Stdout + r.Stderr);
        foreach (var run in plan.Runs)
        {
            Assert.Equal("\"done\"", SweepEndToEnd.Summary(plan.RunDir(run), "status"));
            Assert.Equal("\"cma_es\"", SweepEndToEnd.Summary(plan.RunDir(run), "trainer"));
        }
        // different seeds, different learning curves (the seed override reached the trainer)
        Assert.NotEqual(SweepEndToEnd.MetricsWithoutWallTime(plan.RunDir(plan.Runs[0])), SweepEndToEnd.MetricsWithoutWallTime(plan.RunDir(plan.Runs[1])));
        s = e2e.Cli("sweep", "status", sweep);
        Assert.Equal(new Dictionary<int, string> { [0] = "done", [1] = "done" }, SweepEndToEnd.States(s.Stdout));
        Assert.Contains("2 runs: done 2", s.Stdout);

        var again = e2e.Cli("sweep", "run", sweep);
        Assert.Equal(0, again.ExitCode);
        Assert.Contains("0 to run, 2 already done", again.Stdout);

        var task = e2e.Cli("sweep", "task", sweep, "--index", "1");
        Assert.Equal(0, task.ExitCode);
        Assert.Contains("already done", task.Stdout);

        // bad input: an override the config loader rejects, an index out of range, a missing file
        string bad = e2e.WriteSweep("bad.yaml", "bad", "runs", "grid:\n  model.circuit.layers: [1, -1]\n");
        var b = e2e.Cli("sweep", "plan", bad);
        Assert.Equal(2, b.ExitCode);
        Assert.Contains("model.circuit.layers", b.Stderr);
        Assert.Equal(2, e2e.Cli("sweep", "task", sweep, "--index", "7").ExitCode);
        Assert.Equal(2, e2e.Cli("sweep", "status", Path.Combine(e2e.Dir, "absent.yaml")).ExitCode);
        var dry = e2e.Cli("sweep", "submit", sweep, "--dry-run");
        Assert.Equal(0, dry.ExitCode);
        Assert.Contains("nothing to submit", dry.Stdout);
        output.WriteLine($"took {clock.Elapsed.TotalSeconds:0.0} s");
    }
}
