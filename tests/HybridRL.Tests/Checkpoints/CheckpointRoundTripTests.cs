using HybridRL.Tests.Support;
using HybridRL.Training;
using HybridRL.Checkpoints;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Tests.Checkpoints;

public class CheckpointRoundTripTests
{
    private sealed class ToyEnvironment : IStateful
    {
        public int Position;
        public double Velocity;
        public RandomStream Noise = new(3);

        public void Save(BinaryWriter w)
        {
            w.Write(Position);
            w.Write(Velocity);
            w.WriteRandomStream(Noise);
        }

        public void Load(BinaryReader r)
        {
            Position = r.ReadInt32();
            Velocity = r.ReadDouble();
            r.ReadRandomStreamInto(Noise);
        }
    }

    private static CheckpointHeader Header => new() { TrainerKind = "deep-q", ConfigHash = "a1b2c3d4e5f60718" };

    [Fact]
    public void AllSectionKindsRoundTripExactly()
    {
        using var tmp = new TempDirectory();
        var rng = RandomStream.FromRoot(11, "test");
        var parameters = new double[1_000];
        for (int i = 0; i < parameters.Length; i++) parameters[i] = rng.NextGaussian();
        parameters[0] = double.NegativeZero; parameters[1] = double.NaN; parameters[2] = double.Epsilon;
        var singles = new float[] { 1.5f, -0.0f, float.MaxValue, float.NaN };
        var words = new ulong[] { 0, 1, ulong.MaxValue, 0x0123456789ABCDEF };
        var ints = new int[] { int.MinValue, -1, 0, 7, int.MaxValue };
        var longs = new long[] { long.MinValue, 42, long.MaxValue };
        var bytes = new byte[300_000];
        for (int i = 0; i < bytes.Length; i++) bytes[i] = (byte)(rng.NextUInt64() >> 56);

        // random streams advanced to a non-trivial state, one with a cached Gaussian spare
        var exploration = RandomStream.FromRoot(5, "exploration");
        var replay = RandomStream.FromRoot(5, "replay");
        for (int i = 0; i < 17; i++) exploration.NextDouble();
        replay.NextGaussian();
        var streams = new List<KeyValuePair<string, RandomStream>> { new("exploration", exploration), new("replay", replay) };

        var envs = new[] { new ToyEnvironment { Position = 3, Velocity = -0.25 }, new ToyEnvironment { Position = -9, Velocity = 1e-300 } };
        envs[1].Noise.NextUInt64();
        var counters = new TrainingCounters { EnvSteps = 123_456, Episodes = 789, Updates = 3_000, Generations = 0, CircuitExecutions = 1L << 40, Shots = 5, HardwareExecutions = 6, WallSeconds = 12.75, MetricsRows = 31 };
        var created = new DateTime(2025, 3, 4, 5, 6, 7, DateTimeKind.Utc);

        var writer = new CheckpointWriter()
            .AddSection(CheckpointSections.Parameters, w => w.WriteDoubles(parameters))
            .AddSection(CheckpointSections.Optimizer, w => { w.WriteSingles(singles); w.WriteUInt64s(words); w.WriteInt64s(longs); })
            .AddStreamSection(CheckpointSections.Trainer, s => { for (int o = 0; o < bytes.Length; o += 65_536) s.Write(bytes.AsSpan(o, Math.Min(65_536, bytes.Length - o))); })
            .AddSection(CheckpointSections.RandomStreams, w => w.WriteRandomStreams(streams))
            .AddSection(CheckpointSections.Environments, w => { w.Write(envs.Length); foreach (var e in envs) e.Save(w); })
            .AddSection(CheckpointSections.Counters, counters)
            .AddSection("ints", w => w.WriteInt32s(ints))
            .AddSection("raw", new byte[] { 9, 8, 7 })
            .AddSection("empty", _ => { });
        using (var extra = writer.BeginSection("small-buffered")) extra.Write("hello"u8);

        string path = writer.Save(tmp.Path, 4_200, Header with { CreatedUtc = created }, 0.5);
        Assert.Equal(Path.Combine(tmp.Path, "ckpt-000000004200.hrlc"), path);

        using var r = CheckpointReader.Open(path);
        Assert.Equal(CheckpointFormat.MagicText, r.Header.Magic);
        Assert.Equal(2, r.Header.FormatVersion);
        Assert.Equal("deep-q", r.Header.TrainerKind);
        Assert.Equal("a1b2c3d4e5f60718", r.Header.ConfigHash);
        Assert.Equal(created, r.Header.CreatedUtc);
        Assert.Equal(DateTimeKind.Utc, r.Header.CreatedUtc.Kind);
        Assert.Equal(4_200, r.Header.Step);
        Assert.Equal(0.5, r.Header.Score);
        Assert.Equal(["parameters", "optimizer", "trainer", "random-streams", "environments", "counters", "ints", "raw", "empty", "small-buffered"], r.Sections.Select(s => s.Name));

        using (var p = r.GetSection(CheckpointSections.Parameters))
        {
            double[] back = p.ReadDoubles();
            Assert.Equal(parameters.Select(BitConverter.DoubleToInt64Bits), back.Select(BitConverter.DoubleToInt64Bits)); // bit-exact, incl. -0 and NaN
        }
        using (var o = r.GetSection(CheckpointSections.Optimizer))
        {
            var s2 = new float[singles.Length];
            o.ReadSingles(s2);
            Assert.Equal(singles.Select(BitConverter.SingleToInt32Bits), s2.Select(BitConverter.SingleToInt32Bits));
            Assert.Equal(words, o.ReadUInt64s());
            Assert.Equal(longs, o.ReadInt64s());
        }
        Assert.Equal(bytes, r.ReadSectionBytes(CheckpointSections.Trainer).ToArray());

        var exploration2 = new RandomStream(1);
        var replay2 = new RandomStream(2);
        using (var s = r.GetSection(CheckpointSections.RandomStreams))
            s.ReadRandomStreamsInto(new Dictionary<string, RandomStream> { ["replay"] = replay2, ["exploration"] = exploration2 });
        for (int i = 0; i < 10; i++) Assert.Equal(exploration.NextUInt64(), exploration2.NextUInt64());
        Assert.Equal(replay.NextGaussian(), replay2.NextGaussian()); // the cached spare is part of the state

        using (var e = r.GetSection(CheckpointSections.Environments))
        {
            int n = e.ReadInt32();
            Assert.Equal(2, n);
            for (int i = 0; i < n; i++)
            {
                var copy = new ToyEnvironment();
                copy.Load(e);
                Assert.Equal(envs[i].Position, copy.Position);
                Assert.Equal(envs[i].Velocity, copy.Velocity);
                Assert.Equal(envs[i].Noise.NextUInt64(), copy.Noise.NextUInt64());
            }
        }

        var c2 = new TrainingCounters();
        r.Load(CheckpointSections.Counters, c2);
        Assert.Equal((counters.EnvSteps, counters.Episodes, counters.Updates, counters.Generations, counters.CircuitExecutions, counters.Shots, counters.HardwareExecutions, counters.WallSeconds, counters.MetricsRows),
                     (c2.EnvSteps, c2.Episodes, c2.Updates, c2.Generations, c2.CircuitExecutions, c2.Shots, c2.HardwareExecutions, c2.WallSeconds, c2.MetricsRows));

        using (var i2 = r.GetSection("ints")) Assert.Equal(ints, i2.ReadInt32s());
        Assert.Equal(new byte[] { 9, 8, 7 }, r.ReadSectionBytes("raw").ToArray());
        Assert.Equal(0, r.ReadSectionBytes("empty").Length);
        Assert.Equal("hello"u8.ToArray(), r.ReadSectionBytes("small-buffered").ToArray());
        Assert.True(r.HasSection("raw"));
        Assert.False(r.HasSection("missing"));
        var ex = Assert.Throws<KeyNotFoundException>(() => r.GetSection("missing"));
        Assert.Contains("missing", ex.Message);
    }

