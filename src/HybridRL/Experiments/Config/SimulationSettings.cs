namespace HybridRL.Experiments.Config;

/// <summary><c>model.simulation</c>: how the circuit is simulated and differentiated.</summary>
public sealed record SimulationSettings
{
    public required SimulationMode Mode { get; init; }
    /// <summary>Measurement shots per circuit execution; 0 = exact expectation values.</summary>
    public required int Shots { get; init; }
    public required int Trajectories { get; init; }
    /// <summary>Simulator threads; 0 = all available cores.</summary>
    public required int Threads { get; init; }
    public required GradientMethod Gradient { get; init; }
    public required NoiseSettings Noise { get; init; }
}
