namespace HybridRL.Experiments.Config;

/// <summary>What the configuration layer needs to know about an environment to check encodings.</summary>
/// <param name="ObservationSize">Length of the observation vector.</param>
/// <param name="ActionCount">Number of discrete actions.</param>
/// <param name="DiscreteStateCount">Number of discrete states when the environment exposes a state index; null otherwise.</param>
public sealed record EnvironmentShape(int ObservationSize, int ActionCount, long? DiscreteStateCount);
