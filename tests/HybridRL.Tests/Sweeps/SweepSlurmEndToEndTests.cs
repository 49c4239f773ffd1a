using System.Diagnostics;
using System.Text.RegularExpressions;
using HybridRL.Checkpoints;
using HybridRL.Experiments.Executors;
using HybridRL.Experiments.Sweeps;
using Xunit.Abstractions;

namespace HybridRL.Tests.Sweeps;

/// <summary>
/// The whole path on a real Slurm: <c>sweep submit</c> with the real CLI as the array task, one task pre-empted with USR1 and requeued,
/// results compared with <c>sweep run</c> of the same sweep on local cores.
/// </summary>
[Collection(SlurmCollection.Name)]
public class SweepSlurmEndToEndTests(ITestOutputHelper output)
{
    // Runs in order (zip, then seeds): 0 dqn seed 1, 1 dqn seed 2, 2 cma_es seed 1, 3 cma_es seed 2. The deep-Q runs are longer
    // (4000 steps: 1000 warm-up steps, then gradient updates, several seconds even on an idle node) so that the signal lands mid-run.
    private const string Axes = "zip:\n  trainer.kind: [dqn, cma_es]\n  experiment.budget.env_steps: [4000, 300]\nseeds: [1, 2]\n";

    private static CommandResult Run(string program, params string[] args) => ProcessCommandRunner.Instance.Run(program, args, TimeSpan.FromSeconds(30));

    private static string? QueueState(string job, int index) =>
        SlurmQueue.Query()?.FirstOrDefault(e => e.JobId == job && e.ArrayIndex == index)?.State;

