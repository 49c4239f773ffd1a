using HybridRL.Experiments.Executors;
using HybridRL.Experiments.Runs;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Tests.Sweeps;

public class SweepPlanAndStatusTests
{
    [Fact]
    public void Plan_table_lists_runs_and_sums_budgets_resolved_by_the_config_loader()
    {
        using var files = new SweepTestFiles();
        File.Copy(SweepTestFiles.DataPath("tiny-warehouse.yaml"), Path.Combine(files.Dir, "tiny.yaml"));
        var plan = SweepPlan.Load(files.Write("b.yaml", "base: tiny.yaml\ngrid:\n  experiment.budget.env_steps: [100, 200]\n  trainer.kind: [dqn, cma_es]\nseeds: [1, 2, 3]\n"), files.Dir);
        var resolver = new SpecBudgetResolver(plan.BasePath, new Dictionary<string, string>());
        var totals = SweepPlanTable.TotalBudget(plan, resolver.Resolve).ToDictionary(kv => kv.Key, kv => kv.Value);
        // hand-worked: env_steps overridden (100 + 200) x 2 kinds x 3 seeds = 1800; wall_seconds 600 from the base x 12 runs = 7200;
        // episodes, generations and circuit executions are 0 (unlimited) by default and are left out
        Assert.Equal(1800, totals[SpecBudgetResolver.EnvSteps]);
        Assert.Equal(7200, totals[SpecBudgetResolver.WallSeconds]);
        Assert.Equal(2, totals.Count);

        string table = SweepPlanTable.Format(plan, resolver.Resolve);
        var lines = table.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        Assert.Contains("12 runs", lines[0]);
        Assert.Contains(lines, l => l.TrimStart().StartsWith("11  ") && l.Contains(plan.Runs[11].Id) && l.Contains("experiment.budget.env_steps=200 trainer.kind=cma_es experiment.seed=3"));
        Assert.Contains("total experiment.budget.env_steps: 1800", table);

        // the loader validates every run: an out-of-range override names the run and the key
        var bad = SweepPlan.Load(files.Write("bad.yaml", "base: tiny.yaml\ngrid:\n  model.circuit.layers: [1, -1]\n"), files.Dir);
        var badResolver = new SpecBudgetResolver(bad.BasePath, new Dictionary<string, string>());
        var e = Assert.Throws<SweepFileException>(() => SweepPlanTable.TotalBudget(bad, badResolver.Resolve));
        Assert.Contains("run 1", e.Message);
        Assert.Contains("model.circuit.layers", e.Message);
    }

    [Fact]
    public void Shipped_optimizer_sweep_gives_every_trainer_five_seeds_with_distinct_ids_and_valid_configs()
    {
        string file = Path.GetFullPath(Path.Combine(Path.GetDirectoryName(SweepTestFiles.TinyWarehousePath)!, "..", "..", "..", "..", "configs", "optimizers-sweep.yaml"));
        var plan = SweepPlan.Load(file);
        Assert.Equal(20, plan.Runs.Count);
        Assert.Equal(20, plan.Runs.Select(r => r.Id).Distinct().Count());
        var resolver = new SpecBudgetResolver(plan.BasePath, new Dictionary<string, string>());
        var specs = plan.Runs.Select(resolver.Spec).ToArray(); // every run's config is valid
        foreach (var kind in Enum.GetValues<HybridRL.Experiments.Config.TrainerKind>())
            Assert.Equal([1L, 2, 3, 4, 5], specs.Where(s => s.Trainer.Kind == kind).Select(s => (long)s.Experiment.Seed).Order());
        Assert.Single(specs.Select(s => s.Experiment.Budget.EnvSteps).Distinct()); // one budget for all optimisers
    }

    private static void Json(string dir, string name, string text)
    {
        string path = Path.Combine(dir, name);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        File.WriteAllText(path, text);
    }

    [Fact]
    public void Status_of_run_folders_comes_from_the_shared_run_status()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("rs.yaml", "base: base-experiment.yaml\nseeds: [1, 2, 3]\n"), files.Dir);
        // run 0: never started (no folder); run 1: locked by a process on another host that checked in just now;
        // run 2: locked by a pid that does not exist on this host (stale) after writing metrics
        Json(plan.RunDir(plan.Runs[1]), "run.lock", $$"""{"pid":1234,"host":"another-node","started":"{{DateTime.UtcNow:O}}"}""");
        Json(plan.RunDir(plan.Runs[2]), "run.lock", $$"""{"pid":{{int.MaxValue}},"host":"{{Environment.MachineName}}","started":"2026-01-01T00:00:00Z"}""");
        Json(plan.RunDir(plan.Runs[2]), "metrics.csv", "env_steps\n");
        var rows = SweepStatusReader.Read(plan, null);
        Assert.Equal([RunState.Pending, RunState.Running, RunState.Interrupted], rows.Select(r => r.Folder.State));
        Assert.Contains("another-node", rows[1].Folder.Detail);
        Assert.Contains("stale run.lock", rows[2].Folder.Detail);
        Assert.All(rows, r => Assert.Null(r.SlurmState));
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
        Json(plan.RunDir(plan.Runs[1]), "metrics.csv", "env_steps\n"); // started, no summary
        Json(plan.RunDir(plan.Runs[2]), "failed.json", "{}");
        SubmittedJobs.Append(plan.SweepDir, "70");
        SubmittedJobs.Append(plan.SweepDir, "71");
        var queue = SlurmQueue.Parse("70_3 RUNNING\n71_1 PENDING\n99_2 RUNNING\n");
        var rows = SweepStatusReader.Read(plan, queue);
        Assert.Equal([RunState.Done, RunState.Interrupted, RunState.Failed, RunState.Pending], rows.Select(r => r.Folder.State));
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
