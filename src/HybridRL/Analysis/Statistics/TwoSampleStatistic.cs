namespace HybridRL.Analysis.Statistics;

/// <summary>A statistic comparing two samples (e.g. probability of improvement).</summary>
public delegate double TwoSampleStatistic(ReadOnlySpan<double> x, ReadOnlySpan<double> y);
