using HybridRL.Analysis;

namespace HybridRL.Tests.Analysis;

public class ReportTests
{
    [Fact]
    public void RunReportHasAllSectionsAndPlot()
    {
        using var runs = new SyntheticRuns();
        string dir = runs.AddRun("demo", "run-a", "deep_q", SyntheticRuns.Linear(100, 500, 0.1, 0));
        File.WriteAllText(Path.Combine(dir, "eval-final.json"), """{"episodes":10,"mean_return":48.5,"note":"synthetic"}""");
        File.WriteAllText(Path.Combine(dir, "resources.json"), """{"qubits":4,"circuit_depth":9,"two_qubit_gates":6}""");
        string profile = Path.Combine(runs.Root, "device.yaml");
        File.WriteAllText(profile, "name: invented-test-device\nseconds_per_shot: 0.001\nper_circuit_overhead_seconds: 0\ncircuits_per_job: 1000\nqueue_latency_seconds: 0\n");

        string md = Report.Write(dir, new ReportOptions { HardwareProfilePath = profile });
        string text = File.ReadAllText(md);
        foreach (var section in new[] { "# Run report: run-a", "## Configuration", "## Model and circuit resources", "## Learning curve", "## Evaluation results", "## Hardware ledger" })
            Assert.Contains(section, text);
        Assert.Contains("| trainer.kind | deep_q |", text);
        Assert.Contains("| circuit | 4 |", text);                 // parameter_counts from summary.json
        Assert.Contains("| circuit_depth | 9 |", text);           // resources.json
        Assert.Contains("| mean_return | 48.5 |", text);          // eval-final.json
        // Ledger: 5000 hardware executions × 100 shots × 0.001 s = 500 s (hand computed from the synthetic counters).
        Assert.Contains("| 500 |", text);
        Assert.Contains("not vendor quotes", text);
        Assert.True(new FileInfo(Path.Combine(dir, "learning-curve.png")).Length > 0);
        Assert.Contains("Environment steps", File.ReadAllText(Path.Combine(dir, "learning-curve.svg")));
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
