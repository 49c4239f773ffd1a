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

    /// <summary>
    /// Hidden sizes for a classical baseline with <paramref name="hiddenLayers"/> equal-width layers whose
    /// parameter count is as close as possible to <paramref name="targetParameters"/> (e.g. a hybrid model's
    /// <see cref="IAgentModel.ParameterCount"/>), for comparisons at matched parameter counts.
    /// </summary>
    public static int[] MatchedClassicalHidden(int targetParameters, int observationSize, int actionCount, int hiddenLayers = 2)
    {
        if (targetParameters < 1) throw new ArgumentOutOfRangeException(nameof(targetParameters), targetParameters, "target must be positive");
        if (hiddenLayers < 1) throw new ArgumentOutOfRangeException(nameof(hiddenLayers), hiddenLayers, "need at least one hidden layer");
        int best = 1;
        long bestGap = long.MaxValue;
        for (int w = 1; w <= 1 << 16; w++)
        {
            long count = DenseNetwork.CountParameters(observationSize, Enumerable.Repeat(w, hiddenLayers).ToArray(), actionCount);
            long gap = Math.Abs(count - targetParameters);
            if (gap < bestGap) { bestGap = gap; best = w; }
            if (count > targetParameters) break;
        }
        return Enumerable.Repeat(best, hiddenLayers).ToArray();
    }
}
