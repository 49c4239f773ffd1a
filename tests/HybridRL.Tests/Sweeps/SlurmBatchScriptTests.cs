using System.Diagnostics;
using HybridRL.Experiments.Executors;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Tests.Sweeps;

public class SlurmBatchScriptTests
{
    [Fact]
    public void Array_spec_compresses_indices_and_adds_the_throttle()
    {
        Assert.Equal("0-2,5,7-8%3", SlurmBatchScript.ArraySpec([8, 0, 1, 2, 5, 7], 3));
        Assert.Equal("4", SlurmBatchScript.ArraySpec([4], null));
    }

    [Fact]
    public void Job_id_is_read_from_parsable_and_plain_sbatch_output()
    {
        Assert.Equal("1234", SlurmSubmitter.ParseJobId("1234\n"));
        Assert.Equal("1234", SlurmSubmitter.ParseJobId("1234;cluster-a\n"));
        Assert.Equal("77", SlurmSubmitter.ParseJobId("Submitted batch job 77\n"));
        Assert.Null(SlurmSubmitter.ParseJobId("sbatch: error: Batch job submission failed\n"));
    }

    [Fact]
    public void Dry_run_script_holds_the_array_requeue_signal_and_trap_logic()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("sb.yaml", "base: base-experiment.yaml\nname: sb\nseeds: [1, 2, 3, 4, 5, 6]\n"), files.Dir);
        File.WriteAllText(Path.Combine(Directory.CreateDirectory(plan.RunDir(plan.Runs[2])).FullName, "summary.json"), """{"status":"done"}""");
        var command = new HybridRLTaskCommand(["/opt/hybridrl/hybridrl"]);
        var submitter = new SlurmSubmitter(command);
        var sub = submitter.Submit(plan, new SlurmSubmitOptions { Partition = "cpu", Time = "4:00:00", MaxParallel = 2, SignalLeadSeconds = 300, CpusPerTask = 2 }, dryRun: true);
        Assert.Null(sub.JobId);
        Assert.False(File.Exists(sub.ScriptPath)); // a dry run writes nothing
        Assert.Equal([0, 1, 3, 4, 5], sub.Indices);
        var lines = sub.Script.Split('\n');
        Assert.Equal("#!/bin/bash", lines[0]);
        Assert.Contains("#SBATCH --array=0-1,3-5%2", lines);
        Assert.Contains("#SBATCH --requeue", lines);
        Assert.Contains("#SBATCH --signal=B:USR1@300", lines);
        Assert.Contains("#SBATCH --open-mode=append", lines);
        Assert.Contains($"#SBATCH --output={plan.SweepDir}/slurm-%A_%a.out", lines);
        Assert.Contains("#SBATCH --partition=cpu", lines);
        Assert.Contains("#SBATCH --time=4:00:00", lines);
        Assert.Contains("#SBATCH --cpus-per-task=2", lines);
        Assert.Contains("#SBATCH --job-name=sb", lines);
        Assert.Contains($"task_cmd=(/opt/hybridrl/hybridrl sweep task {plan.SweepFile})", lines);
        Assert.Contains("trap 'on_signal USR1' USR1", lines);
        Assert.Contains("trap 'on_signal TERM' TERM", lines);
        Assert.Contains("    scontrol requeue \"$self\"", lines);
        Assert.Contains("\"${task_cmd[@]}\" &", lines);
        // the requeue is the last command before exit in finish()
        int requeue = Array.IndexOf(lines, "    scontrol requeue \"$self\"");
        Assert.Equal("  fi", lines[requeue + 1]);
        Assert.Equal("  exit \"$rc\"", lines[requeue + 2]);

        // bash accepts the script's syntax
        string path = files.Write("check.sbatch", sub.Script);
        using var p = Process.Start(new ProcessStartInfo("bash", ["-n", path]) { RedirectStandardError = true })!;
        string err = p.StandardError.ReadToEnd();
        p.WaitForExit();
        Assert.True(p.ExitCode == 0, err);
    }

    [Fact]
    public async Task Batch_script_forwards_usr1_waits_and_reports_the_tasks_exit_code_without_slurm()
    {
        // Runs the generated script with plain bash (no Slurm): scontrol is replaced by a recorder on PATH,
        // the task is a shell that traps USR1 and exits 3. Proves forward + wait + requeue-on-3 independent of a cluster.
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("loc.yaml", "base: base-experiment.yaml\nname: loc\n"), files.Dir);
        string marks = Directory.CreateDirectory(Path.Combine(files.Dir, "marks")).FullName;
        var command = new ScriptTaskCommand(["/bin/bash", "-c", $"trap 'echo got-usr1 > {marks}/usr1; exit 3' USR1; touch {marks}/ready; for i in $(seq 1 300); do sleep 0.05; done; exit 0"]);
        string script = SlurmBatchScript.Build(plan, [0], new SlurmSubmitOptions(), command);
        string scriptPath = files.Write("job.sh", script);
        string bin = Directory.CreateDirectory(Path.Combine(files.Dir, "bin")).FullName;
        File.WriteAllText(Path.Combine(bin, "scontrol"), $"#!/bin/sh\necho \"$@\" > {marks}/scontrol\n");
        if (!OperatingSystem.IsWindows()) File.SetUnixFileMode(Path.Combine(bin, "scontrol"), UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);

        var psi = new ProcessStartInfo("/bin/bash", [scriptPath]) { RedirectStandardOutput = true };
        psi.Environment["PATH"] = bin + ":" + Environment.GetEnvironmentVariable("PATH");
        psi.Environment["SLURM_ARRAY_JOB_ID"] = "500";
        psi.Environment["SLURM_ARRAY_TASK_ID"] = "0";
        using var p = Process.Start(psi)!;
        var output = p.StandardOutput.ReadToEndAsync();
        var sw = Stopwatch.StartNew();
        while (!File.Exists(Path.Combine(marks, "ready")) && sw.Elapsed < TimeSpan.FromSeconds(10)) Thread.Sleep(20);
        Assert.True(ProcessSignals.Send(p.Id, ProcessSignals.SIGUSR1));
        string text = await output;
        Assert.True(p.WaitForExit(10_000));
        Assert.Equal(3, p.ExitCode);
        Assert.Equal("got-usr1\n", File.ReadAllText(Path.Combine(marks, "usr1")));
        Assert.Equal("requeue 500_0\n", File.ReadAllText(Path.Combine(marks, "scontrol")));
        Assert.Contains("[batch] got SIGUSR1, forwarding", text);
        Assert.Contains("[batch] task exited with 3", text);
    }
}
