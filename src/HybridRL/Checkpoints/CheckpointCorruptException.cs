namespace HybridRL.Checkpoints;

/// <summary>
/// A checkpoint file failed validation: bad magic, unsupported version, truncation, or a checksum mismatch.
/// The message names the file and (where known) the failing section and offset.
/// </summary>
public sealed class CheckpointCorruptException : Exception
{
    public CheckpointCorruptException(string filePath, string? section, long? offset, string problem,
        ulong? expectedChecksum = null, ulong? actualChecksum = null)
        : base(Compose(filePath, section, offset, problem, expectedChecksum, actualChecksum))
    {
        FilePath = filePath;
        Section = section;
        Offset = offset;
        Problem = problem;
        ExpectedChecksum = expectedChecksum;
        ActualChecksum = actualChecksum;
    }

    /// <summary>The checkpoint file.</summary>
    public string FilePath { get; }
    /// <summary>The failing section ("header", "footer" or a section name); null when the failure is file-wide.</summary>
    public string? Section { get; }
    /// <summary>Byte offset at which the failing structure starts (or where the file was found truncated).</summary>
    public long? Offset { get; }
    /// <summary>What was wrong, without the file/section prefix.</summary>
    public string Problem { get; }
    public ulong? ExpectedChecksum { get; }
    public ulong? ActualChecksum { get; }

    private static string Compose(string file, string? section, long? offset, string problem, ulong? expected, ulong? actual)
    {
        var s = $"corrupt checkpoint '{file}'";
        if (section is not null) s += $", section '{section}'";
        if (offset is not null) s += $" at offset {offset}";
        s += ": " + problem;
        if (expected is not null && actual is not null)
            s += $" (expected checksum 0x{expected:x16}, actual 0x{actual:x16})";
        return s;
    }
}
