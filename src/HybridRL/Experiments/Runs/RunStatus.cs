using System.Text.Json;
using HybridRL.Checkpoints;

namespace HybridRL.Experiments.Runs;

/// <summary>
/// The state of a run judged from its folder, in this order: summary.json with status "done" → Done;
/// run.lock held by a live process → Running; failed.json → Failed; any checkpoint or metrics.csv → Interrupted;
/// otherwise Pending. <see cref="Detail"/> explains the verdict.
/// </summary>
public sealed record RunStatus(RunState State, string Detail)
{
    public static RunStatus Detect(RunFolder folder, TimeSpan? foreignLockStaleAfter = null)
    {
        ArgumentNullException.ThrowIfNull(folder);
        string? summaryProblem = null;
        if (File.Exists(folder.SummaryPath))
        {
            string? status = ReadStringProperty(folder.SummaryPath, "status", out summaryProblem);
            if (status == "done") return new RunStatus(RunState.Done, "summary.json reports status \"done\"");
            summaryProblem ??= $"summary.json has status \"{status}\", not \"done\"";
        }

        string? staleNote = null;
        if (File.Exists(folder.LockPath))
        {
            var check = RunLock.Check(folder.LockPath, foreignLockStaleAfter);
            if (check.Held) return new RunStatus(RunState.Running, check.Reason);
            staleNote = "stale run.lock: " + check.Reason;
        }

        if (File.Exists(folder.FailedPath))
        {
            string? message = ReadStringProperty(folder.FailedPath, "error", out _) ?? ReadStringProperty(folder.FailedPath, "message", out _);
            return new RunStatus(RunState.Failed, message is null ? "failed.json is present" : "failed: " + message);
        }

        var checkpoints = CheckpointStore.List(folder.CheckpointsDir);
        if (checkpoints.Count > 0 || File.Exists(folder.MetricsPath))
        {
            string detail = checkpoints.Count > 0
                ? $"not finished; newest checkpoint {Path.GetFileName(checkpoints[0].Path)}"
                : "not finished; metrics.csv exists but no checkpoint was written";
            if (staleNote is not null) detail += "; " + staleNote;
            if (summaryProblem is not null) detail += "; " + summaryProblem;
            return new RunStatus(RunState.Interrupted, detail);
        }

        return new RunStatus(RunState.Pending, staleNote ?? summaryProblem ?? "not started");
    }

    private static string? ReadStringProperty(string path, string property, out string? problem)
    {
        problem = null;
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllText(path));
            if (doc.RootElement.ValueKind == JsonValueKind.Object
                && doc.RootElement.TryGetProperty(property, out var v) && v.ValueKind == JsonValueKind.String)
                return v.GetString();
            return null;
        }
        catch (JsonException ex)
        {
            problem = $"'{Path.GetFileName(path)}' is not valid JSON ({ex.Message})";
            return null;
        }
        catch (IOException ex)
        {
            problem = $"'{Path.GetFileName(path)}' could not be read ({ex.Message})";
            return null;
        }
    }
}
