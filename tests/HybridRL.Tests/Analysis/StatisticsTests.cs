using HybridRL.Analysis.Statistics;
using HybridRL.Quantum.Randomness;
using MathNet.Numerics.Distributions;

namespace HybridRL.Tests.Analysis;

public class StatisticsTests
{
    [Fact]
    public void BootstrapIntervalCoversTrueMeanAboutNinetyFivePercent()
    {
        // Coverage check on synthetic N(3, 2²) data (invented): the nominal 95% interval must cover the true
        // mean in 93–97% of 2000 repetitions. Monte-Carlo SE of a coverage near 0.95 is ≈ 0.005.
        const int reps = 2000, n = 20, resamples = 500;
        const double mu = 3, sigma = 2;
        var data = new RandomStream(20240611);
        var boot = RandomStream.FromRoot(7, "bootstrap-coverage");
        var sample = new double[n];
        var strata = new[] { sample };
        var estimates = new double[resamples];
        var pooled = new double[n];
        var work = new double[n];
        SampleStatistic mean = Descriptive.MeanStatistic;
        int covered = 0;
        for (int r = 0; r < reps; r++)
        {
            for (int i = 0; i < n; i++) sample[i] = mu + sigma * data.NextGaussian();
            var ci = Bootstrap.Stratified(strata, mean, 0.95, boot, BootstrapMethod.ExpandedPercentile, estimates, pooled, work);
            if (ci.Contains(mu)) covered++;
        }
        double coverage = covered / (double)reps;
        Assert.InRange(coverage, 0.93, 0.97);
    }

    [Fact]
    public void BootstrapIsReproducibleForAFixedSeed()
    {
        double[] x = [1, 4, 2, 8, 5, 7, 3, 6];
        var a = Bootstrap.Interval(x, Descriptive.IqmStatistic, 300, 0.95, RandomStream.FromRoot(1, "b"));
        var b = Bootstrap.Interval(x, Descriptive.IqmStatistic, 300, 0.95, RandomStream.FromRoot(1, "b"));
        Assert.Equal(a, b);
        Assert.True(a.Lower <= a.Estimate && a.Estimate <= a.Upper);
    }

    [Fact]
    public void ExpandedTailMatchesHesterbergFormula()
    {
        // Hesterberg 2015 sec. 3.3: α'/2 = Φ(−√(n/(n−1)) t_{α/2,n−1}); for n = 20, t_{0.025,19} = 2.0930 (t-table,
        // from memory) gives Φ(−2.1473) ≈ 0.0159. Checked with MathNet's StudentT/Normal as reference.
        double tail = Bootstrap.TailProbability(0.95, BootstrapMethod.ExpandedPercentile, 20, 1);
        Assert.Equal(0.0159, tail, 3);
        Assert.Equal(0.025, Bootstrap.TailProbability(0.95, BootstrapMethod.Percentile, 20, 1), 12);
    }

    [Fact]
    public void StratifiedBootstrapResamplesWithinStrata()
    {
        // Two strata with constant values: every resample keeps 3 zeros and 2 tens, so the mean is always 4.
        var ci = Bootstrap.Stratified([new double[] { 0, 0, 0 }, new double[] { 10, 10 }], Descriptive.MeanStatistic, 200, 0.95, new RandomStream(3));
        Assert.Equal(4, ci.Estimate, 12);
        Assert.Equal(4, ci.Lower, 12);
        Assert.Equal(4, ci.Upper, 12);
    }

    [Fact]
    public void InterquartileMeanHandComputed()
    {
        // Hand-worked: floor(n/4) values trimmed from each end (Agarwal et al. 2021 sec. 4, 25% trimmed mean).
        Assert.Equal(4.5, InterquartileMean.Compute([1, 2, 3, 4, 5, 6, 7, 8]), 12);          // mean(3,4,5,6)
        Assert.Equal(4.5, InterquartileMean.Compute([100, 1, 2, 3, 4, 5, 6, 7]), 12);        // outlier trimmed
        Assert.Equal(3.0, InterquartileMean.Compute([50, 1, 2, 3, 4]), 12);                  // n=5: mean(2,3,4)
        Assert.Equal(2.0, InterquartileMean.Compute([1, 2, 3]), 12);                         // n<4: plain mean
    }

    [Fact]
    public void ProbabilityOfImprovementHandComputed()
    {
        // Hand-worked pair counts (ties count 1/2), Agarwal et al. 2021 sec. 4.
        Assert.Equal(0.5, ProbabilityOfImprovement.Compute([1, 2, 3], [2, 2]), 12);          // (0+0+.5+.5+1+1)/6
        Assert.Equal(5.0 / 6.0, ProbabilityOfImprovement.Compute([3, 4], [1, 2, 3.5]), 12); // (2+3)/6
        Assert.Equal(1.0, ProbabilityOfImprovement.Compute([5, 6], [1, 2]), 12);
    }

