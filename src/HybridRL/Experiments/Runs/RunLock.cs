using System.Diagnostics;
using System.Text;
using System.Text.Json;
using HybridRL.Checkpoints;

namespace HybridRL.Experiments.Runs;

/// <summary>
/// Exclusive ownership of a run folder through a <c>run.lock</c> file created exclusively and whole
/// (written to a temporary file, then moved into place without overwriting), holding JSON <c>{"pid","host","started","heartbeat"}</c>. It needs no
/// POSIX advisory locks, so it works on shared cluster file systems (NFS ≥ v3 honours exclusive create).
/// <list type="bullet">
/// <item>Holder on this host and its pid alive (and started before the lock was written) → refused, naming pid and host.</item>
/// <item>Holder on this host but the pid is dead, or has been reused by a newer process → stale: taken over, and <see cref="TakeoverNote"/> says so.</item>
/// <item>Holder on another host → refused unless its last heartbeat is older than the configurable staleness
///       (default <see cref="DefaultForeignStaleAfter"/>); the holder should call <see cref="Touch"/> at every checkpoint.</item>
/// </list>
/// A takeover renames the stale file away first (only one contender can rename it), checks that what it renamed
/// is still the stale content, then creates a fresh lock exclusively.
/// </summary>
public sealed class RunLock : IDisposable
{
    /// <summary>Default time after the last heartbeat at which a lock from another host counts as stale.</summary>
    public static readonly TimeSpan DefaultForeignStaleAfter = TimeSpan.FromHours(2);

    /// <summary>A lock file that cannot be parsed is treated as stale once it is older than this (a writer died between create and write).</summary>
    private static readonly TimeSpan UnreadableGrace = TimeSpan.FromSeconds(60);

    private static readonly JsonSerializerOptions Json = new() { WriteIndented = false };
    private bool _released;

    private RunLock(string path, RunLockInfo info, string? takeoverNote)
    {
        LockPath = path;
        Info = info;
        TakeoverNote = takeoverNote;
    }

    public string LockPath { get; }
    public RunLockInfo Info { get; private set; }
    /// <summary>Set when a stale lock was taken over: says whose and why.</summary>
    public string? TakeoverNote { get; }

    /// <summary>Acquires run.lock of <paramref name="folder"/>.</summary>
    public static RunLock Acquire(RunFolder folder, TimeSpan? foreignStaleAfter = null)
    {
        ArgumentNullException.ThrowIfNull(folder);
        Directory.CreateDirectory(folder.Root);
        return Acquire(folder.LockPath, foreignStaleAfter);
    }

    /// <summary>Acquires the lock file at <paramref name="lockPath"/>, taking over a stale one.</summary>
    /// <exception cref="RunLockedException">the lock is held by a live process, or by another host and not yet stale.</exception>
    public static RunLock Acquire(string lockPath, TimeSpan? foreignStaleAfter = null)
    {
        string path = Path.GetFullPath(lockPath);
        TimeSpan staleAfter = foreignStaleAfter ?? DefaultForeignStaleAfter;
        string? note = null;
        for (int attempt = 0; attempt < 3; attempt++)
        {
            var mine = new RunLockInfo(Environment.ProcessId, Environment.MachineName, DateTime.UtcNow);
            if (TryCreate(path, mine))
                return new RunLock(path, mine, note);

            string? seenText = TryReadText(path);
            if (seenText is null) continue; // vanished between our create and read: try again
            var check = Inspect(path, seenText, staleAfter);
            if (check.Held)
                throw new RunLockedException(path, check.Holder, $"run folder '{Path.GetDirectoryName(path)}' is locked: {check.Reason}. Lock file: '{path}'.");

            // Stale: move it aside atomically, make sure we moved the file we judged, then retry the exclusive create.
            string aside = path + ".stale-" + Environment.ProcessId + "-" + Guid.NewGuid().ToString("N")[..8];
            try
            {
                File.Move(path, aside, overwrite: false);
            }
            catch (FileNotFoundException) { continue; }
            catch (IOException) { continue; }
            string? movedText = TryReadText(aside);
            if (movedText != seenText)
            {
                // Another process replaced the stale lock with a fresh one between our read and rename: put it back.
                try { File.Move(aside, path, overwrite: false); } catch (IOException) { }
                throw new RunLockedException(path, null, $"run folder '{Path.GetDirectoryName(path)}': another process took over the stale lock at the same time; not starting. Lock file: '{path}'.");
            }
            AtomicFile.TryDelete(aside);
            note = $"took over stale run lock '{path}': {check.Reason}";
        }
        throw new RunLockedException(path, null, $"could not acquire run lock '{path}': it kept changing while being taken over");
    }

    /// <summary>Whether the lock at <paramref name="lockPath"/> is currently held, and by whom. A missing file is not held.</summary>
    public static RunLockCheck Check(string lockPath, TimeSpan? foreignStaleAfter = null)
    {
        string? text = TryReadText(lockPath);
        if (text is null) return new RunLockCheck(false, null, "no lock file");
        return Inspect(lockPath, text, foreignStaleAfter ?? DefaultForeignStaleAfter);
    }

