using HybridRL.Models;

namespace HybridRL.Training;

/// <summary>
/// Moves the simulated device's noise along its schedule: every model with a noisy simulator is told the
/// training progress (the budget fraction used, without wall time, so a seed's results do not depend on
/// machine speed) before each unit of work.
/// </summary>
public static class NoiseClock
{
    public static void Advance(IAgentModel[] models, double progress)
    {
        foreach (var m in models)
            if (m is ISimulatedModel sim) sim.NoiseProgress = Math.Clamp(progress, 0, 1);
    }
}
