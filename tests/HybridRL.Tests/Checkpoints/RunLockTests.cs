using HybridRL.Tests.Support;
using System.Text.Json;
using HybridRL.Experiments.Runs;

namespace HybridRL.Tests.Checkpoints;

public class RunLockTests
{
    private static void WriteLock(string path, int pid, string host, DateTime started, DateTime? heartbeat = null) =>
        File.WriteAllText(path, JsonSerializer.Serialize(new RunLockInfo(pid, host, started, heartbeat)));

    // Linux pid_max is at most 2^22 (4 194 304; proc(5)), so this pid cannot belong to a running process.
    private const int DeadPid = 0x7FFF_FFF0;

    [Fact]
    public void AcquireWritesPidHostAndStartAndReleaseDeletesIt()
    {
        using var tmp = new TempDirectory();
        var folder = new RunFolder(tmp.Combine("runs", "demo", "demo-0123abcd"));
        using (var l = RunLock.Acquire(folder))
        {
            Assert.Null(l.TakeoverNote);
            using var doc = JsonDocument.Parse(File.ReadAllText(folder.LockPath));
            Assert.Equal(Environment.ProcessId, doc.RootElement.GetProperty("pid").GetInt32());
            Assert.Equal(Environment.MachineName, doc.RootElement.GetProperty("host").GetString());
            Assert.True(doc.RootElement.TryGetProperty("started", out _));
            l.Touch();
            Assert.NotNull(JsonSerializer.Deserialize<RunLockInfo>(File.ReadAllText(folder.LockPath))!.Heartbeat);
            Assert.Equal(RunState.Running, folder.Status().State);
        }
        Assert.False(File.Exists(folder.LockPath));
    }

    [Fact]
    public void LiveProcessOnThisHostIsRefusedWithPidAndHost()
    {
        using var tmp = new TempDirectory();
        string path = tmp.Combine("run.lock");
        WriteLock(path, Environment.ProcessId, Environment.MachineName, DateTime.UtcNow);
        var ex = Assert.Throws<RunLockedException>(() => RunLock.Acquire(path));
        Assert.Contains($"pid {Environment.ProcessId}", ex.Message);
        Assert.Contains(Environment.MachineName, ex.Message);
        Assert.Equal(Environment.ProcessId, ex.Holder!.Pid);

        // a second acquire from the same process is refused too (it would be a double start)
        File.Delete(path);
        using var first = RunLock.Acquire(path);
        Assert.Throws<RunLockedException>(() => RunLock.Acquire(path));
    }

    [Fact]
    public void DeadPidOnThisHostIsTakenOverAndSaysSo()
    {
        using var tmp = new TempDirectory();
        string path = tmp.Combine("run.lock");
        WriteLock(path, DeadPid, Environment.MachineName, DateTime.UtcNow.AddMinutes(-3));
        using var l = RunLock.Acquire(path);
        Assert.NotNull(l.TakeoverNote);
        Assert.Contains("took over stale run lock", l.TakeoverNote);
        Assert.Contains($"pid {DeadPid}", l.TakeoverNote);
        Assert.Equal(Environment.ProcessId, JsonSerializer.Deserialize<RunLockInfo>(File.ReadAllText(path))!.Pid);
        Assert.Single(Directory.GetFiles(tmp.Path)); // the stale file was not left lying around
    }

    [Fact]
    public void ReusedPidIsRecognisedAsStale()
    {
        using var tmp = new TempDirectory();
        string path = tmp.Combine("run.lock");
        // our pid, but a lock "written" long before this process started: the pid has been reused
        WriteLock(path, Environment.ProcessId, Environment.MachineName, new DateTime(2001, 1, 1, 0, 0, 0, DateTimeKind.Utc));
        using var l = RunLock.Acquire(path);
        Assert.Contains("now belongs to a process started", l.TakeoverNote);
    }

    [Fact]
    public void OtherHostIsRefusedUntilStale()
    {
        using var tmp = new TempDirectory();
        string path = tmp.Combine("run.lock");
        WriteLock(path, 1234, "some-other-node", DateTime.UtcNow.AddMinutes(-30));
        var ex = Assert.Throws<RunLockedException>(() => RunLock.Acquire(path, TimeSpan.FromHours(1)));
        Assert.Contains("pid 1234", ex.Message);
        Assert.Contains("some-other-node", ex.Message);
        Assert.Contains("another host", ex.Message);

        // a recent heartbeat keeps an old lock alive
        WriteLock(path, 1234, "some-other-node", DateTime.UtcNow.AddHours(-5), DateTime.UtcNow.AddMinutes(-1));
        Assert.Throws<RunLockedException>(() => RunLock.Acquire(path, TimeSpan.FromHours(1)));

        WriteLock(path, 1234, "some-other-node", DateTime.UtcNow.AddHours(-5), DateTime.UtcNow.AddHours(-2));
        using var l = RunLock.Acquire(path, TimeSpan.FromHours(1));
        Assert.Contains("another host", l.TakeoverNote);
        Assert.Contains("staleness limit", l.TakeoverNote);
    }

    [Fact]
    public void UnreadableLockIsRefusedWhileFreshAndTakenOverWhenOld()
    {
        using var tmp = new TempDirectory();
        string path = tmp.Combine("run.lock");
        File.WriteAllText(path, "");
        Assert.Throws<RunLockedException>(() => RunLock.Acquire(path));
        File.SetLastWriteTimeUtc(path, DateTime.UtcNow.AddMinutes(-10));
        using var l = RunLock.Acquire(path);
        Assert.Contains("unreadable", l.TakeoverNote);
    }

    [Fact]
    public void ReleaseDoesNotDeleteSomeoneElsesLock()
    {
        using var tmp = new TempDirectory();
        string path = tmp.Combine("run.lock");
        var l = RunLock.Acquire(path);
        WriteLock(path, DeadPid, "another", DateTime.UtcNow); // replaced behind our back
        l.Dispose();
        Assert.True(File.Exists(path));
    }
}
