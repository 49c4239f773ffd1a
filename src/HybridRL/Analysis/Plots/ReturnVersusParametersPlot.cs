using ScottPlot;

namespace HybridRL.Analysis.Plots;

/// <summary>Final return of each run against its trainable parameter count, one colour per group.</summary>
public static class ReturnVersusParametersPlot
{
    public static IReadOnlyList<string> Write(ComparisonResult r, string basePath)
    {
        var plot = new Plot();
        for (int k = 0; k < r.Groups.Count; k++)
        {
            var g = r.Groups[k];
            var idx = Enumerable.Range(0, g.RunCount).Where(i => double.IsFinite(g.ParameterCounts[i]) && double.IsFinite(g.FinalReturns[i])).ToArray();
            if (idx.Length == 0) continue;
            var pts = plot.Add.Markers(idx.Select(i => g.ParameterCounts[i]).ToArray(), idx.Select(i => g.FinalReturns[i]).ToArray(),
                MarkerShape.FilledCircle, 8, PlotFiles.ColorFor(k));
            pts.LegendText = $"{g.Label} (n={g.RunCount})";
        }
        plot.Title("Final return against trainable parameter count");
        plot.XLabel("Trainable parameters");
        plot.YLabel($"Final return ({r.MetricColumn})");
        plot.ShowLegend(Alignment.LowerRight);
        return PlotFiles.Save(plot, basePath);
    }
}
