namespace HybridRL.Analysis.Statistics;

/// <summary>
/// Interquartile mean (Agarwal et al. 2021, "Deep RL at the Edge of the Statistical Precipice", sec. 4):
/// the mean of the middle 50% of the sorted values. With n values, floor(n/4) values are removed from
/// each end (a 25% trimmed mean); for n &lt; 4 nothing is removed and the result is the plain mean.
/// </summary>
public static class InterquartileMean
{
    /// <summary>IQM of <paramref name="values"/>; <paramref name="scratch"/> (length ≥ n) receives a sorted copy.</summary>
    public static double Compute(ReadOnlySpan<double> values, Span<double> scratch)
    {
        int n = values.Length;
        if (n == 0) return double.NaN;
        if (scratch.Length < n) throw new ArgumentException($"scratch needs {n} elements, has {scratch.Length}", nameof(scratch));
        var s = scratch[..n];
        values.CopyTo(s);
        s.Sort();
        return OfSorted(s);
    }

    /// <summary>IQM of values already sorted ascending.</summary>
    public static double OfSorted(ReadOnlySpan<double> sorted)
    {
        int n = sorted.Length;
        if (n == 0) return double.NaN;
        int cut = n / 4;
        double sum = 0;
        for (int i = cut; i < n - cut; i++) sum += sorted[i];
        return sum / (n - 2 * cut);
    }

    public static double Compute(ReadOnlySpan<double> values) => Compute(values, new double[values.Length]);
}
