using HybridRL.Quantum.Randomness;
using MathNet.Numerics.Distributions;

namespace HybridRL.Analysis.Statistics;

/// <summary>
/// Stratified bootstrap confidence intervals (Agarwal et al. 2021, sec. 4 and appendix A): runs are
/// resampled with replacement independently within each stratum (e.g. each task), the resamples are
/// pooled and the statistic is evaluated on the pool. With a single stratum this is Efron's ordinary
/// bootstrap. All randomness comes from the caller's <see cref="RandomStream"/>, so results are reproducible.
/// Buffers are allocated once per call, never per resample.
/// </summary>
public static class Bootstrap
{
    /// <summary>Interval for <paramref name="statistic"/> over a single sample.</summary>
    public static ConfidenceInterval Interval(ReadOnlySpan<double> sample, SampleStatistic statistic, int resamples,
        double level, RandomStream rng, BootstrapMethod method = BootstrapMethod.ExpandedPercentile)
    {
        var data = sample.ToArray();
        return Stratified([data], statistic, resamples, level, rng, method);
    }

    /// <summary>Interval for <paramref name="statistic"/> over the pooled strata, resampling within each stratum.</summary>
    public static ConfidenceInterval Stratified(IReadOnlyList<double[]> strata, SampleStatistic statistic, int resamples,
        double level, RandomStream rng, BootstrapMethod method = BootstrapMethod.ExpandedPercentile)
    {
        var estimates = new double[resamples];
        var pooled = new double[TotalSize(strata)];
        var work = new double[pooled.Length];
        return Stratified(strata, statistic, level, rng, method, estimates, pooled, work);
    }

    /// <summary>
    /// Allocation-free core: <paramref name="estimates"/> has one slot per resample; <paramref name="pooled"/> and
    /// <paramref name="work"/> hold at least the total number of observations.
    /// </summary>
    public static ConfidenceInterval Stratified(IReadOnlyList<double[]> strata, SampleStatistic statistic, double level,
        RandomStream rng, BootstrapMethod method, Span<double> estimates, Span<double> pooled, Span<double> work)
    {
        ArgumentNullException.ThrowIfNull(strata);
        ArgumentNullException.ThrowIfNull(rng);
        CheckLevel(level);
        int total = TotalSize(strata);
        if (total == 0) return ConfidenceInterval.Missing(level);
        if (estimates.Length < 1) throw new ArgumentException("at least one bootstrap resample is needed", nameof(estimates));
        if (pooled.Length < total || work.Length < total) throw new ArgumentException($"buffers need {total} elements");

        var pool = pooled[..total];
        var w = work[..total];
        int off = 0;
        foreach (var s in strata) { s.CopyTo(pool[off..]); off += s.Length; }
        pool.CopyTo(w);
        double point = statistic(w);

        for (int b = 0; b < estimates.Length; b++)
        {
            int o = 0;
            foreach (var s in strata)
            {
                int n = s.Length;
                for (int i = 0; i < n; i++) w[o + i] = s[rng.NextInt(n)];
                o += n;
            }
            estimates[b] = statistic(w);
        }
        return FromEstimates(point, estimates, level, method, total, strata.Count);
    }

    /// <summary>Interval for a two-sample statistic, resampling each sample independently (two strata).</summary>
    public static ConfidenceInterval TwoSample(ReadOnlySpan<double> x, ReadOnlySpan<double> y, TwoSampleStatistic statistic,
        int resamples, double level, RandomStream rng, BootstrapMethod method = BootstrapMethod.Percentile)
    {
        ArgumentNullException.ThrowIfNull(rng);
        CheckLevel(level);
        if (x.Length == 0 || y.Length == 0) return ConfidenceInterval.Missing(level);
        double point = statistic(x, y);
        var estimates = new double[resamples];
        var bx = new double[x.Length];
        var by = new double[y.Length];
        for (int b = 0; b < resamples; b++)
        {
            for (int i = 0; i < bx.Length; i++) bx[i] = x[rng.NextInt(x.Length)];
            for (int i = 0; i < by.Length; i++) by[i] = y[rng.NextInt(y.Length)];
            estimates[b] = statistic(bx, by);
        }
        return FromEstimates(point, estimates, level, method, x.Length + y.Length, 2);
    }

    /// <summary>Lower tail probability used for the interval end points (α/2, or Hesterberg's expanded α'/2).</summary>
    public static double TailProbability(double level, BootstrapMethod method, int totalSize, int strata)
    {
        double half = (1 - level) / 2;
        if (method == BootstrapMethod.Percentile) return half;
        int df = totalSize - strata;
        if (df < 1) return half;
        double t = StudentT.InvCDF(0, 1, df, 1 - half);
        return Normal.CDF(0, 1, -Math.Sqrt((double)totalSize / df) * t);
    }

    private static ConfidenceInterval FromEstimates(double point, Span<double> estimates, double level, BootstrapMethod method, int total, int strata)
    {
        estimates.Sort();
        double tail = TailProbability(level, method, total, strata);
        return new ConfidenceInterval(point,
            Descriptive.QuantileOfSorted(estimates, tail),
            Descriptive.QuantileOfSorted(estimates, 1 - tail),
            level);
    }

    private static int TotalSize(IReadOnlyList<double[]> strata)
    {
        int t = 0;
        foreach (var s in strata) t += s.Length;
        return t;
    }

    private static void CheckLevel(double level)
    {
        if (!(level > 0 && level < 1)) throw new ArgumentOutOfRangeException(nameof(level), level, "confidence level must be in (0, 1)");
    }
}
