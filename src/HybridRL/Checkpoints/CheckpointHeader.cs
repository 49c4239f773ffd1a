namespace HybridRL.Checkpoints;

/// <summary>
/// The header of a checkpoint file. <see cref="Magic"/> and <see cref="FormatVersion"/> are filled by the
/// reader from the file; the writer always writes the current values.
/// </summary>
public sealed record CheckpointHeader
{
    /// <summary>Magic text read from the file (always <see cref="CheckpointFormat.MagicText"/> when valid).</summary>
    public string Magic { get; init; } = CheckpointFormat.MagicText;

    /// <summary>Format version of the file.</summary>
    public int FormatVersion { get; init; } = CheckpointFormat.CurrentVersion;

    /// <summary>Which trainer wrote the checkpoint (e.g. "deep-q", "evolution").</summary>
    public required string TrainerKind { get; init; }

    /// <summary>Hash of the resolved experiment config (free-form text, typically hex).</summary>
    public required string ConfigHash { get; init; }

    /// <summary>Creation time (UTC). When left at <c>default</c>, <see cref="CheckpointWriter.Save"/> stamps the current time.</summary>
    public DateTime CreatedUtc { get; init; }

    /// <summary>Training step the checkpoint belongs to (set by <see cref="CheckpointWriter.Save"/>).</summary>
    public long Step { get; init; }

    /// <summary>Score used for "keep the best" retention (higher is better); null when not scored.</summary>
    public double? Score { get; init; }
}
