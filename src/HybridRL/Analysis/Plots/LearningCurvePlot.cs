using ScottPlot;

namespace HybridRL.Analysis.Plots;

/// <summary>Mean learning curve per group with its bootstrap confidence band.</summary>
public static class LearningCurvePlot
{
    public static IReadOnlyList<string> Write(ComparisonResult r, string basePath)
    {
        var plot = new Plot();
        for (int k = 0; k < r.Groups.Count; k++)
        {
            var g = r.Groups[k];
            var color = PlotFiles.ColorFor(k);
            var idx = PlotFiles.Finite(g.Curve.Mean.Select(c => c.Estimate).ToArray());
            if (idx.Length == 0) continue;
            double[] xs = idx.Select(i => g.Curve.Grid[i]).ToArray();
            var band = plot.Add.FillY(xs, idx.Select(i => g.Curve.Mean[i].Lower).ToArray(), idx.Select(i => g.Curve.Mean[i].Upper).ToArray());
            band.FillColor = color.WithAlpha(0.2);
            band.LineWidth = 0;
            var line = plot.Add.ScatterLine(xs, idx.Select(i => g.Curve.Mean[i].Estimate).ToArray(), color);
            line.LineWidth = 2;
            line.LegendText = $"{g.Label} (n={g.RunCount})";
        }
        plot.Title($"Learning curves: mean with {(int)Math.Round(100 * r.Options.Confidence)}% bootstrap band");
        plot.XLabel(CurveAxes.Label(r.Options.Axis));
        plot.YLabel($"Return ({r.MetricColumn})");
        plot.ShowLegend(Alignment.LowerRight);
        return PlotFiles.Save(plot, basePath);
    }

    /// <summary>Single-run curve(s) for a report: every named metrics column that has values, against the axis.</summary>
    public static IReadOnlyList<string> WriteRun(RunFolder run, CurveAxis axis, IReadOnlyList<string> columns, string basePath)
    {
        var plot = new Plot();
        int k = 0;
        foreach (string c in columns)
        {
            if (!run.Metrics.HasValues(c) || !run.Metrics.HasValues(CurveAxes.Column(axis))) continue;
            var curve = LearningCurve.FromMetrics(run.Id, run.Metrics, CurveAxes.Column(axis), c);
            if (curve.Count == 0) continue;
            var line = plot.Add.Scatter(curve.X, curve.Y, PlotFiles.ColorFor(k++));
            line.MarkerSize = curve.Count > 60 ? 0 : 4;
            line.LegendText = c;
        }
        plot.Title($"Run {run.Id}");
        plot.XLabel(CurveAxes.Label(axis));
        plot.YLabel("Return");
        plot.ShowLegend(Alignment.LowerRight);
        return PlotFiles.Save(plot, basePath);
    }
}
