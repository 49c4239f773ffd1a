using HybridRL.Experiments.Executors;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Tests.Sweeps;

public class LocalSweepExecutorTests
{
    /// <summary>Peak number of tasks between "start" and "end" lines, replayed from an append-only event log.</summary>
    private static int PeakFromEvents(string path)
    {
        int now = 0, peak = 0;
        foreach (var line in File.ReadAllLines(path))
        {
            if (line.StartsWith("start")) peak = Math.Max(peak, ++now);
            else if (line.StartsWith("end")) now--;
        }
        return peak;
    }

    [Fact]
    public async Task Runs_n_at_a_time_skips_done_runs_and_reports_exit_codes()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("loc.yaml", "base: base-experiment.yaml\nname: loc\nseeds: [0, 1, 2, 3, 4, 5]\n"), files.Dir);
        string doneDir = Directory.CreateDirectory(plan.RunDir(plan.Runs[5])).FullName;
        File.WriteAllText(Path.Combine(doneDir, "summary.json"), """{"status":"done"}""");
        string events = Path.Combine(files.Dir, "events.log");
        // each child: log start, sleep, log end, exit 3 for run 1, 7 for run 2, 0 otherwise
        var command = new ScriptTaskCommand(["/bin/sh", "-c",
            $"i=$HYBRIDRL_SWEEP_INDEX; echo \"start $i\" >> {events}; echo \"child $i says hi\"; sleep 0.4; echo \"end $i\" >> {events}; " +
            "case $i in 1) exit 3;; 2) exit 7;; *) exit 0;; esac"]);
        var progress = new StringWriter();
        var report = await new LocalSweepExecutor(command, progress).RunAsync(plan, new LocalRunOptions { Jobs = 2 }, CancellationToken.None);

        Assert.Equal(6, report.Outcomes.Count);
        Assert.Equal([LocalRunResult.Done, LocalRunResult.Interrupted, LocalRunResult.Failed, LocalRunResult.Done, LocalRunResult.Done, LocalRunResult.SkippedDone],
            report.Outcomes.Select(o => o.Result));
        Assert.Equal([0, 3, 7, 0, 0, null], report.Outcomes.Select(o => o.ExitCode));
        Assert.Equal(1, report.ExitCode); // a failure outranks the interruption
        Assert.Equal(2, report.PeakConcurrency);
        Assert.Equal(2, PeakFromEvents(events)); // never more than 2 children at once, and 2 were used
        Assert.DoesNotContain("start 5", File.ReadAllText(events)); // the finished run was not started
        Assert.Contains("child 3 says hi", File.ReadAllText(Path.Combine(plan.SweepDir, "logs", "task-3.out")));
        Assert.Contains("exited 7: failed", progress.ToString());
    }

    [Fact]
    public async Task Cancellation_signals_children_which_exit_3_and_leaves_the_rest_not_started()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("can.yaml", "base: base-experiment.yaml\nname: can\nseeds: [0, 1, 2, 3]\n"), files.Dir);
        string marks = Directory.CreateDirectory(Path.Combine(files.Dir, "marks")).FullName;
        // a child that "checkpoints" on SIGTERM and exits 3; the background sleep is killed so no pipe stays open
        var command = new ScriptTaskCommand(["/bin/sh", "-c",
            $"i=$HYBRIDRL_SWEEP_INDEX; trap 'kill $p; echo term > {marks}/term-$i; exit 3' TERM; touch {marks}/started-$i; sleep 30 & p=$!; wait $p; exit 0"]);
        using var cts = new CancellationTokenSource();
        var run = new LocalSweepExecutor(command).RunAsync(plan, new LocalRunOptions { Jobs = 2, StopGrace = TimeSpan.FromSeconds(20) }, cts.Token);
        var deadline = DateTime.UtcNow.AddSeconds(15);
        while (Directory.GetFiles(marks, "started-*").Length < 2 && DateTime.UtcNow < deadline) await Task.Delay(20);
        await Task.Delay(100); // let the shells install their traps
        cts.Cancel();
        var report = await run;

        Assert.True(report.Cancelled);
        Assert.Equal([LocalRunResult.Interrupted, LocalRunResult.Interrupted, LocalRunResult.NotStarted, LocalRunResult.NotStarted], report.Outcomes.Select(o => o.Result));
        Assert.Equal([3, 3, null, null], report.Outcomes.Select(o => o.ExitCode));
        Assert.True(File.Exists(Path.Combine(marks, "term-0")) && File.Exists(Path.Combine(marks, "term-1")));
        Assert.Equal(3, report.ExitCode);
        Assert.All(report.Outcomes.Take(2), o => Assert.True(o.Elapsed < TimeSpan.FromSeconds(20), "children stopped by the signal, not by the grace kill"));
    }

    [Fact]
    public async Task A_program_that_cannot_start_is_a_failed_run()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("ns.yaml", "base: base-experiment.yaml\nname: ns\n"), files.Dir);
        var report = await new LocalSweepExecutor(new ScriptTaskCommand([Path.Combine(files.Dir, "no-such-program")])).RunAsync(plan, new LocalRunOptions { Jobs = 1 }, CancellationToken.None);
        Assert.Equal(LocalRunResult.Failed, Assert.Single(report.Outcomes).Result);
        Assert.Equal(1, report.ExitCode);
    }

    [Fact]
    public void Default_task_command_runs_the_current_program_with_sweep_task()
    {
        var cmd = new HybridRLTaskCommand(["/usr/bin/dotnet", "/opt/h/hybridrl.dll"]);
        Assert.Equal(["/usr/bin/dotnet", "/opt/h/hybridrl.dll", "sweep", "task", "/s.yaml", "--index", "4"], cmd.ForIndex("/s.yaml", 4));
        Assert.Equal(["/usr/bin/dotnet", "/opt/h/hybridrl.dll", "sweep", "task", "/s.yaml"], cmd.ForArrayTask("/s.yaml"));
        Assert.NotEmpty(HybridRLTaskCommand.FromCurrentProcess().Prefix);
    }
}
