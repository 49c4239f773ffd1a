using HybridRL.Analysis.Statistics;

namespace HybridRL.Analysis;

/// <summary>Per grid point statistics of one group: runs observed, mean and IQM with bootstrap intervals, threshold share.</summary>
public sealed record GroupCurveStatistics(
    double[] Grid,
    int[] Observed,
    ConfidenceInterval[] Mean,
    ConfidenceInterval[] Iqm,
    double[]? ReachedShare);
