namespace HybridRL.Analysis.Statistics;

/// <summary>
/// Probability of improvement P(X &gt; Y) (Agarwal et al. 2021, sec. 4): the share of all pairs (x_i, y_j) with
/// x_i &gt; y_j, ties counting one half. It equals the Mann–Whitney U of X divided by n_x·n_y, i.e. the
/// nonparametric common-language effect size.
/// </summary>
public static class ProbabilityOfImprovement
{
    public static double Compute(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length == 0 || y.Length == 0) return double.NaN;
        double s = 0;
        foreach (double a in x)
            foreach (double b in y)
                s += a > b ? 1.0 : a == b ? 0.5 : 0.0;
        return s / ((double)x.Length * y.Length);
    }
}
