using HybridRL.Analysis;
using HybridRL.Analysis.Statistics;

namespace HybridRL.Tests.Analysis;

public class ComparisonTests
{
    private static readonly string Profile =
        "name: invented-test-device\nnote: made-up numbers for a test\nseconds_per_shot: 0.001\nper_circuit_overhead_seconds: 0.5\ncircuits_per_job: 100\nqueue_latency_seconds: 60\nprice_per_shot: 0.01\ncurrency: CHF\n";

    /// <summary>Invented sweep: 5 gradient runs (logged every 100 steps to 1000) and 3 evolution runs (every 250 steps; one stops at 500).</summary>
    private static SyntheticRuns MakeSweep(out string sweep)
    {
        var runs = new SyntheticRuns();
        for (int s = 0; s < 5; s++) runs.AddRun("sweep", $"dq-{s}", "deep_q", SyntheticRuns.Linear(100, 1000, 0.1, s));
        runs.AddRun("sweep", "es-0", "evolution", SyntheticRuns.Linear(250, 1000, 0.05, 0), parameterCount: 40);
        runs.AddRun("sweep", "es-1", "evolution", SyntheticRuns.Linear(250, 1000, 0.05, 2), parameterCount: 40);
        runs.AddRun("sweep", "es-2", "evolution", SyntheticRuns.Linear(250, 500, 0.05, 4), parameterCount: 40, summary: false);
        sweep = Path.Combine(runs.Root, "sweep");
        return runs;
    }

    [Fact]
    public void CompareGroupsAlignsCensorsAndTestsFinalReturns()
    {
        using var runs = MakeSweep(out string sweep);
        string profilePath = Path.Combine(runs.Root, "device.yaml");
        File.WriteAllText(profilePath, Profile);
        var result = Comparison.Run(new ComparisonOptions
        {
            Inputs = [sweep], Threshold = 50, GridPoints = 10, Resamples = 300, Seed = 5, WritePlots = false,
            HardwareProfilePath = profilePath,
        });

        Assert.Equal("train_return", result.MetricColumn);
        Assert.Equal(["deep_q", "evolution"], result.Groups.Select(g => g.Label));
        var dq = result.Groups[0];
        var es = result.Groups[1];
        Assert.Equal(5, dq.RunCount);
        // Final returns are 0.1·1000 + s → mean 102 (hand computed); evolution: 50, 52, and 29 for the censored run.
        Assert.Equal(102, dq.FinalMean.Estimate, 9);
        Assert.Equal([50.0, 52, 29], es.FinalReturns);
        Assert.True(dq.FinalMean.Lower <= 102 && 102 <= dq.FinalMean.Upper);
        // Grid 100..1000 (10 points). Evolution runs start at 250 and es-2 ends at 500: observed counts per point.
        Assert.Equal(100, result.Grid[0]);
        Assert.Equal([0, 0, 3, 3, 3, 2, 2, 2, 2, 2], es.Curve.Observed);
        Assert.All(dq.Curve.Observed, o => Assert.Equal(5, o));
        // Threshold 50: gradient runs reach it at 500 − 10s rounded up to the logging interval → 500, 500, 500, 500, 500 (s ≤ 4).
        Assert.Equal(500, dq.MedianToThreshold);
        Assert.Equal(0, dq.NeverReachedShare);
        Assert.Equal(1.0 / 3.0, es.NeverReachedShare, 12);            // es-0 reaches 50 at 1000, es-1 at 1000; es-2 (max 29) never
        Assert.Equal(0.0, dq.Curve.ReachedShare![3], 12);            // grid[3] = 400: no gradient run has reached 50 yet
        Assert.Equal(1.0, dq.Curve.ReachedShare[4], 12);             // grid[4] = 500: all 5 have
        Assert.Equal(2.0 / 3.0, es.Curve.ReachedShare![^1], 12);
        // AUC window = [250, 500] shared by every run; gradient run s: ∫(0.1x + s) = 0.05(500² − 250²) + 250s.
        Assert.Equal((250, 500), result.AreaWindow);
        Assert.Equal(0.05 * (500 * 500 - 250 * 250) + 250 * 2, dq.AreaMean.Estimate, 9);
        // Pairwise: probability of improvement equals the direct pair count (all 5 gradient finals beat all 3).
        var pair = Assert.Single(result.Pairs);
        Assert.Equal(ProbabilityOfImprovement.Compute(dq.FinalReturns, es.FinalReturns), pair.ProbabilityOfImprovement.Estimate, 12);
        Assert.Equal(1.0, pair.ProbabilityOfImprovement.Estimate, 12);
        Assert.Equal(WelchTest.Compute(dq.FinalReturns, es.FinalReturns), pair.Welch);
        Assert.True(pair.MannWhitney.Exact);
        // Fewer than 5 seeds and a censored run are reported.
        Assert.Contains(result.Warnings, w => w.Contains("'evolution' has 3 run(s)") && w.Contains("Henderson"));
        Assert.Contains(result.Warnings, w => w.Contains("es-2") && w.Contains("censored"));
        Assert.DoesNotContain(result.Warnings, w => w.Contains("'deep_q'"));
        // Hardware ledger: deep_q hardware_executions = 10·1000 per run, 100 shots each (synthetic summary ledger).
        var hw = dq.Hardware!;
        Assert.Equal(5 * 10000, hw.HardwareExecutions, 9);
        Assert.Equal(5 * (10000 * 100 * 0.001 + 10000 * 0.5 + 100 * 60), hw.DeviceSeconds, 6);   // per run: 1000 + 5000 + 6000 s
        Assert.Contains(result.Warnings, w => w.Contains("es-2") && w.Contains("hardware"));
        string table = result.TerminalTable;
        Assert.Contains("deep_q", table);
        Assert.Contains("not vendor quotes", table);
    }

