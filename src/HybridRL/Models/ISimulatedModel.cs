using HybridRL.Quantum.Simulation;

namespace HybridRL.Models;

/// <summary>
/// A model whose outputs come from a circuit simulation with its own random streams (shots, trajectories)
/// and noise schedule: their state belongs in checkpoints for exact resume.
/// </summary>
public interface ISimulatedModel
{
    /// <summary>Seed and call counter of the simulator's random streams.</summary>
    EvaluatorRandomState GetSimulationState();
    void SetSimulationState(EvaluatorRandomState state);
    /// <summary>Training progress t ∈ [0, 1] that noise schedules follow.</summary>
    double NoiseProgress { get; set; }
}
