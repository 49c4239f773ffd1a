using HybridRL.Experiments.Executors;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Tests.Sweeps;

public class SweepPlanAndStatusTests
{
    [Fact]
    public void Plan_table_lists_runs_and_sums_budget_from_overrides_and_base()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("b.yaml", "base: base-experiment.yaml\ngrid:\n  trainer.env_steps: [100, 200]\nseeds: [1, 2, 3]\n"), files.Dir);
        var resolver = new YamlBudgetResolver(plan.BasePath, ["trainer.env_steps", "trainer.max_generations", "trainer.absent"]);
        var totals = SweepPlanTable.TotalBudget(plan, resolver.Resolve).ToDictionary(kv => kv.Key, kv => kv.Value);
        // hand-worked: env_steps overridden (100 + 200) x 3 seeds = 900; max_generations 50 from the base x 6 runs = 300
        Assert.Equal(900, totals["trainer.env_steps"]);
        Assert.Equal(300, totals["trainer.max_generations"]);
        Assert.False(totals.ContainsKey("trainer.absent"));

        string table = SweepPlanTable.Format(plan, resolver.Resolve);
        var lines = table.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Contains("6 runs", lines[0]);
        Assert.Contains(lines, l => l.TrimStart().StartsWith("5  ") && l.Contains(plan.Runs[5].Id) && l.Contains("trainer.env_steps=200 experiment.seed=3"));
        Assert.Contains("total trainer.env_steps: 900", table);
        Assert.Contains("total trainer.max_generations: 300", table);
    }

    private static void Json(string dir, string name, string text)
    {
        string path = Path.Combine(dir, name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
    }

    [Fact]
    public void Run_folders_are_classified_from_their_files()
    {
        using var files = new SweepTestFiles();
        string D(string n) => Path.Combine(files.Dir, n);
        Json(D("done"), "summary.json", """{"run_id":"x","status":"done"}""");
        Json(D("done"), "run.lock", $$"""{"pid":{{Environment.ProcessId}},"host":"{{Environment.MachineName}}","started":"2026-01-01T00:00:00Z"}"""); // done wins over a leftover lock
        Json(D("running"), "run.lock", $$"""{"pid":{{Environment.ProcessId}},"host":"{{Environment.MachineName}}","started":"2026-01-01T00:00:00Z"}""");
        Json(D("elsewhere"), "run.lock", """{"pid":1234,"host":"another-node","started":"2026-01-01T00:00:00Z"}""");
        Json(D("stale"), "run.lock", $$"""{"pid":99999999,"host":"{{Environment.MachineName}}","started":"2026-01-01T00:00:00Z"}""");
        Json(D("interrupted"), "checkpoints/latest.ckpt", "x");
        Json(D("failed"), "failed.json", """{"error":"loss became NaN"}""");
        Json(D("failed"), "checkpoints/latest.ckpt", "x");
        Json(D("halfdone"), "summary.json", """{"status":"writing"}""");
        Directory.CreateDirectory(D("empty"));

        RunFolderState S(string n) => RunFolderInspector.Inspect(D(n)).State;
        Assert.Equal(RunFolderState.Done, S("done"));
        Assert.Equal(RunFolderState.Running, S("running"));
        Assert.Equal(RunFolderState.Running, S("elsewhere"));
        Assert.Contains("another-node", RunFolderInspector.Inspect(D("elsewhere")).Detail);
        Assert.Equal(RunFolderState.Interrupted, S("stale"));
        Assert.Equal(RunFolderState.Interrupted, S("interrupted"));
        Assert.Equal(RunFolderState.Failed, S("failed"));
        Assert.Contains("loss became NaN", RunFolderInspector.Inspect(D("failed")).Detail);
        Assert.Equal(RunFolderState.Pending, S("halfdone"));
        Assert.Equal(RunFolderState.Pending, S("empty"));
        Assert.Equal(RunFolderState.Pending, S("missing"));
        // the liveness check is what separates running from stale
        Assert.Equal(RunFolderState.Interrupted, RunFolderInspector.Inspect(D("running"), _ => false).State);
    }

    [Fact]
    public void Squeue_output_is_parsed_including_pending_array_ranges()
    {
        var entries = SlurmQueue.Parse("""
            41_0 RUNNING
            41_[2-4,7%2] PENDING
            42 RUNNING
            garbage
            43_x RUNNING
            """);
        Assert.Contains(new SlurmQueueEntry("41", 0, "RUNNING"), entries);
        Assert.Equal([2, 3, 4, 7], entries.Where(e => e.JobId == "41" && e.State == "PENDING").Select(e => e.ArrayIndex!.Value));
        Assert.Contains(new SlurmQueueEntry("42", null, "RUNNING"), entries);
        Assert.Equal(6, entries.Count);
    }

    [Fact]
    public void Status_combines_run_folders_with_the_queue_of_this_sweeps_jobs()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("st.yaml", "base: base-experiment.yaml\nseeds: [1, 2, 3, 4]\n"), files.Dir);
        Json(plan.RunDir(plan.Runs[0]), "summary.json", """{"status":"done"}""");
        Json(plan.RunDir(plan.Runs[1]), "checkpoints/a", "x");
        Json(plan.RunDir(plan.Runs[2]), "failed.json", "{}");
        SubmittedJobs.Append(plan.SweepDir, "70");
        SubmittedJobs.Append(plan.SweepDir, "71");
        var queue = SlurmQueue.Parse("70_3 RUNNING\n71_1 PENDING\n99_2 RUNNING\n");
        var rows = SweepStatusReader.Read(plan, queue);
        Assert.Equal([RunFolderState.Done, RunFolderState.Interrupted, RunFolderState.Failed, RunFolderState.Pending], rows.Select(r => r.Folder.State));
        Assert.Equal([null, "PENDING", null, "RUNNING"], rows.Select(r => r.SlurmState)); // job 99 is not this sweep's
        Assert.Equal("71_1", rows[1].SlurmJob);
        string text = SweepStatusReader.Format(rows);
        Assert.Contains("4 runs: pending 1, interrupted 1, failed 1, done 1", text);
        Assert.Contains("PENDING 71_1", text);
    }

    private sealed class RecordingTrainTask(int exitCode) : ITrainTask
    {
        public List<(string Base, string[] Overrides, string RunsDir, string Name, string Id)> Calls { get; } = [];

        public int Run(string baseConfigPath, IReadOnlyList<string> overrides, string runsDir, string runName, string runId, CancellationToken ct)
        {
            Calls.Add((baseConfigPath, overrides.ToArray(), runsDir, runName, runId));
            return exitCode;
        }
    }

    [Fact]
    public void Task_runner_resolves_the_index_and_skips_finished_runs()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("t.yaml", "base: base-experiment.yaml\nname: tsk\ngrid:\n  trainer.kind: [dqn, evolution]\n"), files.Dir);
        Assert.Equal(1, SweepTaskRunner.ResolveIndex(null, v => v == "SLURM_ARRAY_TASK_ID" ? "1" : null));
        Assert.Equal(0, SweepTaskRunner.ResolveIndex(0, _ => "1"));
        Assert.Throws<SweepFileException>(() => SweepTaskRunner.ResolveIndex(null, _ => null));
        Assert.Throws<SweepFileException>(() => SweepTaskRunner.ResolveIndex(null, _ => "x"));

        var task = new RecordingTrainTask(3);
        Assert.Equal(3, SweepTaskRunner.Run(plan, 1, task, CancellationToken.None));
        var call = Assert.Single(task.Calls);
        Assert.Equal(plan.BasePath, call.Base);
        Assert.Equal(["trainer.kind=evolution"], call.Overrides);
        Assert.Equal(files.Dir, call.RunsDir);
        Assert.Equal("tsk", call.Name);
        Assert.Equal(plan.Runs[1].Id, call.Id);

        Json(plan.RunDir(plan.Runs[0]), "summary.json", """{"status":"done"}""");
        Assert.Equal(0, SweepTaskRunner.Run(plan, 0, task, CancellationToken.None));
        Assert.Single(task.Calls); // not called again for the finished run
        Assert.Throws<SweepFileException>(() => SweepTaskRunner.Run(plan, 2, task, CancellationToken.None));
    }
}
