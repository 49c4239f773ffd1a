using System.Globalization;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// <c>sweep task FILE [--index I]</c>: resolves run I (from <c>SLURM_ARRAY_TASK_ID</c> when no index is given) and hands it to an
/// <see cref="ITrainTask"/>. A run whose folder already holds a finished summary returns 0 without training again.
/// </summary>
public static class SweepTaskRunner
{
    public const string ArrayTaskIdVariable = "SLURM_ARRAY_TASK_ID";

    /// <summary>The run index: <paramref name="index"/>, else <c>SLURM_ARRAY_TASK_ID</c> from <paramref name="environment"/> (default: the process's).</summary>
    public static int ResolveIndex(int? index, Func<string, string?>? environment = null)
    {
        if (index is int i) return i;
        string? text = (environment ?? Environment.GetEnvironmentVariable)(ArrayTaskIdVariable);
        if (string.IsNullOrWhiteSpace(text))
            throw new SweepFileException($"no run index: pass --index or set {ArrayTaskIdVariable}") { Key = "index" };
        if (!int.TryParse(text, NumberStyles.Integer, CultureInfo.InvariantCulture, out int v))
            throw new SweepFileException($"{ArrayTaskIdVariable}='{text}' is not an integer") { Key = ArrayTaskIdVariable };
        return v;
    }

    /// <summary>Runs one task of <paramref name="plan"/>; returns the train task's exit code (0 at once for a finished run).</summary>
    public static int Run(SweepPlan plan, int index, ITrainTask task, CancellationToken ct, TextWriter? log = null)
    {
        var run = plan.Run(index);
        var status = RunFolderInspector.Inspect(plan.RunDir(run));
        if (status.State == RunFolderState.Done)
        {
            log?.WriteLine($"sweep {plan.Name}: run {index} ({run.Id}) is already done");
            return 0;
        }
        log?.WriteLine($"sweep {plan.Name}: run {index} ({run.Id}) {string.Join(" ", run.OverrideStrings)}");
        return task.Run(plan.BasePath, run.OverrideStrings, plan.RunsDir, plan.Name, run.Id, ct);
    }
}
