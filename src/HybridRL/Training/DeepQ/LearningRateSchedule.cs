namespace HybridRL.Training.DeepQ;

/// <summary>Shape of the learning-rate schedule over the update budget.</summary>
public enum LearningRateShape
{
    Constant,
    Linear,
    Cosine,
}

/// <summary>Learning rate as a function of progress (updates done / expected updates), floored at <paramref name="MinimumFraction"/> of the base rate.</summary>
public sealed record LearningRateSchedule(double BaseRate, LearningRateShape Shape, double MinimumFraction = 0.0)
{
    public double At(double progress)
    {
        progress = Math.Clamp(progress, 0.0, 1.0);
        double factor = Shape switch
        {
            LearningRateShape.Constant => 1.0,
            LearningRateShape.Linear => 1.0 - progress,
            _ => 0.5 * (1.0 + Math.Cos(Math.PI * progress)),
        };
        return BaseRate * (MinimumFraction + (1.0 - MinimumFraction) * factor);
    }
}
