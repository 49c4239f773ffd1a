using System.Globalization;
using System.Text;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Experiments.Executors;

/// <summary>
/// Writes the sbatch script for a sweep's job array. Slurm's <c>--signal=B:USR1@N</c> (and <c>scancel --signal --batch</c>) reach only
/// the batch shell, so the script runs the task in the background, traps USR1 and TERM, forwards the signal to the task and waits
/// for its real exit status. When the task exits with 3 (interrupted after a checkpoint) the script requeues its own array element
/// as its very last action (a requeue from inside the job ends the shell); the rerun keeps the array index and resumes.
/// </summary>
public static class SlurmBatchScript
{
    /// <summary>Name of the script written into the sweep folder.</summary>
    public const string FileName = "sweep.sbatch";

    /// <summary>Output file pattern inside the sweep folder (job id, array index).</summary>
    public const string OutputPattern = "slurm-%A_%a.out";

    /// <summary>The exit code that means "interrupted after a checkpoint, requeue me".</summary>
    public const int ResumableExitCode = 3;

    /// <summary>Compact array spec for indices, e.g. <c>0-3,7,9-10</c>, plus <c>%M</c> when throttled.</summary>
    public static string ArraySpec(IReadOnlyList<int> indices, int? maxParallel)
    {
        if (indices.Count == 0) throw new ArgumentException("no array indices", nameof(indices));
        var sorted = indices.Distinct().Order().ToArray();
        var parts = new List<string>();
        int start = sorted[0], prev = sorted[0];
        for (int i = 1; i <= sorted.Length; i++)
        {
            if (i < sorted.Length && sorted[i] == prev + 1) { prev = sorted[i]; continue; }
            parts.Add(start == prev ? start.ToString(CultureInfo.InvariantCulture) : $"{start}-{prev}");
            if (i < sorted.Length) start = prev = sorted[i];
        }
        string spec = string.Join(",", parts);
        return maxParallel is int m ? $"{spec}%{m}" : spec;
    }

    /// <summary>The script text for running <paramref name="indices"/> of <paramref name="plan"/> with <paramref name="command"/>.</summary>
    public static string Build(SweepPlan plan, IReadOnlyList<int> indices, SlurmSubmitOptions options, ITaskCommand command)
    {
        if (options.MaxParallel is < 1) throw new ArgumentOutOfRangeException(nameof(options), options.MaxParallel, "max-parallel must be at least 1");
        if (options.SignalLeadSeconds < 1) throw new ArgumentOutOfRangeException(nameof(options), options.SignalLeadSeconds, "signal lead must be at least 1 s");
        var ic = CultureInfo.InvariantCulture;
        string workDir = Path.GetFullPath(options.WorkingDirectory ?? Directory.GetCurrentDirectory());
        var sb = new StringBuilder();
        sb.Append("#!/bin/bash\n");
        sb.Append(ic, $"#SBATCH --job-name={SafeJobName(plan.Name)}\n");
        sb.Append(ic, $"#SBATCH --array={ArraySpec(indices, options.MaxParallel)}\n");
        sb.Append("#SBATCH --requeue\n");
        sb.Append(ic, $"#SBATCH --signal=B:USR1@{options.SignalLeadSeconds}\n");
        sb.Append("#SBATCH --open-mode=append\n");
        sb.Append(ic, $"#SBATCH --output={SbatchPath(Path.Combine(plan.SweepDir, OutputPattern))}\n");
        sb.Append(ic, $"#SBATCH --chdir={SbatchPath(workDir)}\n");
        if (options.Partition is { } p) sb.Append(ic, $"#SBATCH --partition={Checked(p, "partition")}\n");
        if (options.Time is { } t) sb.Append(ic, $"#SBATCH --time={Checked(t, "time")}\n");
        if (options.CpusPerTask is int c) sb.Append(ic, $"#SBATCH --cpus-per-task={c}\n");
        if (options.Memory is { } mem) sb.Append(ic, $"#SBATCH --mem={Checked(mem, "mem")}\n");
        foreach (var extra in options.ExtraOptions) sb.Append(ic, $"#SBATCH {Checked(extra, "extra option")}\n");
        sb.Append(ic, $"# sweep {plan.Name}: {plan.Runs.Count} runs, written by hybridrl sweep submit\n");
        sb.Append("\n");
        sb.Append(ic, $"task_cmd=({string.Join(" ", command.ForArrayTask(plan.SweepFile).Select(ShellQuoting.Quote))})\n");
        sb.Append("""
            self="${SLURM_ARRAY_JOB_ID:+${SLURM_ARRAY_JOB_ID}_${SLURM_ARRAY_TASK_ID}}"
            self="${self:-$SLURM_JOB_ID}"
            echo "[batch] task ${SLURM_ARRAY_TASK_ID:-?} of job $self, restart ${SLURM_RESTART_COUNT:-0}, on $(hostname), $(date -Iseconds)"
            task_pid=""
            rc=0
            interrupted=0

            forward() { # pass a signal on to the task; a wait it interrupts is repeated
              interrupted=1
              echo "[batch] got SIG$1, forwarding to task $task_pid"
              [ -n "$task_pid" ] && kill -s "$1" "$task_pid" 2>/dev/null
            }

            collect() { # wait for the task's real exit status (a trapped signal makes wait return early with >128)
              while :; do
                interrupted=0
                wait "$task_pid"
                rc=$?
                [ "$interrupted" = 1 ] || break
              done
            }

            finish() { # last action: requeue this array element when the task was interrupted after a checkpoint
              echo "[batch] task exited with $rc, $(date -Iseconds)"

            """);
        sb.Append(ic, $"  if [ \"$rc\" -eq {ResumableExitCode} ]; then\n");
        sb.Append("""
                echo "[batch] requeueing $self"
                scontrol requeue "$self"
              fi
              exit "$rc"
            }

            on_signal() { # trap handler: forward, wait for the task to checkpoint and exit, then finish (never returns)
              trap 'forward USR1' USR1
              trap 'forward TERM' TERM
              forward "$1"
              collect
              finish
            }

            trap 'on_signal USR1' USR1
            trap 'on_signal TERM' TERM
            "${task_cmd[@]}" &
            task_pid=$!
            collect
            finish

            """);
        return sb.ToString().Replace("\r\n", "\n");
    }

    private static string SafeJobName(string name) => new(name.Select(c => char.IsAsciiLetterOrDigit(c) || c is '-' or '_' or '.' ? c : '_').ToArray());

    private static string SbatchPath(string path)
    {
        // #SBATCH lines are not shell-parsed: a path with spaces or quotes would be misread.
        if (path.Any(c => char.IsWhiteSpace(c) || c is '"' or '\''))
            throw new ExecutorException($"path '{path}' contains spaces or quotes, which #SBATCH lines cannot hold; use a runs folder without them");
        return path;
    }

    private static string Checked(string value, string what)
    {
        if (value.Length == 0 || value.Any(c => c is '\n' or '\r'))
            throw new ExecutorException($"sbatch {what} '{value}' is empty or spans lines");
        return value;
    }
}
