using MathNet.Numerics;
using MathNet.Numerics.Distributions;

namespace HybridRL.Analysis.Statistics;

/// <summary>
/// Effect sizes for two independent samples.
/// Cohen's d = (m₁ − m₂)/s_p with s_p² = ((n₁−1)s₁² + (n₂−1)s₂²)/(n₁+n₂−2) (Cohen 1988, sec. 2.5);
/// Hedges' g = J(ν)·d with the exact factor J(ν) = Γ(ν/2)/(√(ν/2)·Γ((ν−1)/2)), ν = n₁+n₂−2 (Hedges 1981);
/// common-language effect size CL = Φ((m₁ − m₂)/√(s₁² + s₂²)) (McGraw &amp; Wong 1992).
/// </summary>
public static class EffectSize
{
    public static EffectSizeResult Compute(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n1 = x.Length, n2 = y.Length;
        if (n1 < 2 || n2 < 2) return new EffectSizeResult(double.NaN, double.NaN, double.NaN);
        double m1 = Descriptive.Mean(x), m2 = Descriptive.Mean(y);
        double v1 = Descriptive.Variance(x), v2 = Descriptive.Variance(y);
        int df = n1 + n2 - 2;
        double sp = Math.Sqrt(((n1 - 1) * v1 + (n2 - 1) * v2) / df);
        double diff = m1 - m2;
        double d = sp > 0 ? diff / sp : (diff == 0 ? 0 : Math.Sign(diff) * double.PositiveInfinity);
        double g = HedgesCorrection(df) * d;
        double sdSum = Math.Sqrt(v1 + v2);
        double cl = sdSum > 0 ? Normal.CDF(0, 1, diff / sdSum) : (diff > 0 ? 1 : diff < 0 ? 0 : 0.5);
        return new EffectSizeResult(d, g, cl);
    }

    /// <summary>Hedges' exact bias-correction factor J(ν).</summary>
    public static double HedgesCorrection(int df)
    {
        if (df < 2) return double.NaN;
        return Math.Exp(SpecialFunctions.GammaLn(df / 2.0) - SpecialFunctions.GammaLn((df - 1) / 2.0)) / Math.Sqrt(df / 2.0);
    }
}