    [Fact]
    public void LoadRejectsAReaderThatLeavesBytesUnread()
    {
        using var tmp = new TempDirectory();
        string path = new CheckpointWriter().AddSection("counters", w => { new TrainingCounters().Save(w); w.Write(1); }).Save(tmp.Path, 1, Header, null);
        using var r = CheckpointReader.Open(path);
        var ex = Assert.Throws<InvalidDataException>(() => r.Load("counters", new TrainingCounters()));
        Assert.Contains("4 unread bytes", ex.Message);
    }

    [Fact]
    public void RandomStreamsMustMatchByName()
    {
        using var tmp = new TempDirectory();
        var streams = new List<KeyValuePair<string, RandomStream>> { new("a", new RandomStream(1)) };
        string path = new CheckpointWriter().AddSection("rs", w => w.WriteRandomStreams(streams)).Save(tmp.Path, 1, Header, null);
        using var r = CheckpointReader.Open(path);
        using (var s = r.GetSection("rs"))
        {
            var ex = Assert.Throws<InvalidDataException>(() => s.ReadRandomStreamsInto(new Dictionary<string, RandomStream> { ["a"] = new(2), ["b"] = new(3) }));
            Assert.Contains("'b'", ex.Message);
        }
    }

    [Fact]
    public void DuplicateSectionNamesAreRefused()
    {
        var w = new CheckpointWriter().AddSection("x", _ => { });
        Assert.Throws<ArgumentException>(() => w.AddSection("x", _ => { }));
    }

    [Fact]
    public void FailingSectionWriterLeavesNoFileAndNamesTheSection()
    {
        using var tmp = new TempDirectory();
        var w = new CheckpointWriter().AddSection("good", b => b.Write(1)).AddSection("bad", _ => throw new InvalidOperationException("boom"));
        var ex = Assert.Throws<IOException>(() => w.Save(tmp.Path, 1, Header, null));
        Assert.Contains("'bad'", ex.Message);
        Assert.Empty(Directory.GetFiles(tmp.Path));
    }
}