    [SlurmFact]
    public async Task Submitted_sweep_with_a_preempted_task_matches_a_local_sweep_run()
    {
        var clock = Stopwatch.StartNew();
        // slurmd must reach the files: /tmp, not a private temp folder; the sweep files use absolute paths
        using var e2e = new SweepEndToEnd("/tmp");
        string localFile = e2e.WriteSweep("local.yaml", "e2e", "local-runs", Axes);
        string slurmFile = e2e.WriteSweep("slurm.yaml", "e2e", "slurm-runs", Axes);
        var local = SweepPlan.Load(localFile);
        var slurm = SweepPlan.Load(slurmFile);
        Assert.Equal(local.Runs.Select(r => r.Id), slurm.Runs.Select(r => r.Id)); // ids depend on the overrides only
        Assert.Equal(4, slurm.Runs.Select(r => r.Id).Distinct().Count());

        // the reference: the same sweep on local cores, uninterrupted
        var reference = e2e.Cli("sweep", "run", localFile, "--jobs", "2");
        Assert.True(reference.ExitCode == 0, reference.Stdout + reference.Stderr);
        output.WriteLine($"sweep run done after {clock.Elapsed.TotalSeconds:0.0} s");

        var status = e2e.Cli("sweep", "status", slurmFile);
        Assert.Equal(Enumerable.Range(0, 4).ToDictionary(i => i, _ => "pending"), SweepEndToEnd.States(status.Stdout));

        var submit = e2e.Cli("sweep", "submit", slurmFile, "--max-parallel", "2", "--time", "10:00");
        Assert.True(submit.ExitCode == 0, submit.Stdout + submit.Stderr);
        string job = Regex.Match(submit.Stdout, @"submitted job (\d+)").Groups[1].Value;
        Assert.False(string.IsNullOrEmpty(job), submit.Stdout);
        output.WriteLine($"job {job}");
        string run0 = slurm.RunDir(slurm.Runs[0]);
        string out0 = Path.Combine(slurm.SweepDir, $"slurm-{job}_0.out");
        string Out0() => File.Exists(out0) ? File.ReadAllText(out0) : "(no output yet)";
        try
        {
            // wait until task 0 has checkpointed after its warm-up (gradient updates under way), then pre-empt it
            bool checkpointed = await SweepEndToEnd.Until(() => CheckpointStore.List(Path.Combine(run0, "checkpoints")).Any(c => c.Step >= 1200), TimeSpan.FromSeconds(90));
            Assert.True(checkpointed, $"task 0 wrote no checkpoint past step 1200{SlurmDiagnostics.Describe(job, 0, out0)}");
            status = e2e.Cli("sweep", "status", slurmFile);
            output.WriteLine(status.Stdout);
            Assert.Equal("running", SweepEndToEnd.States(status.Stdout)[0]);
            Assert.Matches($@"RUNNING {job}_0", status.Stdout);

            // scancel delivers the signal at once but may then keep retrying for half a minute ("Job can not be altered now") once the
            // element has requeued itself, so it is not waited for; it is stopped once the requeue is seen
            using var signal = Process.Start(new ProcessStartInfo("scancel", ["--signal=USR1", "--batch", $"{job}_0"]) { RedirectStandardError = true, RedirectStandardOutput = true })!;
            bool requeued = await SweepEndToEnd.Until(() => Out0().Contains("[batch] task exited with 3") && QueueState(job, 0) == "PENDING", TimeSpan.FromSeconds(60));
            if (!signal.HasExited) signal.Kill();
            else if (!requeued) Assert.True(signal.ExitCode == 0, signal.StandardError.ReadToEnd());
            Assert.True(requeued, $"task 0 was not interrupted and requeued (finished before the signal?){SlurmDiagnostics.Describe(job, 0, out0)}");
            Assert.False(File.Exists(Path.Combine(run0, "summary.json")));
            status = e2e.Cli("sweep", "status", slurmFile);
            output.WriteLine(status.Stdout);
            Assert.Equal("interrupted", SweepEndToEnd.States(status.Stdout)[0]);
            Assert.Matches($@"PENDING {job}_0", status.Stdout);

            // a requeued task is held about 120 s (BeginTime); release it now
            var release = Run("scontrol", "update", $"JobId={job}_0", "StartTime=now");
            Assert.True(release.ExitCode == 0, release.StandardError);
            bool finished = await SweepEndToEnd.Until(
                () => slurm.Runs.All(r => File.Exists(Path.Combine(slurm.RunDir(r), "summary.json"))) && SlurmQueue.Query()?.Any(q => q.JobId == job) == false,
                TimeSpan.FromSeconds(120));
            Assert.True(finished, $"the array did not finish{SlurmDiagnostics.Describe(job, 0, out0)}");
        }
        finally
        {
            Run("scancel", job);
        }

        status = e2e.Cli("sweep", "status", slurmFile);
        output.WriteLine(status.Stdout);
        Assert.Equal(Enumerable.Range(0, 4).ToDictionary(i => i, _ => "done"), SweepEndToEnd.States(status.Stdout));
        string log0 = Out0();
        output.WriteLine(log0);
        Assert.Contains($"[batch] requeueing {job}_0", log0);
        Assert.Contains("[batch] task exited with 0", log0);
        Assert.Contains("resumed from", File.ReadAllText(Path.Combine(run0, "log.json")));

        // every run, the pre-empted one included, equals its uninterrupted local twin: same metrics rows (bar wall time), same final return
        foreach (var run in slurm.Runs)
        {
            string a = local.RunDir(run), b = slurm.RunDir(run);
            Assert.Equal(SweepEndToEnd.MetricsWithoutWallTime(a), SweepEndToEnd.MetricsWithoutWallTime(b));
            foreach (var key in new[] { "final_return", "best_return", "env_steps", "updates", "generations", "circuit_executions" })
                Assert.True(SweepEndToEnd.Summary(a, key) == SweepEndToEnd.Summary(b, key), $"run {run.Index} {key}: local {SweepEndToEnd.Summary(a, key)}, slurm {SweepEndToEnd.Summary(b, key)}");
        }
        Assert.Equal("\"dqn\"", SweepEndToEnd.Summary(slurm.RunDir(slurm.Runs[0]), "trainer"));
        Assert.Equal("4000", SweepEndToEnd.Summary(slurm.RunDir(slurm.Runs[0]), "env_steps"));
        output.WriteLine($"took {clock.Elapsed.TotalSeconds:0.0} s");
    }
}
