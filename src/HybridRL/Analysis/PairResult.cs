using HybridRL.Analysis.Statistics;

namespace HybridRL.Analysis;

/// <summary>Comparison of the final returns of group A against group B.</summary>
public sealed record PairResult(
    string A,
    string B,
    ConfidenceInterval ProbabilityOfImprovement,
    WelchTestResult Welch,
    MannWhitneyResult MannWhitney,
    EffectSizeResult Effect);
