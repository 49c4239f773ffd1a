using System.Diagnostics;
using HybridRL.Experiments.Executors;
using HybridRL.Experiments.Sweeps;
using Xunit.Abstractions;

namespace HybridRL.Tests.Sweeps;

/// <summary>Real Slurm: submits a job array through <see cref="SlurmSubmitter"/> with the stand-in task fixture (Data/stand-in-task.sh).</summary>
[Collection(SlurmCollection.Name)]
public class SlurmArrayTests(ITestOutputHelper output)
{
    private static CommandResult Run(string program, params string[] args) => ProcessCommandRunner.Instance.Run(program, args, TimeSpan.FromSeconds(30));

    private static async Task<bool> Until(Func<bool> condition, TimeSpan timeout)
    {
        var sw = Stopwatch.StartNew();
        while (sw.Elapsed < timeout)
        {
            if (condition()) return true;
            await Task.Delay(250);
        }
        return condition();
    }

    private static string? QueueState(string jobId, int index) =>
        SlurmQueue.Query()?.FirstOrDefault(e => e.JobId == jobId && e.ArrayIndex == index)?.State;

    [SlurmFact]
    public async Task Array_task_signalled_with_usr1_checkpoints_requeues_itself_and_completes()
    {
        var clock = Stopwatch.StartNew();
        // Slurm writes the output files and runs the tasks from these folders, so use /tmp (readable by slurmd) rather than a private temp
        using var files = new SweepTestFiles("/tmp");
        var plan = SweepPlan.Load(files.Write("slurm.yaml", "base: base-experiment.yaml\nname: slurm-e2e\ngrid:\n  trainer.kind: [dqn, evolution]\n"), files.Dir);
        string marks = Directory.CreateDirectory(Path.Combine(files.Dir, "marks")).FullName;
        var command = new ScriptTaskCommand(["/bin/bash", SweepTestFiles.DataPath("stand-in-task.sh"), marks]);
        var sub = new SlurmSubmitter(command).Submit(plan, new SlurmSubmitOptions { MaxParallel = 2, Time = "10:00", SignalLeadSeconds = 60, WorkingDirectory = files.Dir });
        string job = sub.JobId!;
        output.WriteLine($"job {job}, script {sub.ScriptPath}");
        Assert.Equal([job], SubmittedJobs.Read(plan.SweepDir));
        string out0 = Path.Combine(plan.SweepDir, $"slurm-{job}_0.out");
        try
        {
            Assert.True(await Until(() => File.Exists(Path.Combine(marks, "waiting-0")), TimeSpan.FromSeconds(60)), "task 0 never started");
            Assert.True(await Until(() => File.Exists(Path.Combine(marks, "done-1")), TimeSpan.FromSeconds(60)), "task 1 never finished");

            var signal = Run("scancel", "--signal=USR1", "--batch", $"{job}_0");
            Assert.True(signal.ExitCode == 0, signal.StandardError);

            // the batch shell forwards USR1, the stand-in exits 3, the trap handler requeues the element: it goes back to PENDING
            Assert.True(await Until(() => File.Exists(Path.Combine(marks, "interrupted-0")) && QueueState(job, 0) == "PENDING", TimeSpan.FromSeconds(60)),
                $"task 0 was not requeued{SlurmDiagnostics.Describe(job, 0, out0)}");
            var status = SweepStatusReader.Read(plan, SlurmQueue.Query());
            Assert.Equal("PENDING", status[0].SlurmState);
            Assert.Equal($"{job}_0", status[0].SlurmJob);

            // a requeued task is held ~120 s (BeginTime); release it now
            var release = Run("scontrol", "update", $"JobId={job}_0", "StartTime=now");
            Assert.True(release.ExitCode == 0, release.StandardError);
            Assert.True(await Until(() => File.Exists(Path.Combine(marks, "done-0")) && QueueState(job, 0) is null, TimeSpan.FromSeconds(120)),
                $"requeued task 0 did not complete{SlurmDiagnostics.Describe(job, 0, out0)}");
            Assert.True(await Until(() => File.ReadAllText(out0).Contains("task exited with 0"), TimeSpan.FromSeconds(10)));

            string log = File.ReadAllText(out0); // --open-mode=append keeps both attempts
            output.WriteLine(log);
            Assert.Contains("stand-in 0 restart=none", log);
            Assert.Contains("[batch] got SIGUSR1, forwarding to task", log);
            Assert.Contains("stand-in 0 got USR1, checkpointing", log);
            Assert.Contains("[batch] task exited with 3", log);
            Assert.Contains($"[batch] requeueing {job}_0", log);
            Assert.Contains("stand-in 0 restart=1", log);
            Assert.Contains("stand-in 0 resumed, finishing", log);
            Assert.Contains("[batch] task exited with 0", log);
            Assert.DoesNotContain("requeueing", File.ReadAllText(Path.Combine(plan.SweepDir, $"slurm-{job}_1.out")));
            output.WriteLine($"took {clock.Elapsed.TotalSeconds:0.0} s");
        }
        finally
        {
            Run("scancel", job);
        }
    }
}
