using HybridRL.Training;
namespace HybridRL.Checkpoints;

/// <summary>
/// Conventional section names used by both trainers, so tools can find the same content in any checkpoint.
/// A trainer may add further sections; unknown sections are carried and validated like any other.
/// </summary>
public static class CheckpointSections
{
    /// <summary>Flat vector of all model parameters.</summary>
    public const string Parameters = "parameters";
    /// <summary>Optimiser state (moments, step counts).</summary>
    public const string Optimizer = "optimizer";
    /// <summary>Trainer state: replay buffer contents and cursor, or population, fitness and search-distribution state.</summary>
    public const string Trainer = "trainer";
    /// <summary>State of every random stream, by name.</summary>
    public const string RandomStreams = "random-streams";
    /// <summary>State of every environment copy.</summary>
    public const string Environments = "environments";
    /// <summary>Progress counters and the metrics cursor (<see cref="TrainingCounters"/>).</summary>
    public const string Counters = "counters";
}
