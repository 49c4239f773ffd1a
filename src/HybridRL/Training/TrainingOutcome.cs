namespace HybridRL.Training;

/// <summary>How a call to <see cref="TrainingLoop.Run"/> ended.</summary>
public enum TrainingOutcome
{
    /// <summary>A budget limit was reached; final metrics row and checkpoint written.</summary>
    Completed,

    /// <summary>Cancelled (signal); the current unit was finished and a checkpoint written.</summary>
    Interrupted,
}
