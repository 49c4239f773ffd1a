namespace HybridRL.Training.Evolution;

/// <summary>The evolutionary search methods HybridRL offers.</summary>
public enum EvolutionKind
{
    /// <summary>Genetic search with truncation selection, Gaussian mutation and elitism (Such et al. 2017).</summary>
    Genetic,

    /// <summary>Evolution strategies with mirrored sampling, centred ranks and Adam (Salimans et al. 2017).</summary>
    EvolutionStrategies,

    /// <summary>Covariance matrix adaptation evolution strategy (Hansen 2016 tutorial), full or separable.</summary>
    CmaEs,
}
