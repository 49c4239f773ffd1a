using MathNet.Numerics.Distributions;

namespace HybridRL.Analysis.Statistics;

/// <summary>
/// Welch's t-test for two independent samples with possibly unequal variances (Welch 1947):
/// t = (m₁ − m₂)/√(s₁²/n₁ + s₂²/n₂), ν = (s₁²/n₁ + s₂²/n₂)² / ((s₁²/n₁)²/(n₁−1) + (s₂²/n₂)²/(n₂−1)),
/// p = 2·(1 − F_ν(|t|)) with F the Student-t CDF from MathNet.Numerics.
/// </summary>
public static class WelchTest
{
    public static WelchTestResult Compute(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        if (x.Length < 2 || y.Length < 2) return new WelchTestResult(double.NaN, double.NaN, double.NaN, Descriptive.Mean(x) - Descriptive.Mean(y));
        double mx = Descriptive.Mean(x), my = Descriptive.Mean(y);
        double vx = Descriptive.Variance(x) / x.Length, vy = Descriptive.Variance(y) / y.Length;
        double se2 = vx + vy;
        double diff = mx - my;
        if (se2 == 0)
        {
            // Both samples constant: the difference is exact.
            return new WelchTestResult(diff == 0 ? 0 : Math.Sign(diff) * double.PositiveInfinity, double.NaN, diff == 0 ? 1 : 0, diff);
        }
        double t = diff / Math.Sqrt(se2);
        double df = se2 * se2 / (vx * vx / (x.Length - 1) + vy * vy / (y.Length - 1));
        double p = 2 * StudentT.CDF(0, 1, df, -Math.Abs(t));
        return new WelchTestResult(t, df, Math.Min(1, p), diff);
    }
}
