namespace HybridRL.Analysis.Statistics;

/// <summary>Welch's unequal-variance t-test: statistic, Welch–Satterthwaite degrees of freedom, two-sided p-value.</summary>
public readonly record struct WelchTestResult(double T, double DegreesOfFreedom, double PValue, double MeanDifference);
