using HybridRL.Tests.Support;
using HybridRL.Checkpoints;
using HybridRL.Experiments.Runs;

namespace HybridRL.Tests.Checkpoints;

public class RunFolderTests
{
    [Fact]
    public void PathsFollowTheRunFolderContract()
    {
        var f = RunFolder.For("/data/runs", "grid-walk", "grid-walk-0123abcd");
        Assert.Equal(Path.GetFullPath("/data/runs/grid-walk/grid-walk-0123abcd"), f.Root);
        Assert.Equal(Path.Combine(f.Root, "config.yaml"), f.ConfigPath);
        Assert.Equal(Path.Combine(f.Root, "resources.json"), f.ResourcesPath);
        Assert.Equal(Path.Combine(f.Root, "metrics.csv"), f.MetricsPath);
        Assert.Equal(Path.Combine(f.Root, "log.json"), f.LogPath);
        Assert.Equal(Path.Combine(f.Root, "checkpoints"), f.CheckpointsDir);
        Assert.Equal(Path.Combine(f.Root, "summary.json"), f.SummaryPath);
        Assert.Equal(Path.Combine(f.Root, "run.lock"), f.LockPath);
        Assert.Equal(Path.Combine(f.Root, "failed.json"), f.FailedPath);
        Assert.Equal(Path.Combine(f.Root, "eval-final.json"), f.EvalPath("final"));
        Assert.Throws<ArgumentException>(() => RunFolder.For("/data/runs", "../escape", "x"));
        Assert.Throws<ArgumentException>(() => f.EvalPath("a/b"));
    }

    [Fact]
    public void StatusFollowsTheFolderContents()
    {
        using var tmp = new TempDirectory();
        var f = new RunFolder(tmp.Combine("r")).EnsureCreated();
        Assert.Equal(RunState.Pending, f.Status().State);

        File.WriteAllText(f.MetricsPath, MetricsCsvWriter.Header + "\n");
        Assert.Equal(RunState.Interrupted, f.Status().State);

        new CheckpointWriter().AddSection("x", w => w.Write(1)).Save(f.CheckpointsDir, 5, new CheckpointHeader { TrainerKind = "t", ConfigHash = "h" }, null);
        var s = f.Status();
        Assert.Equal(RunState.Interrupted, s.State);
        Assert.Contains("ckpt-000000000005.hrlc", s.Detail);

        // a stale lock (dead pid) does not make it running
        File.WriteAllText(f.LockPath, $"{{\"pid\":{0x7FFF_FFF0},\"host\":\"{Environment.MachineName}\",\"started\":\"2020-01-01T00:00:00Z\"}}");
        s = f.Status();
        Assert.Equal(RunState.Interrupted, s.State);
        Assert.Contains("stale run.lock", s.Detail);
        File.Delete(f.LockPath);

        File.WriteAllText(f.FailedPath, "{\"error\":\"loss became NaN\"}");
        s = f.Status();
        Assert.Equal(RunState.Failed, s.State);
        Assert.Contains("loss became NaN", s.Detail);

        using (RunLock.Acquire(f)) Assert.Equal(RunState.Running, f.Status().State); // retry in progress

        File.WriteAllText(f.SummaryPath, "{\"run_id\":\"r\",\"status\":\"done\"}");
        Assert.Equal(RunState.Done, f.Status().State);

        File.Delete(f.FailedPath);
        File.WriteAllText(f.SummaryPath, "{ not json");
        s = f.Status();
        Assert.Equal(RunState.Interrupted, s.State);
        Assert.Contains("not valid JSON", s.Detail);
    }

    [Fact]
    public void RunIdsAreShortSafeAndStable()
    {
        Assert.Equal("grid-walk-deadbeef", RunId.Create("grid-walk", 0xDEADBEEF_01234567UL));
        Assert.Equal("my-experiment-v2-0123abcd", RunId.Create("  My Experiment / v2!! ", "0123ABCDEF"));
        string a = RunId.Create("x", "not hex at all");
        Assert.Equal(a, RunId.Create("x", "not hex at all"));
        Assert.NotEqual(a, RunId.Create("x", "not hex at al1"));
        Assert.Matches("^x-[0-9a-f]{8}$", a);
        Assert.Equal("run-00000000", RunId.Create("???", 0UL));
        Assert.True(RunId.Create(new string('a', 300), 1UL).Length <= 48 + 9);
        Assert.True(RunId.IsSafeSegment(RunId.Create("Ünïcode name", 5UL)));
    }
}
