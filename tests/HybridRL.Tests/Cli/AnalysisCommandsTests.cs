using System.Text.Json;
using HybridRL.Analysis.Ledger;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary>
/// End to end through the real program: tiny deep-Q and CMA-ES runs (two seeds each) trained with `hybridrl train`,
/// then `compare` on the hardware-equivalent axis, `report`, `estimate`, and bad input (exit 2).
/// The tiny task is the invented slippery-warehouse scenario with its built-in dock-3x4 floor.
/// </summary>
public sealed class AnalysisCommandsTests : IDisposable
{
    private const string Environment = """
        environment:
          kind: slippery-warehouse
          map: dock-3x4
          observation: binary
          max_steps: 20
        model:
          circuit:
            qubits: 4
            layers: 1
        logging:
          metrics_every_steps: 25
          final_eval_episodes: 2
          progress_seconds: 0
        """;

    // Deep Q with ε = 0 throughout and no periodic evaluation: every step is one greedy forward row, so the
    // hardware-equivalent count is a closed formula (see the ledger check below).
    private const string Dqn = """
        experiment:
          name: tiny-dqn
          budget:
            env_steps: 200
        trainer:
          kind: dqn
          dqn:
            replay_capacity: 500
            warmup_steps: 50
            batch_size: 8
            epsilon_start: 0
            epsilon_end: 0
            eval_every: 0
            target_update_every: 50
        """;

    private const string Cma = """
        experiment:
          name: tiny-cma
          budget:
            env_steps: 200
        trainer:
          kind: cma_es
          cma_es:
            population: 4
            eval_every: 2
            eval_episodes: 2
        """;

    private readonly TempDirectory _dir = new();

    public void Dispose() => _dir.Dispose();

    private string Write(string name, string text)
    {
        string p = _dir.Combine(name);
        File.WriteAllText(p, text);
        return p;
    }

    private static (int Code, string Out, string Err) Cli(params string[] args) => CliProcess.Run(args, TimeSpan.FromMinutes(2));

