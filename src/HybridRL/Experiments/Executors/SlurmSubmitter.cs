using System.Text.RegularExpressions;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Experiments.Executors;

/// <summary>
/// <c>sweep submit</c>: writes <c>&lt;sweep folder&gt;/sweep.sbatch</c> for a job array over the runs still to do, submits it with
/// <c>sbatch --parsable</c> and records the job id in <c>slurm-jobs.txt</c>. A dry run returns the script without submitting.
/// </summary>
public sealed partial class SlurmSubmitter(ITaskCommand command, ICommandRunner? runner = null)
{
    private readonly ICommandRunner _runner = runner ?? ProcessCommandRunner.Instance;

    [GeneratedRegex(@"^\s*(?:Submitted batch job\s+)?(\d+)(?:;\S+)?\s*$", RegexOptions.Multiline)]
    private static partial Regex JobIdLine();

    /// <summary>Indices to submit: all, or (default) those whose run folder is not done and not running.</summary>
    public static IReadOnlyList<int> SelectIndices(SweepPlan plan, SlurmSubmitOptions options) =>
        plan.Runs
            .Where(r => !options.OnlyUnfinished || RunFolderInspector.Inspect(plan.RunDir(r)).State is not (RunFolderState.Done or RunFolderState.Running))
            .Select(r => r.Index)
            .ToArray();

    /// <summary>Writes the script and (unless <paramref name="dryRun"/>) submits it. No runs left: no script, JobId null.</summary>
    public SlurmSubmission Submit(SweepPlan plan, SlurmSubmitOptions options, bool dryRun = false)
    {
        var indices = SelectIndices(plan, options);
        string scriptPath = Path.Combine(plan.SweepDir, SlurmBatchScript.FileName);
        if (indices.Count == 0) return new SlurmSubmission(scriptPath, "", indices, null);
        string script = SlurmBatchScript.Build(plan, indices, options, command);
        if (dryRun) return new SlurmSubmission(scriptPath, script, indices, null);

        Directory.CreateDirectory(plan.SweepDir); // Slurm does not create the output folder
        string tmp = scriptPath + ".tmp";
        File.WriteAllText(tmp, script);
        File.Move(tmp, scriptPath, overwrite: true);

        if (!_runner.IsAvailable("sbatch")) throw new ExecutorException("sbatch is not on PATH: run sweep submit on a Slurm login node (or use --dry-run)");
        var result = _runner.Run("sbatch", ["--parsable", scriptPath], TimeSpan.FromSeconds(60));
        if (result.ExitCode != 0)
            throw new ExecutorException($"sbatch {scriptPath} failed with exit code {result.ExitCode}: {result.StandardError.Trim()}");
        string jobId = ParseJobId(result.StandardOutput)
            ?? throw new ExecutorException($"could not read a job id from sbatch's output '{result.StandardOutput.Trim()}'");
        SubmittedJobs.Append(plan.SweepDir, jobId);
        return new SlurmSubmission(scriptPath, script, indices, jobId);
    }

    /// <summary>The job id from <c>sbatch --parsable</c> (<c>123</c> or <c>123;cluster</c>) or plain sbatch (<c>Submitted batch job 123</c>) output.</summary>
    public static string? ParseJobId(string sbatchOutput)
    {
        var m = JobIdLine().Match(sbatchOutput);
        return m.Success ? m.Groups[1].Value : null;
    }
}
