using HybridRL.Quantum.Randomness;

namespace HybridRL.Environments;

/// <summary>
/// N copies of one task stepped together. Copy i draws its episode seeds from its own stream
/// (<c>RandomStream.SeedFor(root, "environment-copy", i)</c>), so results do not depend on how many copies run or in
/// which order. Observations of all copies live in one row-major buffer (<see cref="Observations"/>). With auto-reset,
/// a copy whose episode ended is reset at once: its row then holds the new episode's first observation and
/// <see cref="FinalObservation"/> holds the observation that ended the episode (needed to bootstrap a truncated step).
/// </summary>
public sealed class VectorEnvironment : IDisposable
{
    private const int FormatVersion = 1;
    private readonly IEnvironment[] _copies;
    private readonly RandomStream[] _seedStreams;
    private readonly double[] _observations;
    private readonly double[] _final;
    private readonly bool[] _needsReset;
    private readonly double[] _episodeReturn;
    private readonly int[] _episodeLength;

    /// <param name="factory">Builds copy i (each a separate instance).</param>
    public VectorEnvironment(int count, Func<int, IEnvironment> factory, bool autoReset = true)
    {
        if (count < 1) throw new ArgumentOutOfRangeException(nameof(count), count, "need at least one copy");
        ArgumentNullException.ThrowIfNull(factory);
        _copies = new IEnvironment[count];
        for (int i = 0; i < count; i++) _copies[i] = factory(i);
        ObservationSize = _copies[0].ObservationSize;
        ActionCount = _copies[0].ActionCount;
        for (int i = 1; i < count; i++)
            if (_copies[i].ObservationSize != ObservationSize || _copies[i].ActionCount != ActionCount)
                throw new ArgumentException($"copy {i} has a different observation size or action count than copy 0", nameof(factory));
        AutoReset = autoReset;
        _seedStreams = new RandomStream[count];
        for (int i = 0; i < count; i++) _seedStreams[i] = new RandomStream(0);
        _observations = new double[count * ObservationSize];
        _final = new double[count * ObservationSize];
        _needsReset = new bool[count];
        _episodeReturn = new double[count];
        _episodeLength = new int[count];
        LastEpisodeReturns = new double[count];
        LastEpisodeLengths = new int[count];
    }

    /// <summary>Copies built from settings (e.g. <see cref="EnvironmentFactory.Parse(string, IReadOnlyDictionary{string, string})"/>).</summary>
    public VectorEnvironment(int count, EnvironmentSettings settings, bool autoReset = true) : this(count, _ => settings.CreateEnvironment(), autoReset) { }

    public int Count => _copies.Length;
    public int ObservationSize { get; }
    public int ActionCount { get; }
    public bool AutoReset { get; }
    public bool SupportsStateSave => _copies.All(c => c.SupportsStateSave);
    public IEnvironment this[int copy] => _copies[copy];

    /// <summary>Current observations, row-major: copy i occupies [i * ObservationSize, (i + 1) * ObservationSize).</summary>
    public ReadOnlySpan<double> Observations => _observations;

    public ReadOnlySpan<double> Observation(int copy) => _observations.AsSpan(copy * ObservationSize, ObservationSize);

    /// <summary>The observation that ended copy i's last finished episode (valid after a step reported Done, with auto-reset).</summary>
    public ReadOnlySpan<double> FinalObservation(int copy) => _final.AsSpan(copy * ObservationSize, ObservationSize);

    /// <summary>Undiscounted return and length of each copy's most recently finished episode.</summary>
    public double[] LastEpisodeReturns { get; }
    public int[] LastEpisodeLengths { get; }

    /// <summary>Number of episodes finished over all copies since <see cref="Reset"/>.</summary>
    public long CompletedEpisodes { get; private set; }

    /// <summary>Seeds every copy's episode stream from <paramref name="rootSeed"/> and starts an episode in each.</summary>
    public void Reset(ulong rootSeed)
    {
        for (int i = 0; i < Count; i++)
        {
            _seedStreams[i] = new RandomStream(RandomStream.SeedFor(rootSeed, "environment-copy", i));
            ResetCopy(i);
        }
        CompletedEpisodes = 0;
    }

