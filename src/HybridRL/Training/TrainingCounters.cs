using HybridRL.Checkpoints;

namespace HybridRL.Training;

/// <summary>
/// Progress counters shared by both trainers plus the metrics cursor (how many rows metrics.csv held when the
/// checkpoint was written, so a resume can truncate the file back and never duplicate rows).
/// Stored in the <see cref="CheckpointSections.Counters"/> section.
/// </summary>
public sealed class TrainingCounters : IStateful
{
    private const int Version = 1;

    public long EnvSteps { get; set; }
    public long Episodes { get; set; }
    public long Updates { get; set; }
    public long Generations { get; set; }
    public long CircuitExecutions { get; set; }
    public long Shots { get; set; }
    public long HardwareExecutions { get; set; }
    /// <summary>Wall-clock seconds spent training up to the checkpoint (summed over resumed segments).</summary>
    public double WallSeconds { get; set; }
    /// <summary>Number of data rows in metrics.csv (header excluded) at the time of the checkpoint.</summary>
    public int MetricsRows { get; set; }

    public void Save(BinaryWriter w)
    {
        w.Write(Version);
        w.Write(EnvSteps);
        w.Write(Episodes);
        w.Write(Updates);
        w.Write(Generations);
        w.Write(CircuitExecutions);
        w.Write(Shots);
        w.Write(HardwareExecutions);
        w.Write(WallSeconds);
        w.Write(MetricsRows);
    }

    public void Load(BinaryReader r)
    {
        int v = r.ReadInt32();
        if (v != Version) throw new InvalidDataException($"counters section version {v} is not supported (expected {Version})");
        EnvSteps = r.ReadInt64();
        Episodes = r.ReadInt64();
        Updates = r.ReadInt64();
        Generations = r.ReadInt64();
        CircuitExecutions = r.ReadInt64();
        Shots = r.ReadInt64();
        HardwareExecutions = r.ReadInt64();
        WallSeconds = r.ReadDouble();
        MetricsRows = r.ReadInt32();
    }
}
