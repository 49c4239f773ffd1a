namespace HybridRL.Quantum.Simulation;

public enum SimulationMode
{
    /// <summary>Exact state vector, exact expectations.</summary>
    StateVector,
    /// <summary>State vector with a finite number of sampled shots per measurement setting.</summary>
    Shots,
    /// <summary>Density matrix with Kraus channels (exact expectations, or shots when Shots &gt; 0).</summary>
    DensityMatrix,
    /// <summary>Monte-Carlo trajectories on the state vector with the same channels.</summary>
    Trajectories,
}
