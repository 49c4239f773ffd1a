namespace HybridRL.Training;

/// <summary>A NaN or infinity appeared in the loss, the parameters or the fitness; the run stops and keeps its last good checkpoint.</summary>
public sealed class DivergenceException(string what, long envSteps) : Exception($"{what} became NaN or infinite at environment step {envSteps}; the run stopped and the last good checkpoint is kept")
{
    public long EnvSteps { get; } = envSteps;
}
