namespace HybridRL.Experiments.Config;

/// <summary>How circuits are simulated (config names are the snake_case member names, see <see cref="ChoiceNames"/>).</summary>
public enum SimulationMode
{
    Exact,
    Shots,
    DensityMatrix,
    Trajectories,
}
