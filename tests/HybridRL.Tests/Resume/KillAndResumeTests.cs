using System.Diagnostics;
using HybridRL.Checkpoints;
using HybridRL.Quantum.Randomness;
using HybridRL.Tests.Support;
using Xunit.Abstractions;

namespace HybridRL.Tests.Resume;

/// <summary>
/// Exact resume after SIGKILL: each trainer is killed at 5 random moments (20 over the four trainers),
/// resumed until done, and must end bit-identical to an uninterrupted run of the same seed
/// (metrics rows without wall_seconds, summary without wall_seconds, every section of the final checkpoint).
/// </summary>
public sealed class KillAndResumeTests(ITestOutputHelper output)
{
    private const int KillsPerTrainer = 5;

    [Theory]
    [InlineData("dqn")]
    [InlineData("genetic")]
    [InlineData("evolution_strategies")]
    [InlineData("cma_es")]
    public void Kill9AtRandomMomentsThenResumeMatchesUninterruptedRun(string trainer)
    {
        var scenario = ResumeScenario.For(trainer);
        using var tmp = new TempDirectory();
        string config = scenario.WriteConfig(tmp.Path);

        string baselineRuns = tmp.Combine("baseline");
        var (training, duration) = scenario.TimeRunToEnd(config, baselineRuns);
        var expected = ResumeRunResult.Read(scenario.RunDir(baselineRuns));

        // Kill moments: fixed seed, uniform over the uninterrupted process's training time (from its first checkpoint
        // to its exit), reaching a little before the first checkpoint so start-up kills happen too.
        var moments = RandomStream.FromRoot(20240607, "kill-moments-" + trainer);
        int kills = 0, midWrite = 0, attempt = 0, finishedEarly = 0;
        // A resumed process can be quicker than the measured one (warm caches, an idle machine): whenever a process
        // finishes before its kill moment, later moments are scaled down, so the kills always happen.
        double scale = 1.0;
        while (kills < KillsPerTrainer)
        {
            Assert.True(attempt < 4 * KillsPerTrainer, $"{trainer}: no kill landed in {attempt} run folders ({finishedEarly} processes ended first)");
            string runs = tmp.Combine("killed-" + attempt++);
            bool done = false;
            while (!done)
            {
                double delay = scale * (training.TotalMilliseconds + (duration - training).TotalMilliseconds * (1.1 * moments.NextDouble() - 0.1));
                using var cli = CliProcess.Start(scenario.ContinueArgs(config, runs));
                var clock = Stopwatch.StartNew();
                while (!cli.HasExited && clock.Elapsed.TotalMilliseconds < delay) Thread.Sleep(5);
                if (cli.HasExited || kills >= KillsPerTrainer)
                {
                    if (kills < KillsPerTrainer)
                    {
                        finishedEarly++;
                        scale *= 0.6;
                    }
                    int code = cli.WaitForExit(TimeSpan.FromMinutes(2));
                    Assert.True(code == 0, $"{trainer}: resume after a kill exited {code}\n{cli.Stdout}\n{cli.Stderr}");
                    done = true;
                    continue;
                }
                cli.Signal(9);
                cli.WaitForExit(TimeSpan.FromSeconds(30));
                kills++;
                string ckpts = Path.Combine(scenario.RunDir(runs), "checkpoints");
                if (Directory.Exists(ckpts) && Directory.EnumerateFiles(ckpts, ".ckpt-*").Any()) midWrite++;
                Assert.False(File.Exists(Path.Combine(scenario.RunDir(runs), "failed.json")), $"{trainer}: a killed run left failed.json");
            }
            ResumeRunResult.Read(scenario.RunDir(runs)).AssertSameAs(expected, $"{trainer}, run folder {attempt - 1} after {kills} kills so far");
        }
        output.WriteLine($"{trainer}: uninterrupted process {duration.TotalSeconds:F1} s, training from {training.TotalSeconds:F1} s; {kills} kills over {attempt} run folders, {midWrite} during a checkpoint write");
    }
}
