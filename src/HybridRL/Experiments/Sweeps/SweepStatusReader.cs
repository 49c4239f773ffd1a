using System.Globalization;
using System.Text;
using HybridRL.Experiments.Executors;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// <c>sweep status</c>: each run's state from its run folder, plus its Slurm state from the queue for the jobs this sweep submitted
/// (<c>slurm-jobs.txt</c>; the newest job holding an index wins).
/// </summary>
public static class SweepStatusReader
{
    /// <summary>Rows for all runs. <paramref name="queue"/>: parsed squeue output, or null when Slurm is not available.</summary>
    public static IReadOnlyList<SweepRunStatus> Read(SweepPlan plan, IReadOnlyList<SlurmQueueEntry>? queue, Func<int, bool>? isAlive = null)
    {
        var slurm = new Dictionary<int, (string Job, string State)>();
        if (queue is not null)
        {
            var jobs = SubmittedJobs.Read(plan.SweepDir);
            foreach (var job in jobs) // oldest first: newer jobs overwrite
                foreach (var e in queue)
                    if (e.JobId == job && e.ArrayIndex is int i)
                        slurm[i] = (e.JobId, e.State);
        }
        return plan.Runs.Select(r =>
        {
            var folder = RunFolderInspector.Inspect(plan.RunDir(r), isAlive);
            bool queued = slurm.TryGetValue(r.Index, out var s);
            return new SweepRunStatus(r.Index, r.Id, folder, queued ? $"{s.Job}_{r.Index}" : null, queued ? s.State : null);
        }).ToArray();
    }

    /// <summary>Text table (index, id, state, Slurm state, detail) and a count per state.</summary>
    public static string Format(IReadOnlyList<SweepRunStatus> rows)
    {
        var sb = new StringBuilder();
        int idWidth = Math.Max(2, rows.Count == 0 ? 2 : rows.Max(r => r.RunId.Length));
        bool anySlurm = rows.Any(r => r.SlurmState is not null);
        sb.Append("index  ").Append("id".PadRight(idWidth)).Append("  state       ");
        if (anySlurm) sb.Append("slurm                  ");
        sb.Append("detail\n");
        foreach (var r in rows)
        {
            sb.Append(r.Index.ToString(CultureInfo.InvariantCulture).PadLeft(5)).Append("  ").Append(r.RunId.PadRight(idWidth)).Append("  ")
              .Append(r.Folder.State.ToString().ToLowerInvariant().PadRight(12));
            if (anySlurm) sb.Append((r.SlurmState is null ? "-" : $"{r.SlurmState} {r.SlurmJob}").PadRight(23));
            sb.Append(r.Folder.Detail).Append('\n');
        }
        var counts = rows.GroupBy(r => r.Folder.State).OrderBy(g => g.Key).Select(g => $"{g.Key.ToString().ToLowerInvariant()} {g.Count()}");
        sb.Append(CultureInfo.InvariantCulture, $"{rows.Count} runs: {string.Join(", ", counts)}\n");
        return sb.ToString();
    }
}
