namespace HybridRL.Analysis.Statistics;

/// <summary>
/// Mann–Whitney U test result. <see cref="U"/> is the statistic of the first sample (number of pairs with
/// x &gt; y, ties one half); <see cref="Exact"/> tells whether the p-value is from the exact null distribution
/// (no ties, small samples) or from the tie-corrected normal approximation with continuity correction.
/// </summary>
public readonly record struct MannWhitneyResult(double U, double Z, double PValue, bool Exact);
