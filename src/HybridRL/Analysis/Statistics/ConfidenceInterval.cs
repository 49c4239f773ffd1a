namespace HybridRL.Analysis.Statistics;

/// <summary>A point estimate with a two-sided confidence interval.</summary>
public readonly record struct ConfidenceInterval(double Estimate, double Lower, double Upper, double Level)
{
    public static ConfidenceInterval Missing(double level) => new(double.NaN, double.NaN, double.NaN, level);
    public bool Contains(double value) => value >= Lower && value <= Upper;
}