    private string Train(string config, int seed)
    {
        var (code, stdout, stderr) = Cli("train", config, _dir.Combine("env.yaml"), "--runs-dir", _dir.Combine("runs"), "--set", $"experiment.seed={seed}", "-q");
        Assert.True(code == 0, $"train exit {code}: {stderr}");
        return stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries)[0].Trim();
    }

    [Fact]
    public void TrainCompareReportEstimate_WorkEndToEnd_AndBadInputExitsTwo()
    {
        Write("env.yaml", Environment);
        string dqn = Write("dqn.yaml", Dqn), cma = Write("cma.yaml", Cma);
        var dqnRuns = new[] { Train(dqn, 1), Train(dqn, 2) };
        var cmaRuns = new[] { Train(cma, 1), Train(cma, 2) };

        // Ledger: summary.json's hardware_executions equals the analytic count (hand-worked from DeepQTrainer and the
        // circuit engine). T = 200 steps, all greedy (ε = 0): T forward rows. Updates U = T − warmup = 150 (update_every 1),
        // batch B = 8; per batch row: target and online next-state forwards (Double DQN, the default) and the online
        // forward with gradient = 3 rows, plus the parameter-shift gradient (Mitarai et al. 2018): 2 evaluations per
        // Pauli rotation whose angle holds a trainable parameter — 4 qubits × 1 layer × 2 rotations (ry, rz) = 8 angles
        // and 4 trainable input scales of the RX encoding. Read-out Z on each qubit: one measurement setting.
        foreach (string run in dqnRuns)
        {
            using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(run, "summary.json")));
            var root = summary.RootElement;
            long updates = root.GetProperty("updates").GetInt64();
            Assert.Equal(150, updates);
            var expected = HardwareCount.ForTraining(HardwareCount.ShiftTerms(8 + 4, 0), batch: 8, updates: 150,
                forwardExecutionsPerStep: 1, steps: 200, forwardExecutionsPerSample: 3);
            Assert.Equal(200 + 150 * 8 * (3 + 24), expected.Total);   // hand-worked: 32 600
            Assert.Equal(expected.Total, root.GetProperty("hardware_executions").GetInt64());
            Assert.Equal(expected.Total, root.GetProperty("ledger").GetProperty("hardware_executions").GetInt64());
            // Simulated executions with the adjoint gradient: one per forward row and one per gradient row.
            Assert.Equal(200 + 150 * 8 * 4, root.GetProperty("circuit_executions").GetInt64());
        }
        // Evolution has no gradients: hardware-equivalent = simulated = one per environment step of every episode.
        foreach (string run in cmaRuns)
        {
            using var summary = JsonDocument.Parse(File.ReadAllText(Path.Combine(run, "summary.json")));
            Assert.Equal(summary.RootElement.GetProperty("circuit_executions").GetInt64(), summary.RootElement.GetProperty("hardware_executions").GetInt64());
        }

        // compare at equal device budget
        string outDir = _dir.Combine("cmp");
        var (code, stdout, stderr) = Cli(["compare", .. dqnRuns, .. cmaRuns, "--x", "hardware_executions", "--out", outDir, "--resamples", "200",
            "--hardware-profile", Path.Combine(RepoRoot, "configs", "hardware", "example-device.yaml")]);
        Assert.True(code == 0, $"compare exit {code}: {stderr}");
        Assert.Contains("hardware_executions", stdout);
        Assert.Contains("fewer than 5 seeds", stdout);
        Assert.Contains("not vendor quotes", stdout);
        foreach (string f in new[] { "comparison.md", "comparison.csv", "learning-curves.png", "learning-curves.svg", "final-returns.png", "final-returns.svg" })
        {
            var info = new FileInfo(Path.Combine(outDir, f));
            Assert.True(info.Exists && info.Length > 0, $"{f} missing or empty");
        }
        string csv = File.ReadAllText(Path.Combine(outDir, "comparison.csv"));
        Assert.Contains("dqn", csv);
        Assert.Contains("cma_es", csv);

        // report for one run
        (code, stdout, stderr) = Cli("report", dqnRuns[0]);
        Assert.True(code == 0, $"report exit {code}: {stderr}");
        string report = Path.Combine(dqnRuns[0], "report.md");
        Assert.Contains(report, stdout);
        Assert.Contains("learning-curve.png", File.ReadAllText(report));
        Assert.True(new FileInfo(Path.Combine(dqnRuns[0], "learning-curve.png")).Length > 0);

        // estimate the quick-start experiment
        (code, stdout, stderr) = Cli("estimate", Path.Combine(RepoRoot, "configs", "quickstart.yaml"), "--calibration-seconds", "1");
        Assert.True(code == 0, $"estimate exit {code}: {stderr}");
        Assert.Matches(@"predicted wall time: [0-9]", stdout);
        Assert.Matches(@"--time=\d\d:\d\d:00", stdout);
        Assert.Contains("linear extrapolation", stdout);
        Assert.Matches(@"predicted peak memory: [0-9.]+ MiB", stdout);
        Assert.Matches(@"predicted checkpoint size: [0-9.]+ KiB each", stdout);

        // estimate a sweep: the 20 runs of the optimizers sweep share 4 calibrations (runs differing only by seed share one)
        (code, stdout, stderr) = Cli("estimate", Path.Combine(RepoRoot, "configs", "optimizers-sweep.yaml"), "--calibration-seconds", "0.5");
        Assert.True(code == 0, $"estimate sweep exit {code}: {stderr}");
        Assert.Contains("20 run(s), 4 configuration(s) calibrated", stdout);
        Assert.Matches(@"kind-dqn_seed-1-[0-9a-f]+ +[0-9]", stdout);  // each run on its own line with its time ("17.6 s", "1m 29s")
        Assert.Matches(@"total wall time \(one run after another\): [0-9]+(\.[0-9])? ?[ms]", stdout);
        Assert.Contains("largest peak memory per run", stdout);
        Assert.Matches(@"suggested Slurm time limit per array task: --time=\d\d:\d\d:00", stdout);

        // bad input → exit 2 with a message naming the problem
        (code, _, stderr) = Cli("compare", _dir.Combine("no-such-folder"));
        Assert.Equal(2, code);
        Assert.Contains("no-such-folder", stderr);
        (code, _, stderr) = Cli("compare", dqnRuns[0], "--x", "device_minutes");
        Assert.Equal(2, code);
        Assert.Contains("device_minutes", stderr);
        (code, _, stderr) = Cli("report", _dir.Combine("missing-run"));
        Assert.Equal(2, code);
        (code, _, stderr) = Cli("estimate", dqn, _dir.Combine("env.yaml"), "--set", "trainer.dqn.batch_size=-3");
        Assert.Equal(2, code);
        Assert.Contains("trainer.dqn.batch_size", stderr);
    }

    private static string RepoRoot
    {
        get
        {
            var d = new DirectoryInfo(AppContext.BaseDirectory);
            while (d is not null && !File.Exists(Path.Combine(d.FullName, "HybridRL.sln"))) d = d.Parent;
            return d?.FullName ?? throw new InvalidOperationException("repository root (HybridRL.sln) not found above the test output folder");
        }
    }
}
