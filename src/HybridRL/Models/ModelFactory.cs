namespace HybridRL.Models;

/// <summary>Builds the model a run asks for. Initialisation is deterministic in <c>seed</c>.</summary>
public static class ModelFactory
{
    /// <summary>
    /// Builds a <see cref="HybridModel"/> or <see cref="ClassicalModel"/>. Throws
    /// <see cref="ModelConfigurationException"/> (an ArgumentException whose message and Keys name the
    /// config keys to change) when the settings cannot fit the observation and action sizes.
    /// Call <c>HybridRL.Native.TorchRuntime.EnsureLoaded()</c> first.
    /// </summary>
    public static IAgentModel Create(ModelSettings settings, int observationSize, int actionCount, ulong seed)
    {
        ArgumentNullException.ThrowIfNull(settings);
        return settings.Kind switch
        {
            ModelKind.Classical => new ClassicalModel(settings.Classical, observationSize, actionCount, seed),
            _ => new HybridModel(settings, observationSize, actionCount, seed),
        };
    }
}
