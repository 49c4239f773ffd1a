using System.Runtime.InteropServices;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Training.DeepQ;

/// <summary>
/// Fixed-capacity ring buffer of transitions with uniform sampling (Mnih et al. 2015).
/// Binary observations (one-hot maps, bit strings) are stored as one byte per feature;
/// continuous ones as doubles, so replayed inputs are exactly what the agent saw.
/// Terminal and truncated are stored separately: only a terminal transition stops bootstrapping.
/// </summary>
public sealed class ReplayBuffer
{
    private readonly int _obs;
    private readonly bool _binary;
    private readonly byte[]? _stateBytes, _nextBytes;
    private readonly double[]? _stateDoubles, _nextDoubles;
    private readonly int[] _actions;
    private readonly double[] _rewards;
    private readonly byte[] _terminal;
    private int _cursor;
    private int _count;

    public ReplayBuffer(int capacity, int observationSize, bool binaryObservations)
    {
        if (capacity <= 0) throw new ArgumentOutOfRangeException(nameof(capacity), capacity, "trainer.replay_capacity must be positive");
        if (observationSize <= 0) throw new ArgumentOutOfRangeException(nameof(observationSize));
        Capacity = capacity;
        _obs = observationSize;
        _binary = binaryObservations;
        long cells = (long)capacity * observationSize;
        if (binaryObservations)
        {
            _stateBytes = new byte[cells];
            _nextBytes = new byte[cells];
        }
        else
        {
            _stateDoubles = new double[cells];
            _nextDoubles = new double[cells];
        }
        _actions = new int[capacity];
        _rewards = new double[capacity];
        _terminal = new byte[capacity];
    }

    public int Capacity { get; }
    public int Count => _count;
    public int ObservationSize => _obs;
    public bool BinaryObservations => _binary;

    /// <summary>Bytes one stored transition takes (for memory estimates).</summary>
    public static long BytesPerTransition(int observationSize, bool binary) =>
        2L * observationSize * (binary ? 1 : sizeof(double)) + sizeof(int) + sizeof(double) + 1;

    public void Add(ReadOnlySpan<double> state, int action, double reward, ReadOnlySpan<double> nextState, bool terminal)
    {
        int i = _cursor;
        int off = i * _obs;
        if (_binary)
        {
            Pack(state, _stateBytes.AsSpan(off, _obs));
            Pack(nextState, _nextBytes.AsSpan(off, _obs));
        }
        else
        {
            state.CopyTo(_stateDoubles.AsSpan(off, _obs));
            nextState.CopyTo(_nextDoubles.AsSpan(off, _obs));
        }
        _actions[i] = action;
        _rewards[i] = reward;
        _terminal[i] = terminal ? (byte)1 : (byte)0;
        _cursor = (i + 1) % Capacity;
        if (_count < Capacity) _count++;
    }

    private static void Pack(ReadOnlySpan<double> src, Span<byte> dst)
    {
        for (int k = 0; k < src.Length; k++)
        {
            double v = src[k];
            if (v != 0.0 && v != 1.0) throw new InvalidOperationException($"observation feature {k} = {v} is not binary; the environment declared binary observations");
            dst[k] = (byte)v;
        }
    }

    /// <summary>Draws <paramref name="batch"/> indices uniformly with replacement and copies the transitions out.</summary>
    public void Sample(RandomStream rng, int batch, Span<double> states, Span<int> actions, Span<double> rewards, Span<double> nextStates, Span<bool> terminal)
    {
        if (_count == 0) throw new InvalidOperationException("replay buffer is empty");
        for (int b = 0; b < batch; b++)
        {
            int i = rng.NextInt(_count);
            int off = i * _obs;
            var s = states.Slice(b * _obs, _obs);
            var n = nextStates.Slice(b * _obs, _obs);
            if (_binary)
            {
                var sb = _stateBytes.AsSpan(off, _obs);
                var nb = _nextBytes.AsSpan(off, _obs);
                for (int k = 0; k < _obs; k++)
                {
                    s[k] = sb[k];
                    n[k] = nb[k];
                }
            }
            else
            {
                _stateDoubles.AsSpan(off, _obs).CopyTo(s);
                _nextDoubles.AsSpan(off, _obs).CopyTo(n);
            }
            actions[b] = _actions[i];
            rewards[b] = _rewards[i];
            terminal[b] = _terminal[i] != 0;
        }
    }

    /// <summary>Writes cursor, count and the filled part of every array.</summary>
    public void Save(BinaryWriter w)
    {
        w.Write(Capacity);
        w.Write(_obs);
        w.Write(_binary);
        w.Write(_cursor);
        w.Write(_count);
        int cells = _count * _obs;
        if (_binary)
        {
            w.Write(_stateBytes.AsSpan(0, cells));
            w.Write(_nextBytes.AsSpan(0, cells));
        }
        else
        {
            w.Write(MemoryMarshal.AsBytes(_stateDoubles.AsSpan(0, cells)));
            w.Write(MemoryMarshal.AsBytes(_nextDoubles.AsSpan(0, cells)));
        }
        w.Write(MemoryMarshal.AsBytes(_actions.AsSpan(0, _count)));
        w.Write(MemoryMarshal.AsBytes(_rewards.AsSpan(0, _count)));
        w.Write(_terminal.AsSpan(0, _count));
    }

    public void Load(BinaryReader r)
    {
        int capacity = r.ReadInt32(), obs = r.ReadInt32();
        bool binary = r.ReadBoolean();
        if (capacity != Capacity || obs != _obs || binary != _binary)
            throw new InvalidDataException($"replay buffer in checkpoint has capacity {capacity}, observation size {obs}, binary {binary}; this run expects {Capacity}, {_obs}, {_binary}");
        _cursor = r.ReadInt32();
        _count = r.ReadInt32();
        if (_count < 0 || _count > Capacity || _cursor < 0 || _cursor >= Capacity)
            throw new InvalidDataException($"replay buffer cursor {_cursor} / count {_count} out of range");
        int cells = _count * _obs;
        if (_binary)
        {
            ReadExactly(r, _stateBytes.AsSpan(0, cells));
            ReadExactly(r, _nextBytes.AsSpan(0, cells));
        }
        else
        {
            ReadExactly(r, MemoryMarshal.AsBytes(_stateDoubles.AsSpan(0, cells)));
            ReadExactly(r, MemoryMarshal.AsBytes(_nextDoubles.AsSpan(0, cells)));
        }
        ReadExactly(r, MemoryMarshal.AsBytes(_actions.AsSpan(0, _count)));
        ReadExactly(r, MemoryMarshal.AsBytes(_rewards.AsSpan(0, _count)));
        ReadExactly(r, _terminal.AsSpan(0, _count));
    }

    private static void ReadExactly(BinaryReader r, Span<byte> dst) => r.BaseStream.ReadExactly(dst);
}
