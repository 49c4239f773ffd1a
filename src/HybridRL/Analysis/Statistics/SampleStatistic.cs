namespace HybridRL.Analysis.Statistics;

/// <summary>A statistic of one sample (mean, interquartile mean, ...). The span may be reordered by the callee.</summary>
public delegate double SampleStatistic(Span<double> sample);
