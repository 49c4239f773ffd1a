namespace HybridRL.Analysis.Statistics;

/// <summary>Small allocation-free descriptive statistics used by the analysis code.</summary>
public static class Descriptive
{
    public static double Mean(ReadOnlySpan<double> x)
    {
        if (x.Length == 0) return double.NaN;
        double s = 0;
        foreach (double v in x) s += v;
        return s / x.Length;
    }

    /// <summary>Unbiased sample variance (divisor n − 1); NaN for n &lt; 2.</summary>
    public static double Variance(ReadOnlySpan<double> x)
    {
        int n = x.Length;
        if (n < 2) return double.NaN;
        double m = Mean(x), ss = 0;
        foreach (double v in x) ss += (v - m) * (v - m);
        return ss / (n - 1);
    }

    public static double StandardDeviation(ReadOnlySpan<double> x) => Math.Sqrt(Variance(x));

    /// <summary>Quantile of sorted data by linear interpolation between order statistics (Hyndman &amp; Fan 1996, type 7).</summary>
    public static double QuantileOfSorted(ReadOnlySpan<double> sorted, double p)
    {
        int n = sorted.Length;
        if (n == 0) return double.NaN;
        if (p <= 0) return sorted[0];
        if (p >= 1) return sorted[n - 1];
        double h = (n - 1) * p;
        int lo = (int)Math.Floor(h);
        int hi = Math.Min(lo + 1, n - 1);
        return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
    }

    public static double Median(ReadOnlySpan<double> x)
    {
        if (x.Length == 0) return double.NaN;
        var s = x.ToArray();
        Array.Sort(s);
        return QuantileOfSorted(s, 0.5);
    }

    /// <summary>Mean used as a <see cref="SampleStatistic"/>.</summary>
    public static double MeanStatistic(Span<double> sample) => Mean(sample);

    /// <summary>Interquartile mean used as a <see cref="SampleStatistic"/> (sorts the span in place).</summary>
    public static double IqmStatistic(Span<double> sample)
    {
        sample.Sort();
        return InterquartileMean.OfSorted(sample);
    }
}
