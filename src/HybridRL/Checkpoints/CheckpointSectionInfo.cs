namespace HybridRL.Checkpoints;

/// <summary>Where a validated section lives inside a checkpoint file.</summary>
/// <param name="Name">Section name.</param>
/// <param name="PayloadOffset">Absolute file offset of the first payload byte.</param>
/// <param name="Length">Payload length in bytes.</param>
/// <param name="Checksum">The section's XxHash64-64 checksum as stored (and verified).</param>
public sealed record CheckpointSectionInfo(string Name, long PayloadOffset, long Length, ulong Checksum);
