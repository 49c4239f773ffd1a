namespace HybridRL.Analysis;

/// <summary>
/// One run's learning curve: strictly increasing x (the chosen axis) and the return at each logged point.
/// Between points the curve is linear; outside [first x, last x] it has no value (the run was not observed there).
/// </summary>
public sealed class LearningCurve
{
    public LearningCurve(string runId, double[] x, double[] y)
    {
        ArgumentNullException.ThrowIfNull(x);
        ArgumentNullException.ThrowIfNull(y);
        if (x.Length != y.Length) throw new ArgumentException($"run {runId}: {x.Length} x values but {y.Length} y values");
        for (int i = 0; i < x.Length; i++)
        {
            if (double.IsNaN(x[i]) || double.IsNaN(y[i])) throw new ArgumentException($"run {runId}: NaN at point {i}");
            if (i > 0 && !(x[i] > x[i - 1])) throw new ArgumentException($"run {runId}: x must increase strictly (point {i})");
        }
        RunId = runId;
        X = x;
        Y = y;
    }

    public string RunId { get; }
    public double[] X { get; }
    public double[] Y { get; }
    public int Count => X.Length;
    public double FirstX => X.Length > 0 ? X[0] : double.NaN;
    public double LastX => X.Length > 0 ? X[^1] : double.NaN;

    /// <summary>Return at the last logged point.</summary>
    public double Final => Y.Length > 0 ? Y[^1] : double.NaN;

    /// <summary>Largest logged return.</summary>
    public double Best => Y.Length > 0 ? Y.Max() : double.NaN;

    /// <summary>
    /// Builds the curve from metrics rows where both columns have values. If the axis goes backwards (rows logged
    /// after a checkpoint and logged again after resuming), the later rows replace the earlier ones from that x on;
    /// rows with an equal x keep the later value.
    /// </summary>
    public static LearningCurve FromMetrics(string runId, MetricsTable metrics, string axisColumn, string returnColumn)
    {
        if (!metrics.HasColumn(axisColumn)) throw new InvalidDataException($"{metrics.Source}: no column '{axisColumn}'");
        if (!metrics.HasColumn(returnColumn)) throw new InvalidDataException($"{metrics.Source}: no column '{returnColumn}'");
        var xs = metrics.Column(axisColumn);
        var ys = metrics.Column(returnColumn);
        var px = new List<double>(xs.Length);
        var py = new List<double>(xs.Length);
        for (int i = 0; i < xs.Length; i++)
        {
            double x = xs[i], y = ys[i];
            if (double.IsNaN(x) || double.IsNaN(y)) continue;
            while (px.Count > 0 && px[^1] >= x) { px.RemoveAt(px.Count - 1); py.RemoveAt(py.Count - 1); }
            px.Add(x);
            py.Add(y);
        }
        return new LearningCurve(runId, px.ToArray(), py.ToArray());
    }

    /// <summary>Linearly interpolated return at <paramref name="x"/>; NaN outside the observed range.</summary>
    public double ValueAt(double x)
    {
        int n = X.Length;
        if (n == 0 || x < X[0] || x > X[^1]) return double.NaN;
        int i = Array.BinarySearch(X, x);
        if (i >= 0) return Y[i];
        int hi = ~i, lo = hi - 1;
        double w = (x - X[lo]) / (X[hi] - X[lo]);
        return Y[lo] + w * (Y[hi] - Y[lo]);
    }

    /// <summary>x of the first logged point whose return is ≥ <paramref name="threshold"/>; NaN if never reached.</summary>
    public double FirstReaching(double threshold)
    {
        for (int i = 0; i < Y.Length; i++) if (Y[i] >= threshold) return X[i];
        return double.NaN;
    }

    /// <summary>
    /// Trapezoidal area under the interpolated curve on [from, to]. NaN if the window is not fully observed.
    /// </summary>
    public double AreaUnder(double from, double to)
    {
        if (X.Length == 0 || from < X[0] || to > X[^1] || to < from) return double.NaN;
        if (to == from) return 0;
        double area = 0, px = from, py = ValueAt(from);
        for (int i = 0; i < X.Length; i++)
        {
            if (X[i] <= from) continue;
            if (X[i] >= to) break;
            area += 0.5 * (py + Y[i]) * (X[i] - px);
            px = X[i];
            py = Y[i];
        }
        area += 0.5 * (py + ValueAt(to)) * (to - px);
        return area;
    }
}
