using HybridRL.Analysis.Statistics;
using HybridRL.Quantum.Randomness;
using ScottPlot;

namespace HybridRL.Analysis.Plots;

/// <summary>Final return of every run as a strip (deterministically jittered points) over a quartile box per group.</summary>
public static class FinalReturnPlot
{
    public static IReadOnlyList<string> Write(ComparisonResult r, string basePath)
    {
        var plot = new Plot();
        var jitter = RandomStream.FromRoot(r.Options.Seed, "plot/jitter");
        var positions = new double[r.Groups.Count];
        var labels = new string[r.Groups.Count];
        for (int k = 0; k < r.Groups.Count; k++)
        {
            var g = r.Groups[k];
            var color = PlotFiles.ColorFor(k);
            positions[k] = k;
            labels[k] = g.Label;
            var finals = g.FinalReturns.Where(double.IsFinite).OrderBy(v => v).ToArray();
            if (finals.Length == 0) continue;
            var box = new Box
            {
                Position = k,
                BoxMin = Descriptive.QuantileOfSorted(finals, 0.25),
                BoxMax = Descriptive.QuantileOfSorted(finals, 0.75),
                BoxMiddle = Descriptive.QuantileOfSorted(finals, 0.5),
                WhiskerMin = finals[0],
                WhiskerMax = finals[^1],
                Width = 0.5,
            };
            var boxes = plot.Add.Box(box);
            boxes.FillColor = color.WithAlpha(0.15);
            boxes.LineColor = color;
            var xs = finals.Select(_ => k + (jitter.NextDouble() - 0.5) * 0.3).ToArray();
            var pts = plot.Add.Markers(xs, finals, MarkerShape.FilledCircle, 7, color);
            pts.LegendText = $"{g.Label} (n={g.RunCount})";
        }
        plot.Axes.Bottom.SetTicks(positions, labels);
        plot.Title("Final return per run (box: quartiles, whiskers: range)");
        plot.XLabel($"Group ({r.Options.By})");
        plot.YLabel($"Final return ({r.MetricColumn})");
        plot.ShowLegend(Alignment.UpperRight);
        return PlotFiles.Save(plot, basePath);
    }
}
