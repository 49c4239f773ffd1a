using HybridRL.Analysis;

namespace HybridRL.Tests.Analysis;

public class CurveTests
{
    [Fact]
    public void AlignmentInterpolatesDifferentIntervalsAndCensorsShortRuns()
    {
        // Invented curves. Run a: logged every 10 steps to 100, y = x. Run b: every 25 steps to 50, y = 2x.
        var a = new LearningCurve("a", [10, 20, 30, 40, 50, 60, 70, 80, 90, 100], [10, 20, 30, 40, 50, 60, 70, 80, 90, 100]);
        var b = new LearningCurve("b", [25, 50], [50, 100]);
        var aligned = CurveAlignment.Align([a, b], 10);
        Assert.Equal(10, aligned.Grid[0]);
        Assert.Equal(100, aligned.Grid[^1]);
        Assert.Equal(20, aligned.Grid[1], 12);
        // Grid point 20 lies before b's first point: only a observed. Grid 30, 40, 50 both; beyond 50 b is censored.
        Assert.Equal([1, 1, 2, 2, 2, 1, 1, 1, 1, 1], aligned.Observed);
        Assert.Equal(60, aligned.Values[1][2], 12);          // b at 30: 50 + (5/25)·50 = 60 (hand interpolation)
        Assert.True(double.IsNaN(aligned.Values[1][5]));      // censored, not extrapolated or dropped
        Assert.Equal(60, aligned.Values[0][5], 12);
        Span<double> buf = stackalloc double[2];
        Assert.Equal(2, aligned.ObservedAt(3, buf));
    }

    [Fact]
    public void CurveStatisticsHandComputed()
    {
        var c = new LearningCurve("c", [0, 10, 20], [0, 10, 5]);
        Assert.Equal(5, c.Final);
        Assert.Equal(10, c.Best);
        Assert.Equal(10, c.FirstReaching(8));
        Assert.True(double.IsNaN(c.FirstReaching(11)));
        // Trapezoids: [0,10]: 50; [10,20]: 75 → 125; window [5,15]: (5+10)/2·5 + (10+7.5)/2·5 = 37.5 + 43.75.
        Assert.Equal(125, c.AreaUnder(0, 20), 12);
        Assert.Equal(81.25, c.AreaUnder(5, 15), 12);
        Assert.True(double.IsNaN(c.AreaUnder(5, 25)));
    }

    [Fact]
    public void MetricsReaderBuildsCurvesSkippingEmptyAndReplayedRows()
    {
        const string header = "env_steps,episodes,updates,generations,wall_seconds,train_return,eval_return,loss,fitness_mean,fitness_best,fitness_std,epsilon,sigma,circuit_executions,shots,hardware_executions,parameter_count";
        // Invented rows: the 2nd has no train_return; after row 30 the run resumed from step 20 and relogged 30.
        string csv = header + "\n" +
            "10,1,0,,0.1,1.5,,,,,,,,30,3000,100,12\n" +
            "20,2,1,,0.2,,,,,,,,,60,6000,200,12\n" +
            "30,3,2,,0.3,3.5,,,,,,,,90,9000,300,12\n" +
            "30,3,2,,0.35,3.25,,,,,,,,90,9000,300,12\n" +
            "40,4,3,,0.4,4.5,,,,,,,,120,12000,400,12\n";
        var table = MetricsCsvReader.Read(new StringReader(csv), "metrics.csv");
        Assert.Equal(5, table.RowCount);
        var curve = LearningCurve.FromMetrics("r", table, "env_steps", "train_return");
        Assert.Equal([10.0, 30, 40], curve.X);
        Assert.Equal([1.5, 3.25, 4.5], curve.Y);
        Assert.Equal(12, table.LastValue("parameter_count"));
        var ex = Assert.Throws<InvalidDataException>(() => MetricsCsvReader.Read(new StringReader(header + "\n10,1,0,,abc,1,,,,,,,,1,1,1,1\n"), "m.csv"));
        Assert.Contains("wall_seconds", ex.Message);
        Assert.Throws<InvalidDataException>(() => MetricsCsvReader.Read(new StringReader("env_steps,train_return\n1,2\n"), "m.csv"));
    }

    [Fact]
    public void RunFolderReadsConfigSummaryAndDiscoversSweeps()
    {
        using var runs = new SyntheticRuns();
        runs.AddRun("sweep", "run-1", "deep_q", SyntheticRuns.Linear(10, 50, 1, 0));
        runs.AddRun("sweep", "run-2", "evolution", SyntheticRuns.Linear(10, 30, 1, 0), summary: false);
        var found = RunFolder.Discover([Path.Combine(runs.Root, "sweep")]);
        Assert.Equal(2, found.Count);
        Assert.Equal("deep_q", found[0].ConfigValue("trainer.kind"));
        Assert.Equal("2", found[0].ConfigValue("model.layers.1"));
        Assert.Equal("done", found[0].Status);
        Assert.Equal("incomplete", found[1].Status);
        Assert.Equal(12, found[0].ParameterCount);
        Assert.Contains(found[0].ParameterCounts, kv => kv.Key == "circuit" && kv.Value == 4);
        string empty = Directory.CreateDirectory(Path.Combine(runs.Root, "empty")).FullName;
        var ex = Assert.Throws<InvalidDataException>(() => RunFolder.Discover([empty]));
        Assert.Contains("empty", ex.Message);
    }
}
