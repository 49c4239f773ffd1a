namespace HybridRL.Checkpoints;

/// <summary>Figures measured by <see cref="CheckpointBenchmark.Run"/>.</summary>
/// <param name="WriteMs">Median wall time of one full checkpoint save (write, fsync, rename, pointers, retention).</param>
/// <param name="Bytes">Size of the checkpoint file.</param>
/// <param name="ReadValidateMs">Median wall time of opening and fully validating the file.</param>
/// <param name="RawWriteMs">Median wall time of writing the same number of bytes from one buffer with fsync (the floor).</param>
/// <param name="Repetitions">How many saves were timed.</param>
public sealed record CheckpointBenchmarkResult(double WriteMs, long Bytes, double ReadValidateMs, double RawWriteMs, int Repetitions)
{
    /// <summary>Checkpoint save time over the raw write floor (1.0 = no overhead).</summary>
    public double WriteOverRawRatio => RawWriteMs > 0 ? WriteMs / RawWriteMs : double.NaN;

    /// <summary>Named figures for <c>hybridrl bench training --json</c>.</summary>
    public IReadOnlyDictionary<string, double> ToMetrics() => new Dictionary<string, double>
    {
        ["checkpoint_write_ms_100k_transitions"] = WriteMs,
        ["checkpoint_bytes_100k_transitions"] = Bytes,
        ["checkpoint_read_validate_ms_100k_transitions"] = ReadValidateMs,
        ["checkpoint_raw_write_ms_100k_transitions"] = RawWriteMs,
        ["checkpoint_write_over_raw_write_ratio"] = WriteOverRawRatio,
    };
}
