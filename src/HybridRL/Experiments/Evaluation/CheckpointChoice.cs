namespace HybridRL.Experiments.Evaluation;

/// <summary>Which checkpoint of a run an evaluation loads.</summary>
public enum CheckpointChoice
{
    /// <summary>The one the <c>best</c> pointer names (highest periodic evaluation); the newest when no evaluation was recorded.</summary>
    Best,
    /// <summary>The newest checkpoint that validates.</summary>
    Latest,
}
