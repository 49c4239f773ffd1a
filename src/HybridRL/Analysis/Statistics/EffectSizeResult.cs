namespace HybridRL.Analysis.Statistics;

/// <summary>
/// Standardised effect sizes of x versus y: Cohen's d (pooled SD), Hedges' g (small-sample corrected d) and the
/// parametric common-language effect size P(X &gt; Y) under normality (McGraw &amp; Wong 1992).
/// </summary>
public readonly record struct EffectSizeResult(double CohensD, double HedgesG, double CommonLanguage);
