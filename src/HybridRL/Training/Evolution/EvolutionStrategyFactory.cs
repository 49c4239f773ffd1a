namespace HybridRL.Training.Evolution;

/// <summary>Builds an <see cref="IEvolutionStrategy"/> from a method kind and its settings record.</summary>
public static class EvolutionStrategyFactory
{
    /// <summary>
    /// Creates the optimiser for <paramref name="kind"/>. <paramref name="settings"/> must be the record of that
    /// method (<see cref="GeneticSearchSettings"/>, <see cref="EvolutionStrategiesSettings"/>, <see cref="CmaEsSettings"/>);
    /// <paramref name="seed"/> seeds the optimiser's own random stream (derive it from the run's root seed).
    /// </summary>
    public static IEvolutionStrategy Create(EvolutionKind kind, EvolutionSettings settings, double[] initialParameters, ulong seed)
    {
        ArgumentNullException.ThrowIfNull(settings);
        if (settings.Kind != kind)
            throw new ArgumentException($"settings are for {settings.Kind}, but the method is {kind}", nameof(settings));
        return settings switch
        {
            GeneticSearchSettings g => new GeneticSearch(g, initialParameters, seed),
            EvolutionStrategiesSettings e => new EvolutionStrategiesSearch(e, initialParameters, seed),
            CmaEsSettings c => new CmaEvolutionStrategy(c, initialParameters, seed),
            _ => throw new ArgumentException($"unknown settings type {settings.GetType().Name}", nameof(settings)),
        };
    }

    /// <summary>Creates the optimiser for the method the settings record describes.</summary>
    public static IEvolutionStrategy Create(EvolutionSettings settings, double[] initialParameters, ulong seed)
    {
        ArgumentNullException.ThrowIfNull(settings);
        return Create(settings.Kind, settings, initialParameters, seed);
    }
}
