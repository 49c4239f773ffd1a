using HybridRL.Checkpoints;
using ScottPlot;

namespace HybridRL.Analysis.Plots;

/// <summary>Saves a ScottPlot figure as PNG and SVG beside each other (temp name, then atomic rename).</summary>
public static class PlotFiles
{
    public const int Width = 900;
    public const int Height = 560;

    /// <summary>Writes <c>basePath.png</c> and <c>basePath.svg</c>; returns both paths.</summary>
    public static IReadOnlyList<string> Save(Plot plot, string basePath)
    {
        string png = basePath + ".png", svg = basePath + ".svg";
        AtomicFile.WriteViaPath(png, tmp => plot.SavePng(tmp, Width, Height));
        AtomicFile.WriteViaPath(svg, tmp => plot.SaveSvg(tmp, Width, Height));
        return [png, svg];
    }

    public static Color ColorFor(int index) => new ScottPlot.Palettes.Category10().GetColor(index);

    /// <summary>Indices of the points whose value is finite (plots skip unobserved grid points).</summary>
    public static int[] Finite(IReadOnlyList<double> values) => Enumerable.Range(0, values.Count).Where(i => double.IsFinite(values[i])).ToArray();
}
