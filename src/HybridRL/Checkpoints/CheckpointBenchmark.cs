using HybridRL.Training;
using System.Diagnostics;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Checkpoints;

/// <summary>
/// Times a checkpoint holding a representative replay section: 100 000 transitions with 100-feature
/// one-hot observations stored as bytes (observation 100 B + next observation 100 B + action int32 +
/// reward float64 + flags byte = 213 B per transition), plus small parameter, optimiser, random-stream and
/// counter sections. The replay is synthetic (the real buffer belongs to the deep-Q trainer); it is laid
/// out column by column, which is how it is streamed: no copy of the section is made.
/// </summary>
public static class CheckpointBenchmark
{
    public const int Transitions = 100_000;
    public const int ObservationBytes = 100;

    /// <summary>Runs the benchmark in a fresh temporary directory (deleted afterwards) and returns median timings.</summary>
    public static CheckpointBenchmarkResult Run(int repetitions = 5, string? workDirectory = null)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(repetitions, 1);
        string root = workDirectory ?? Path.Combine(Path.GetTempPath(), "hybridrl-ckpt-bench-" + Guid.NewGuid().ToString("N")[..8]);
        string dir = Path.Combine(root, "checkpoints");
        Directory.CreateDirectory(dir);
        try
        {
            var replay = SyntheticReplay.Create(Transitions, ObservationBytes, seed: 20240601);
            var rng = RandomStream.FromRoot(7, "bench");
            var parameters = new double[2_000];
            for (int i = 0; i < parameters.Length; i++) parameters[i] = rng.NextGaussian();
            var moments = new double[2 * parameters.Length];
            var streams = new List<KeyValuePair<string, RandomStream>>
            {
                new("replay-sampling", RandomStream.FromRoot(7, "replay-sampling")),
                new("exploration", RandomStream.FromRoot(7, "exploration")),
            };
            var counters = new TrainingCounters { EnvSteps = Transitions, Episodes = 500, Updates = 25_000, MetricsRows = 100 };

            var writer = new CheckpointWriter()
                .AddSection(CheckpointSections.Parameters, w => w.WriteDoubles(parameters))
                .AddSection(CheckpointSections.Optimizer, w => w.WriteDoubles(moments))
                .AddSection(CheckpointSections.Trainer, replay.Write)
                .AddSection(CheckpointSections.RandomStreams, w => w.WriteRandomStreams(streams))
                .AddSection(CheckpointSections.Counters, counters);
            var header = new CheckpointHeader { TrainerKind = "benchmark", ConfigHash = "0000000000000000" };

            // warm-up (JIT, file system caches), not timed
            string path = writer.Save(dir, 0, header, null, keep: 1);

            var write = new double[repetitions];
            var read = new double[repetitions];
            var raw = new double[repetitions];
            long bytes = 0;
            for (int i = 0; i < repetitions; i++)
            {
                var sw = Stopwatch.StartNew();
                path = writer.Save(dir, i + 1, header, null, keep: 1);
                write[i] = sw.Elapsed.TotalMilliseconds;
                bytes = new FileInfo(path).Length;

                sw.Restart();
                using (var r = CheckpointReader.Open(path)) { }
                read[i] = sw.Elapsed.TotalMilliseconds;
            }

            var buffer = new byte[bytes];
            new Span<byte>(buffer).Fill(0x5A);
            for (int i = 0; i < repetitions; i++)
            {
                string rawPath = Path.Combine(root, "raw.bin");
                var sw = Stopwatch.StartNew();
                using (var fs = new FileStream(rawPath, FileMode.Create, FileAccess.Write, FileShare.None, 1 << 20))
                {
                    fs.Write(buffer);
                    fs.Flush(flushToDisk: true);
                }
                raw[i] = sw.Elapsed.TotalMilliseconds;
                File.Delete(rawPath);
            }
            return new CheckpointBenchmarkResult(Median(write), bytes, Median(read), Median(raw), repetitions);
        }
        finally
        {
            try { Directory.Delete(root, recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
        }
    }

    private static double Median(double[] values)
    {
        var s = (double[])values.Clone();
        Array.Sort(s);
        return s.Length % 2 == 1 ? s[s.Length / 2] : 0.5 * (s[s.Length / 2 - 1] + s[s.Length / 2]);
    }

    /// <summary>Column-wise synthetic replay contents of the benchmark (invented data).</summary>
    internal sealed class SyntheticReplay
    {
        public required int ObservationSize { get; init; }
        public required byte[] Observations { get; init; }
        public required byte[] NextObservations { get; init; }
        public required int[] Actions { get; init; }
        public required double[] Rewards { get; init; }
        public required byte[] Flags { get; init; }
        public int Count => Actions.Length;
        public int Cursor { get; init; }

        public static SyntheticReplay Create(int n, int obsSize, ulong seed)
        {
            var rng = RandomStream.FromRoot(seed, "synthetic-replay");
            var obs = new byte[(long)n * obsSize];
            var next = new byte[(long)n * obsSize];
            var actions = new int[n];
            var rewards = new double[n];
            var flags = new byte[n];
            for (int i = 0; i < n; i++)
            {
                obs[(long)i * obsSize + rng.NextInt(obsSize)] = 1;
                next[(long)i * obsSize + rng.NextInt(obsSize)] = 1;
                actions[i] = rng.NextInt(4);
                rewards[i] = rng.NextDouble() < 0.05 ? 1.0 : -0.01;
                flags[i] = (byte)(rng.NextDouble() < 0.02 ? 1 : 0);
            }
            return new SyntheticReplay { ObservationSize = obsSize, Observations = obs, NextObservations = next, Actions = actions, Rewards = rewards, Flags = flags, Cursor = n / 2 };
        }

        public void Write(BinaryWriter w)
        {
            w.Write(1); // layout version
            w.Write(Count);
            w.Write(Cursor);
            w.Write(ObservationSize);
            w.WriteByteArray(Observations);
            w.WriteByteArray(NextObservations);
            w.WriteInt32s(Actions);
            w.WriteDoubles(Rewards);
            w.WriteByteArray(Flags);
        }

        public static SyntheticReplay Read(BinaryReader r)
        {
            int version = r.ReadInt32();
            if (version != 1) throw new InvalidDataException($"synthetic replay layout {version}");
            r.ReadInt32();
            int cursor = r.ReadInt32();
            int obsSize = r.ReadInt32();
            return new SyntheticReplay
            {
                Cursor = cursor,
                ObservationSize = obsSize,
                Observations = r.ReadByteArray(),
                NextObservations = r.ReadByteArray(),
                Actions = r.ReadInt32s(),
                Rewards = r.ReadDoubles(),
                Flags = r.ReadByteArray(),
            };
        }
    }
}
