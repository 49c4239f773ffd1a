using System.Diagnostics;
using HybridRL.Checkpoints;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Resume;

/// <summary>
/// SIGTERM, SIGUSR1 and a single SIGINT make a running `hybridrl train` write a checkpoint and exit 3 within 5 s; a
/// second SIGINT exits at once (130) and leaves the previous checkpoints valid.
/// </summary>
public sealed class InterruptSignalTests
{
    private static readonly string[] LongRun = ["experiment.budget.env_steps=1000000", "logging.checkpoint_every_steps=50"];

    [Theory]
    [InlineData(15)] // SIGTERM
    [InlineData(10)] // SIGUSR1 (Linux numbering)
    [InlineData(2)]  // SIGINT, once (InterruptSignals: the first interrupt cancels like SIGTERM; only a second exits with 130)
    public void SignalWritesALoadableCheckpointAndExitsThree(int signal)
    {
        var scenario = ResumeScenario.For("dqn").With(LongRun);
        using var tmp = new TempDirectory();
        string config = scenario.WriteConfig(tmp.Path);
        string runs = tmp.Combine("runs");
        using var cli = CliProcess.Start(scenario.TrainArgs(config, runs));
        scenario.WaitForCheckpoints(runs, cli, 1, TimeSpan.FromMinutes(1));
        Thread.Sleep(300); // well inside training, between checkpoints or not
        var clock = Stopwatch.StartNew();
        cli.Signal(signal);
        int code = cli.WaitForExit(TimeSpan.FromSeconds(5));
        Assert.True(code == 3, $"exit code {code} after signal {signal}\n{cli.Stderr}");
        string dir = Path.Combine(scenario.RunDir(runs), "checkpoints");
        var newest = CheckpointStore.List(dir)[0];
        using (var reader = CheckpointReader.Open(newest.Path))
        {
            Assert.Equal("dqn", reader.Header.TrainerKind);
            Assert.True(reader.HasSection("model.online"));
            Assert.True(File.GetLastWriteTimeUtc(newest.Path) >= DateTime.UtcNow - clock.Elapsed - TimeSpan.FromSeconds(1),
                "the newest checkpoint was not written on the signal");
        }
        Assert.False(File.Exists(Path.Combine(scenario.RunDir(runs), "run.lock")), "run.lock was not released");
        Assert.Contains("hybridrl resume", cli.Stderr);
    }

    [Fact]
    public void SecondInterruptExitsAtOnceWithThePreviousCheckpointValid()
    {
        var scenario = ResumeScenario.For("dqn").With(LongRun);
        using var tmp = new TempDirectory();
        string config = scenario.WriteConfig(tmp.Path);
        string runs = tmp.Combine("runs");
        using var cli = CliProcess.Start(scenario.TrainArgs(config, runs));
        scenario.WaitForCheckpoints(runs, cli, 1, TimeSpan.FromMinutes(1));
        cli.Signal(2);
        Thread.Sleep(5); // two signals sent back to back can be merged into one by the kernel
        cli.Signal(2);
        int code = cli.WaitForExit(TimeSpan.FromSeconds(5));
        Assert.True(code == 130, $"exit code {code} after two SIGINTs\n{cli.Stderr}");
        string dir = Path.Combine(scenario.RunDir(runs), "checkpoints");
        var list = CheckpointStore.List(dir);
        Assert.NotEmpty(list);
        foreach (var (_, path) in list) CheckpointReader.Open(path).Dispose(); // every named checkpoint validates
        Assert.Equal(list[0].Path, CheckpointStore.FindNewestValid(dir, out var rejected));
        Assert.Empty(rejected);
    }
}
