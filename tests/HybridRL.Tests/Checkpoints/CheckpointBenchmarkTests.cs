using HybridRL.Tests.Support;
using HybridRL.Checkpoints;

namespace HybridRL.Tests.Checkpoints;

public class CheckpointBenchmarkTests
{
    [Fact]
    public void BenchmarkWritesTheRepresentativeReplayAndReportsItsFigures()
    {
        using var tmp = new TempDirectory();
        var r = CheckpointBenchmark.Run(repetitions: 1, workDirectory: tmp.Combine("bench"));
        // Hand count: 100 000 transitions × (100 + 100 + 4 + 8 + 1) bytes = 21 300 000 bytes of replay payload;
        // the other sections and framing add ~50 kB (2 000 + 4 000 doubles of parameters/optimiser state).
        Assert.InRange(r.Bytes, 21_300_000, 21_400_000);
        Assert.True(r.WriteMs > 0);
        var m = r.ToMetrics();
        Assert.Equal(r.WriteMs, m["checkpoint_write_ms_100k_transitions"]);
        Assert.Equal(r.Bytes, m["checkpoint_bytes_100k_transitions"]);
        Assert.False(Directory.Exists(tmp.Combine("bench"))); // cleans up after itself
    }

    [Fact]
    public void SyntheticReplayRoundTripsThroughACheckpoint()
    {
        using var tmp = new TempDirectory();
        var replay = CheckpointBenchmark.SyntheticReplay.Create(1_000, 100, seed: 3);
        string path = new CheckpointWriter().AddSection(CheckpointSections.Trainer, replay.Write)
            .Save(tmp.Path, 1, new CheckpointHeader { TrainerKind = "deep-q", ConfigHash = "x" }, null);
        using var reader = CheckpointReader.Open(path);
        using var s = reader.GetSection(CheckpointSections.Trainer);
        var back = CheckpointBenchmark.SyntheticReplay.Read(s);
        Assert.Equal(replay.Observations, back.Observations);
        Assert.Equal(replay.NextObservations, back.NextObservations);
        Assert.Equal(replay.Actions, back.Actions);
        Assert.Equal(replay.Rewards, back.Rewards);
        Assert.Equal(replay.Flags, back.Flags);
        Assert.Equal(replay.Cursor, back.Cursor);
        Assert.Equal(1_000, replay.Observations.Count(b => b == 1)); // exactly one hot feature per observation
    }
}
