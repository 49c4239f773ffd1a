using ScottPlot;

namespace HybridRL.Analysis.Plots;

/// <summary>Share of a group's runs that have reached the return threshold by each axis value.</summary>
public static class ThresholdReachingPlot
{
    public static IReadOnlyList<string> Write(ComparisonResult r, string basePath)
    {
        if (r.Options.Threshold is not double threshold) throw new InvalidOperationException("threshold-reaching plot needs a threshold");
        var plot = new Plot();
        for (int k = 0; k < r.Groups.Count; k++)
        {
            var g = r.Groups[k];
            if (g.Curve.ReachedShare is null || g.Curve.Grid.Length == 0) continue;
            var line = plot.Add.ScatterLine(g.Curve.Grid, g.Curve.ReachedShare.Select(s => 100 * s).ToArray(), PlotFiles.ColorFor(k));
            line.LineWidth = 2;
            line.ConnectStyle = ConnectStyle.StepHorizontal;
            line.LegendText = $"{g.Label} (n={g.RunCount})";
        }
        plot.Title($"Runs that reached return ≥ {ComparisonWriter.Num(threshold)}");
        plot.XLabel(CurveAxes.Label(r.Options.Axis));
        plot.YLabel("Runs that reached the threshold (%)");
        plot.Axes.SetLimitsY(-2, 102);
        plot.ShowLegend(Alignment.LowerRight);
        return PlotFiles.Save(plot, basePath);
    }
}
