namespace HybridRL.Analysis.Statistics;

/// <summary>How a bootstrap distribution is turned into an interval.</summary>
public enum BootstrapMethod
{
    /// <summary>Plain percentile interval (Efron &amp; Tibshirani 1993, ch. 13). Known to under-cover for small samples.</summary>
    Percentile,

    /// <summary>
    /// Expanded percentile interval (Hesterberg 2015, "What Teachers Should Know About the Bootstrap",
    /// The American Statistician 69(4), sec. 3.3): the percentile interval taken at the adjusted level
    /// α'/2 = Φ(−√(n/(n−1)) · t_{α/2, n−1}), which corrects the narrowness bias of the percentile
    /// interval for small n. With k strata we use n = total size and n − k degrees of freedom
    /// (our generalisation; equal to Hesterberg's rule for one stratum).
    /// </summary>
    ExpandedPercentile,
}
