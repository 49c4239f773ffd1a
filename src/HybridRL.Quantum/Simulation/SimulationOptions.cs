using HybridRL.Quantum.Noise;

namespace HybridRL.Quantum.Simulation;

/// <summary>How a circuit is simulated and differentiated.</summary>
public sealed record SimulationOptions
{
    public SimulationMode Mode { get; init; } = SimulationMode.StateVector;
    /// <summary>Shots per measurement setting (required &gt; 0 in Shots mode; optional in DensityMatrix and Trajectories modes).</summary>
    public int Shots { get; init; }
    /// <summary>Trajectories per row in Trajectories mode when Shots is 0 (with shots, each shot is one trajectory).</summary>
    public int Trajectories { get; init; } = 256;
    public NoiseModel? Noise { get; init; }
    public ulong Seed { get; init; } = 1;
    /// <summary>Worker threads (rows for small registers, amplitude ranges for large ones). Results do not depend on it.</summary>
    public int Threads { get; init; } = 1;
    public GradientMethod Gradient { get; init; } = GradientMethod.Auto;

    public static SimulationOptions Exact { get; } = new();
}
