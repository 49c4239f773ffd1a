namespace HybridRL.Experiments.Inspection;

/// <summary>Memory the run needs for its larger buffers, against what the process may use.</summary>
public sealed record MemoryEstimate
{
    /// <summary>Replay memory: bytes per transition × capacity (DQN only).</summary>
    public long? ReplayBytes { get; init; }
    public long? ReplayBytesPerTransition { get; init; }
    public int? ReplayCapacity { get; init; }
    /// <summary>Simulator state buffers, upper estimate: models × workspaces × 3 states × amplitudes × 16 bytes.</summary>
    public required long SimulatorBytes { get; init; }
    /// <summary>Flat parameter copies: models × parameters × 8 bytes (optimiser state excluded).</summary>
    public required long ParameterBytes { get; init; }
    public required long TotalBytes { get; init; }
    /// <summary>GC.GetGCMemoryInfo().TotalAvailableMemoryBytes (physical memory or the container limit).</summary>
    public required long AvailableBytes { get; init; }
    public required bool Fits { get; init; }
}