    [Fact]
    public void CompareIsReproducibleAndWritesFilesAndPlots()
    {
        using var runs = MakeSweep(out string sweep);
        string outDir = Path.Combine(runs.Root, "out");
        var options = new ComparisonOptions { Inputs = [sweep], Threshold = 50, GridPoints = 12, Resamples = 200, OutDir = outDir, Axis = CurveAxis.HardwareExecutions };
        var a = Comparison.Run(options);
        var b = Comparison.Compute(RunFolder.Discover([sweep]), options);
        Assert.Equal(a.Groups[0].FinalMean, b.Groups[0].FinalMean);
        Assert.Equal(a.Groups[1].Curve.Iqm, b.Groups[1].Curve.Iqm);

        foreach (var name in new[] { "comparison.md", "comparison.csv", "comparison-curves.csv", "comparison-pairs.csv" })
            Assert.True(new FileInfo(Path.Combine(outDir, name)).Length > 0, name);
        var csv = File.ReadAllLines(Path.Combine(outDir, "comparison.csv"));
        Assert.Equal(3, csv.Length);
        Assert.StartsWith("deep_q,5,", csv[1]);
        Assert.Contains("![Learning curves", File.ReadAllText(Path.Combine(outDir, "comparison.md")));

        var expected = new Dictionary<string, string>
        {
            ["learning-curves"] = "Hardware-equivalent circuit executions",
            ["final-returns"] = "Final return (train_return)",
            ["threshold-reaching"] = "Runs that reached the threshold",
            ["return-vs-parameters"] = "Trainable parameters",
        };
        foreach (var (plot, label) in expected)
        {
            var png = new FileInfo(Path.Combine(outDir, plot + ".png"));
            Assert.True(png.Exists && png.Length > 0, plot);
            var head = new byte[8];
            using (var f = png.OpenRead()) f.ReadExactly(head);
            Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A }, head);    // PNG signature (PNG spec, sec. 5.2)
            string svg = File.ReadAllText(Path.Combine(outDir, plot + ".svg"));
            Assert.Contains("<svg", svg);
            Assert.Contains(System.Security.SecurityElement.Escape(label), svg);
            Assert.Contains("(n=", svg);                                                         // legend entries
            Assert.Contains(a.Files, p => p.EndsWith(plot + ".svg", StringComparison.Ordinal));
        }
        Assert.Empty(Directory.GetFiles(outDir, ".tmp-*"));
    }

    [Fact]
    public void UnknownAxisOrMetricIsAClearError()
    {
        using var runs = MakeSweep(out string sweep);
        var ex = Assert.Throws<ArgumentException>(() => CurveAxes.Parse("furlongs"));
        Assert.Contains("furlongs", ex.Message);
        var ex2 = Assert.Throws<InvalidDataException>(() => Comparison.Run(new ComparisonOptions { Inputs = [sweep], Metric = "eval_return", WritePlots = false }));
        Assert.Contains("eval_return", ex2.Message);
    }
}