    [Fact]
    public void WelchTestHandWorkedExample()
    {
        // Hand-worked: x̄=3, s²=2.5; ȳ=7, s²=10; n=5 each. SE² = 0.5 + 2 = 2.5, t = −4/√2.5,
        // ν = 2.5² / (0.5²/4 + 2²/4) = 6.25/1.0625. p = 2·F_ν(−|t|) with MathNet's StudentT as reference.
        var r = WelchTest.Compute([1, 2, 3, 4, 5], [3, 5, 7, 9, 11]);
        Assert.Equal(-4 / Math.Sqrt(2.5), r.T, 12);
        Assert.Equal(6.25 / 1.0625, r.DegreesOfFreedom, 12);
        Assert.Equal(2 * StudentT.CDF(0, 1, 6.25 / 1.0625, -4 / Math.Sqrt(2.5)), r.PValue, 12);
        // t-table (from memory): two-sided 5% critical value ≈ 2.45–2.57 for ν between 5 and 6, 2% ≈ 3.14–3.36.
        Assert.InRange(r.PValue, 0.02, 0.06);
        Assert.Equal(r.PValue, WelchTest.Compute([3, 5, 7, 9, 11], [1, 2, 3, 4, 5]).PValue, 12);
    }

    [Fact]
    public void WelchMatchesPooledTWhenVariancesAndSizesAreEqual()
    {
        // With n₁ = n₂ and s₁ = s₂ Welch's t equals Student's pooled t and ν = 2n − 2 (textbook identity).
        double[] x = [1, 2, 3, 4], y = [3, 4, 5, 6];
        var r = WelchTest.Compute(x, y);
        double sp2 = Descriptive.Variance(x);
        Assert.Equal(-2 / Math.Sqrt(sp2 * (0.25 + 0.25)), r.T, 12);
        Assert.Equal(6, r.DegreesOfFreedom, 10);
    }

    [Fact]
    public void MannWhitneyExactHandCounted()
    {
        // Hand count: with n₁=n₂=3 only 1 of C(6,3)=20 orderings has U=0, so the two-sided exact p = 2/20.
        var r = MannWhitneyTest.Compute([1, 2, 3], [4, 5, 6]);
        Assert.True(r.Exact);
        Assert.Equal(0, r.U, 12);
        Assert.Equal(0.1, r.PValue, 12);
        // n₁=n₂=4, completely separated: 2/C(8,4) = 2/70.
        Assert.Equal(2.0 / 70.0, MannWhitneyTest.Compute([5, 6, 7, 8], [1, 2, 3, 4]).PValue, 12);
        // m=n=2: U over the 6 orderings is {0,1,2,2,3,4}, so P(U ≤ 1) = 2/6 (hand enumeration).
        Assert.Equal(2.0 / 6.0, MannWhitneyTest.ExactCdf(2, 2, 1), 12);
        // Symmetry of the null distribution: P(U ≤ k) = P(U ≥ mn − k).
        Assert.Equal(MannWhitneyTest.ExactCdf(5, 7, 12), 1 - MannWhitneyTest.ExactCdf(5, 7, 35 - 12 - 1), 12);
    }

    [Fact]
    public void MannWhitneyWithTiesUsesCorrectedNormalApproximation()
    {
        // Hand-worked: x={1,2,2,3}, y={2,3,4,5}. U = 0 + .5 + .5 + 1.5 = 2.5; μ = 8.
        // Tie groups: 2 (t=3) and 3 (t=2): Σ(t³−t) = 24 + 6 = 30; σ² = 16/12·(9 − 30/56).
        // z = (2.5 − 8 + 0.5)/σ (continuity correction); p = 2Φ(−|z|) with MathNet's Normal as reference.
        var r = MannWhitneyTest.Compute([1, 2, 2, 3], [2, 3, 4, 5]);
        Assert.False(r.Exact);
        Assert.Equal(2.5, r.U, 12);
        double sigma = Math.Sqrt(16.0 / 12.0 * (9 - 30.0 / 56.0));
        Assert.Equal(-5 / sigma, r.Z, 12);
        Assert.Equal(2 * Normal.CDF(0, 1, -5 / sigma), r.PValue, 12);
        Assert.Equal(r.U / 16.0, ProbabilityOfImprovement.Compute([1, 2, 2, 3], [2, 3, 4, 5]), 12); // U/(n₁n₂) = P(X>Y)
    }

    [Fact]
    public void EffectSizesHandWorked()
    {
        // Hand-worked: s_p² = (4·2.5 + 4·10)/8 = 6.25, d = −4/2.5 = −1.6.
        // J(8) = Γ(4)/(2·Γ(3.5)) = 6/(2·15√π/8); Hedges' approximation 1 − 3/(4ν − 1) = 0.9032 (Hedges 1981).
        // CL = Φ(−4/√12.5) (McGraw & Wong 1992), Normal CDF from MathNet.
        var e = EffectSize.Compute([1, 2, 3, 4, 5], [3, 5, 7, 9, 11]);
        Assert.Equal(-1.6, e.CohensD, 12);
        double j = 6 / (2 * 15 * Math.Sqrt(Math.PI) / 8);
        Assert.Equal(j, EffectSize.HedgesCorrection(8), 12);
        Assert.Equal(1 - 3.0 / 31.0, EffectSize.HedgesCorrection(8), 3);
        Assert.Equal(-1.6 * j, e.HedgesG, 12);
        Assert.Equal(Normal.CDF(0, 1, -4 / Math.Sqrt(12.5)), e.CommonLanguage, 12);
    }
}
