using System.Text.Json;
using HybridRL.Analysis;
using HybridRL.Tests.Config;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Analysis;

public class ReportTests
{
    [Fact]
    public void RunReportHasAllSectionsAndPlot()
    {
        using var runs = new SyntheticRuns();
        string dir = runs.AddRun("demo", "run-a", "deep_q", SyntheticRuns.Linear(100, 500, 0.1, 0));
        File.WriteAllText(Path.Combine(dir, "eval-final.json"), """{"episodes":10,"mean_return":48.5,"note":"synthetic"}""");
        string profile = Path.Combine(runs.Root, "device.yaml");
        File.WriteAllText(profile, "name: invented-test-device\nseconds_per_shot: 0.001\nper_circuit_overhead_seconds: 0\ncircuits_per_job: 1000\nqueue_latency_seconds: 0\n");

        string md = Report.Write(dir, new ReportOptions { HardwareProfilePath = profile });
        string text = File.ReadAllText(md);
        foreach (var section in new[] { "# Run report: run-a", "## Configuration", "## Model and circuit resources", "## Learning curve", "## Evaluation results", "## Hardware ledger" })
            Assert.Contains(section, text);
        Assert.Contains("| trainer.kind | deep_q |", text);
        Assert.Contains("| circuit | 4 |", text);                 // parameter_counts from summary.json
        Assert.Contains("| mean_return | 48.5 |", text);          // eval-final.json
        // Ledger: 5000 hardware executions × 100 shots × 0.001 s = 500 s (hand computed from the synthetic counters).
        Assert.Contains("| 500 |", text);
        Assert.Contains("not vendor quotes", text);
        Assert.True(new FileInfo(Path.Combine(dir, "learning-curve.png")).Length > 0);
        Assert.Contains("Environment steps", File.ReadAllText(Path.Combine(dir, "learning-curve.svg")));
    }

    [Fact]
    public void RunReportShowsTheCircuitResourcesTheRunWrote()
    {
        using var tmp = new TempDirectory();
        // The hand-counted test fixture (4 qubits, 2 layers, ry+rz, ring of CZ), trained for a few steps through the real program.
        string config = ConfigTestPaths.SmallWarehouseDqn;
        string[] sets =
        [
            "--set", "experiment.budget.env_steps=60", "--set", "trainer.dqn.warmup_steps=20", "--set", "trainer.dqn.eval_every=0",
            "--set", "logging.metrics_every_steps=20", "--set", "logging.checkpoint_every_steps=60", "--set", "logging.final_eval_episodes=2",
        ];
        var (code, stdout, stderr) = CliProcess.Run(["train", config, .. sets, "--runs-dir", tmp.Combine("runs"), "--quiet"]);
        Assert.True(code == 0, stderr);
        string dir = stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries)[0];
        string resourcesPath = Path.Combine(dir, "resources.json");
        Assert.True(File.Exists(resourcesPath), "the run wrote no resources.json");
        var resources = JsonDocument.Parse(File.ReadAllText(resourcesPath)).RootElement;
        var circuit = resources.GetProperty("circuit");
        Assert.False(circuit.TryGetProperty("drawing", out _));

        // Cross-check against `hybridrl inspect --json` on the same config and settings (a separate process).
        var (inspectCode, inspectOut, inspectErr) = CliProcess.Run(["inspect", config, .. sets, "--json"]);
        Assert.True(inspectCode == 0, inspectErr);
        var inspected = JsonDocument.Parse(inspectOut).RootElement.GetProperty("circuit");
        foreach (var key in new[] { "qubits", "gates", "depth", "two_qubit_gates" })
            Assert.Equal(inspected.GetProperty(key).GetInt32(), circuit.GetProperty(key).GetInt32());
        Assert.Equal(inspected.GetProperty("gates_by_kind").ToString(), circuit.GetProperty("gates_by_kind").ToString());

        // Hand count (as in InspectCliTests): 4 qubits; 4 RX (angle encoding), 8 RY + 8 RZ (2 layers × 4 qubits),
        // 8 CZ (ring of 4 per layer) = 28 gates; depth 13.
        Assert.Equal(4, circuit.GetProperty("qubits").GetInt32());
        Assert.Equal(28, circuit.GetProperty("gates").GetInt32());
        Assert.Equal(8, circuit.GetProperty("gates_by_kind").GetProperty("CZ").GetInt32());
        Assert.Equal(8, circuit.GetProperty("two_qubit_gates").GetInt32());
        Assert.Equal(13, circuit.GetProperty("depth").GetInt32());

        string text = File.ReadAllText(Report.Write(dir, new ReportOptions()));
        Assert.Contains("## Model and circuit resources", text);
        Assert.Contains("From resources.json:", text);
        Assert.Contains("| model | hybrid |", text);
        Assert.Contains("| circuit.qubits | 4 |", text);
        Assert.Contains("| circuit.gates | 28 |", text);
        Assert.Contains("| circuit.gates_by_kind.CZ | 8 |", text);
        Assert.Contains("| circuit.two_qubit_gates | 8 |", text);
        Assert.Contains("| circuit.depth | 13 |", text);
    }

    [Fact]
    public void SweepReportIncludesComparisonAndVaryingSettings()
    {
        using var runs = new SyntheticRuns();
        for (int s = 0; s < 3; s++) runs.AddRun("sw", $"a-{s}", "deep_q", SyntheticRuns.Linear(100, 400, 0.1, s));
        for (int s = 0; s < 2; s++) runs.AddRun("sw", $"b-{s}", "evolution", SyntheticRuns.Linear(200, 400, 0.05, s));
        string outDir = Path.Combine(runs.Root, "report");
        string md = Report.Write(Path.Combine(runs.Root, "sw"), new ReportOptions { OutDir = outDir, Resamples = 100, Threshold = 20 });
        string text = File.ReadAllText(md);
        Assert.Contains("# Sweep report: sw", text);
        Assert.Contains("Settings that differ between runs", text);
        Assert.Contains("## Comparison by `trainer.kind`", text);
        Assert.Contains("| deep_q | 3 |", text);
        Assert.Contains("No hardware profile given", text);
        foreach (var f in new[] { "comparison.md", "comparison.csv", "learning-curves.png", "final-returns.svg", "threshold-reaching.png", "return-vs-parameters.png" })
            Assert.True(File.Exists(Path.Combine(outDir, f)), f);
    }
}
