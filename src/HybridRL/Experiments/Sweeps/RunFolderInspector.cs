using System.Diagnostics;
using System.Text.Json;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// Classifies a run folder from its files (layout from the shared run-folder contract): <c>summary.json</c> with status done → Done;
/// <c>run.lock</c> ({pid, host, started}) naming a live process → Running; <c>failed.json</c> → Failed; <c>checkpoints/</c> or a stale
/// lock → Interrupted; otherwise Pending. Reads only; never takes or removes a lock.
/// </summary>
public static class RunFolderInspector
{
    public const string SummaryFile = "summary.json";
    public const string LockFile = "run.lock";
    public const string FailedFile = "failed.json";
    public const string CheckpointsDir = "checkpoints";

    /// <summary>Classifies <paramref name="runDir"/>. <paramref name="isAlive"/> decides whether a pid on this host lives (default: the OS).</summary>
    public static RunFolderStatus Inspect(string runDir, Func<int, bool>? isAlive = null)
    {
        if (!Directory.Exists(runDir)) return new RunFolderStatus(RunFolderState.Pending, "no run folder");

        string summary = Path.Combine(runDir, SummaryFile);
        if (File.Exists(summary))
        {
            string? status = ReadString(summary, "status");
            if (status == "done") return new RunFolderStatus(RunFolderState.Done, "summary.json");
        }

        bool staleLock = false;
        string lockPath = Path.Combine(runDir, LockFile);
        if (File.Exists(lockPath))
        {
            var (pid, host) = ReadLock(lockPath);
            if (pid is int p)
            {
                bool sameHost = host is null || string.Equals(host, Environment.MachineName, StringComparison.OrdinalIgnoreCase);
                if (!sameHost) return new RunFolderStatus(RunFolderState.Running, $"pid {p} on {host}");
                if ((isAlive ?? ProcessIsAlive)(p)) return new RunFolderStatus(RunFolderState.Running, $"pid {p}");
            }
            staleLock = true;
        }

        if (File.Exists(Path.Combine(runDir, FailedFile)))
        {
            string? error = ReadString(Path.Combine(runDir, FailedFile), "error") ?? ReadString(Path.Combine(runDir, FailedFile), "message");
            return new RunFolderStatus(RunFolderState.Failed, error is null ? "failed.json" : $"failed.json: {error}");
        }
        string ckpt = Path.Combine(runDir, CheckpointsDir);
        if (Directory.Exists(ckpt) && Directory.EnumerateFileSystemEntries(ckpt).Any())
            return new RunFolderStatus(RunFolderState.Interrupted, staleLock ? "checkpoints, stale run.lock" : "checkpoints, no summary");
        if (staleLock) return new RunFolderStatus(RunFolderState.Interrupted, "stale run.lock, no checkpoint");
        return new RunFolderStatus(RunFolderState.Pending, "no progress yet");
    }

    /// <summary>Whether process <paramref name="pid"/> exists on this machine.</summary>
    public static bool ProcessIsAlive(int pid)
    {
        if (OperatingSystem.IsLinux()) return Directory.Exists($"/proc/{pid}");
        try
        {
            using var p = Process.GetProcessById(pid);
            return !p.HasExited;
        }
        catch (ArgumentException) { return false; }
        catch (InvalidOperationException) { return false; }
    }

    private static (int? Pid, string? Host) ReadLock(string path)
    {
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllText(path));
            int? pid = doc.RootElement.TryGetProperty("pid", out var p) && p.ValueKind == JsonValueKind.Number && p.TryGetInt32(out int v) ? v : null;
            string? host = doc.RootElement.TryGetProperty("host", out var h) && h.ValueKind == JsonValueKind.String ? h.GetString() : null;
            return (pid, host);
        }
        catch (Exception e) when (e is JsonException or IOException or UnauthorizedAccessException)
        {
            return (null, null); // unreadable or half-written lock: treat as stale
        }
    }

    private static string? ReadString(string path, string property)
    {
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllText(path));
            return doc.RootElement.ValueKind == JsonValueKind.Object && doc.RootElement.TryGetProperty(property, out var s) && s.ValueKind == JsonValueKind.String
                ? s.GetString() : null;
        }
        catch (Exception e) when (e is JsonException or IOException or UnauthorizedAccessException)
        {
            return null;
        }
    }
}