    /// <summary>Refreshes the heartbeat (atomic rewrite of the lock file). Call it at every checkpoint.</summary>
    public void Touch()
    {
        ObjectDisposedException.ThrowIf(_released, this);
        Info = Info with { Heartbeat = DateTime.UtcNow };
        AtomicFile.WriteAllText(LockPath, JsonSerializer.Serialize(Info, Json));
    }

    /// <summary>Releases the lock: deletes run.lock if it still names this process.</summary>
    public void Dispose()
    {
        if (_released) return;
        _released = true;
        string? text = TryReadText(LockPath);
        var current = text is null ? null : TryParse(text);
        if (current is not null && current.Pid == Info.Pid && SameHost(current.Host, Info.Host) && current.Started == Info.Started)
            AtomicFile.TryDelete(LockPath);
    }

    /// <summary>
    /// Creates the lock with its whole content in one step: the JSON goes to a private temporary file first,
    /// which is then moved to <c>run.lock</c> without overwriting (a hard link on Unix, so exclusive like O_EXCL).
    /// A process killed at any moment therefore never leaves an empty or half-written run.lock behind.
    /// </summary>
    private static bool TryCreate(string path, RunLockInfo info)
    {
        string temp = AtomicFile.TempPathFor(path);
        try
        {
            using (var fs = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.Read))
            {
                fs.Write(Encoding.UTF8.GetBytes(JsonSerializer.Serialize(info, Json)));
                fs.Flush(flushToDisk: true);
            }
            File.Move(temp, path, overwrite: false);
            return true;
        }
        catch (IOException) when (File.Exists(path))
        {
            return false;
        }
        finally
        {
            AtomicFile.TryDelete(temp);
        }
    }

    private static RunLockCheck Inspect(string path, string text, TimeSpan staleAfter)
    {
        var info = TryParse(text);
        if (info is null)
        {
            DateTime written = File.Exists(path) ? File.GetLastWriteTimeUtc(path) : DateTime.MinValue;
            TimeSpan age = DateTime.UtcNow - written;
            return age > UnreadableGrace
                ? new RunLockCheck(false, null, $"the lock file is unreadable and {age.TotalSeconds:F0} s old (its writer died)")
                : new RunLockCheck(true, null, "the lock file is unreadable but fresh (it may still be being written)");
        }

        if (SameHost(info.Host, Environment.MachineName))
        {
            var (alive, why) = ProcessAlive(info);
            return alive
                ? new RunLockCheck(true, info, $"held by live process {info}")
                : new RunLockCheck(false, info, $"the holder {info} is not running ({why})");
        }

        TimeSpan since = DateTime.UtcNow - info.LastSeenUtc;
        return since > staleAfter
            ? new RunLockCheck(false, info, $"the holder {info} is on another host and was last seen {FormatAge(since)} ago, longer than the staleness limit of {FormatAge(staleAfter)}")
            : new RunLockCheck(true, info, $"held by {info}, on another host, last seen {FormatAge(since)} ago (it counts as stale only after {FormatAge(staleAfter)})");
    }

    private static (bool Alive, string Why) ProcessAlive(RunLockInfo info)
    {
        if (info.Pid <= 0) return (false, $"pid {info.Pid} is invalid");
        Process p;
        try
        {
            p = Process.GetProcessById(info.Pid);
        }
        catch (ArgumentException)
        {
            return (false, "no such process");
        }
        using (p)
        {
            try
            {
                if (p.HasExited) return (false, "the process has exited");
                // pid reuse: a process that started after the lock was written cannot be its writer
                DateTime startUtc = p.StartTime.ToUniversalTime();
                if (startUtc > info.Started.ToUniversalTime() + TimeSpan.FromSeconds(5))
                    return (false, $"pid {info.Pid} now belongs to a process started at {startUtc:O}, after the lock was written");
            }
            catch (Exception ex) when (ex is InvalidOperationException or System.ComponentModel.Win32Exception or NotSupportedException)
            {
                return (true, "cannot inspect the process; assuming it is alive");
            }
            return (true, "running");
        }
    }

    private static bool SameHost(string a, string b) => string.Equals(a, b, StringComparison.OrdinalIgnoreCase);

    private static string FormatAge(TimeSpan t) =>
        t.TotalHours >= 1 ? $"{t.TotalHours:F1} h" : t.TotalMinutes >= 1 ? $"{t.TotalMinutes:F0} min" : $"{t.TotalSeconds:F0} s";

    private static RunLockInfo? TryParse(string text)
    {
        try
        {
            var info = JsonSerializer.Deserialize<RunLockInfo>(text, Json);
            return info is { Host: not null } ? info : null;
        }
        catch (JsonException)
        {
            return null;
        }
    }

    private static string? TryReadText(string path)
    {
        try
        {
            return File.ReadAllText(path);
        }
        catch (FileNotFoundException) { return null; }
        catch (DirectoryNotFoundException) { return null; }
    }
}
