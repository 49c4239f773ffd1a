namespace HybridRL.Analysis;

/// <summary>
/// Puts learning curves with different lengths and logging intervals on one common grid by linear interpolation.
/// A run contributes no value outside its own logged range (right-censored when it stopped early), and the
/// number of runs still observed at each grid point is reported.
/// </summary>
public static class CurveAlignment
{
    /// <summary>An evenly spaced grid from the earliest first point to the latest last point of the curves.</summary>
    public static double[] CommonGrid(IReadOnlyList<LearningCurve> curves, int points)
    {
        if (points < 2) throw new ArgumentOutOfRangeException(nameof(points), points, "a grid needs at least 2 points");
        var nonEmpty = curves.Where(c => c.Count > 0).ToArray();
        if (nonEmpty.Length == 0) return [];
        double lo = nonEmpty.Min(c => c.FirstX), hi = nonEmpty.Max(c => c.LastX);
        if (hi == lo) return [lo];
        var grid = new double[points];
        for (int i = 0; i < points; i++) grid[i] = lo + (hi - lo) * i / (points - 1);
        grid[^1] = hi;
        return grid;
    }

    public static AlignedCurves Align(IReadOnlyList<LearningCurve> curves, int points) => Align(curves, CommonGrid(curves, points));

    public static AlignedCurves Align(IReadOnlyList<LearningCurve> curves, double[] grid)
    {
        var values = new double[curves.Count][];
        var observed = new int[grid.Length];
        for (int r = 0; r < curves.Count; r++)
        {
            var row = values[r] = new double[grid.Length];
            for (int g = 0; g < grid.Length; g++)
            {
                row[g] = curves[r].ValueAt(grid[g]);
                if (!double.IsNaN(row[g])) observed[g]++;
            }
        }
        return new AlignedCurves(grid, values, observed);
    }
}