    private void ResetCopy(int i)
    {
        _copies[i].Reset(_seedStreams[i].NextUInt64(), _observations.AsSpan(i * ObservationSize, ObservationSize));
        _needsReset[i] = false;
        _episodeReturn[i] = 0;
        _episodeLength[i] = 0;
    }

    /// <summary>Steps every copy with its action. Without auto-reset, a finished copy must be reset with <see cref="ResetFinished"/>.</summary>
    public void Step(ReadOnlySpan<int> actions, Span<StepResult> results)
    {
        if (actions.Length != Count) throw new ArgumentException($"need {Count} actions, got {actions.Length}", nameof(actions));
        if (results.Length < Count) throw new ArgumentException($"need room for {Count} results, got {results.Length}", nameof(results));
        for (int i = 0; i < Count; i++)
        {
            if (_needsReset[i]) throw new InvalidOperationException($"environment copy {i} finished its episode; call ResetFinished (or use auto-reset)");
            var row = _observations.AsSpan(i * ObservationSize, ObservationSize);
            var r = _copies[i].Step(actions[i], row);
            results[i] = r;
            _episodeReturn[i] += r.Reward;
            _episodeLength[i]++;
            if (!r.Done) continue;
            row.CopyTo(_final.AsSpan(i * ObservationSize, ObservationSize));
            LastEpisodeReturns[i] = _episodeReturn[i];
            LastEpisodeLengths[i] = _episodeLength[i];
            CompletedEpisodes++;
            if (AutoReset) ResetCopy(i);
            else _needsReset[i] = true;
        }
    }

    /// <summary>Resets every copy whose episode has finished (for use without auto-reset).</summary>
    public void ResetFinished()
    {
        for (int i = 0; i < Count; i++)
            if (_needsReset[i]) ResetCopy(i);
    }

    /// <summary>Writes every copy's state, its seed stream, the observation buffers and the episode counters.</summary>
    public void SaveState(BinaryWriter writer)
    {
        StateFormat.WriteHeader(writer, "vector-environment", FormatVersion);
        writer.Write(Count);
        writer.Write(ObservationSize);
        writer.Write(CompletedEpisodes);
        for (int i = 0; i < Count; i++)
        {
            StateFormat.WriteRandom(writer, _seedStreams[i]);
            writer.Write(_needsReset[i]);
            writer.Write(_episodeReturn[i]);
            writer.Write(_episodeLength[i]);
            writer.Write(LastEpisodeReturns[i]);
            writer.Write(LastEpisodeLengths[i]);
            _copies[i].SaveState(writer);
        }
        foreach (var v in _observations) writer.Write(v);
        foreach (var v in _final) writer.Write(v);
    }

    public void LoadState(BinaryReader reader)
    {
        StateFormat.ReadHeader(reader, "vector-environment", FormatVersion);
        int count = reader.ReadInt32();
        int size = reader.ReadInt32();
        if (count != Count || size != ObservationSize)
            throw new InvalidDataException($"saved vector environment has {count} copies of observation size {size}; this one has {Count} of size {ObservationSize}");
        CompletedEpisodes = reader.ReadInt64();
        for (int i = 0; i < Count; i++)
        {
            _seedStreams[i] = StateFormat.ReadRandom(reader, _seedStreams[i]) ?? throw new InvalidDataException("missing seed stream");
            _needsReset[i] = reader.ReadBoolean();
            _episodeReturn[i] = reader.ReadDouble();
            _episodeLength[i] = reader.ReadInt32();
            LastEpisodeReturns[i] = reader.ReadDouble();
            LastEpisodeLengths[i] = reader.ReadInt32();
            _copies[i].LoadState(reader);
        }
        for (int i = 0; i < _observations.Length; i++) _observations[i] = reader.ReadDouble();
        for (int i = 0; i < _final.Length; i++) _final[i] = reader.ReadDouble();
    }

    public void Dispose()
    {
        foreach (var c in _copies) c.Dispose();
    }
}
