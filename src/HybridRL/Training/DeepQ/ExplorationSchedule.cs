namespace HybridRL.Training.DeepQ;

/// <summary>How ε moves from its start to its end value.</summary>
public enum DecayShape
{
    Linear,
    Exponential,
}

/// <summary>ε-greedy exploration rate as a function of environment steps.</summary>
/// <param name="Start">ε at step 0.</param>
/// <param name="End">ε after <paramref name="DecaySteps"/> (and forever after).</param>
/// <param name="DecaySteps">Steps over which ε decays.</param>
/// <param name="Shape">Linear interpolation, or geometric (exponential) interpolation between start and end.</param>
public sealed record ExplorationSchedule(double Start, double End, long DecaySteps, DecayShape Shape)
{
    public double At(long step)
    {
        if (DecaySteps <= 0 || step >= DecaySteps) return End;
        double f = (double)step / DecaySteps;
        return Shape switch
        {
            DecayShape.Linear => Start + (End - Start) * f,
            _ => Start * Math.Pow(Math.Max(End, 1e-12) / Math.Max(Start, 1e-12), f),
        };
    }
}
