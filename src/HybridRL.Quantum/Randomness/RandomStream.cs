using System.Runtime.CompilerServices;

namespace HybridRL.Quantum.Randomness;

/// <summary>
/// A seeded, checkpointable pseudo-random stream: xoshiro256** (Blackman &amp; Vigna 2018),
/// seeded through SplitMix64. The whole state is four 64-bit words plus a cached Gaussian,
/// so it can be written to a checkpoint and restored exactly.
/// Independent streams for components are derived from one root seed by name
/// (<see cref="Derive(string)"/>), so adding a stream never shifts another.
/// </summary>
public sealed class RandomStream
{
    private ulong _s0, _s1, _s2, _s3;
    private bool _hasSpare;
    private double _spare;

    /// <summary>Number of 64-bit words in <see cref="GetState"/>.</summary>
    public const int StateWords = 6;

    public RandomStream(ulong seed)
    {
        ulong x = seed;
        _s0 = SplitMix64(ref x);
        _s1 = SplitMix64(ref x);
        _s2 = SplitMix64(ref x);
        _s3 = SplitMix64(ref x);
        if ((_s0 | _s1 | _s2 | _s3) == 0) _s0 = 1;
    }

    private RandomStream() { }

    /// <summary>Re-seeds this stream in place, exactly as <c>new RandomStream(seed)</c> would (no allocation).</summary>
    public void Reseed(ulong seed)
    {
        ulong x = seed;
        _s0 = SplitMix64(ref x);
        _s1 = SplitMix64(ref x);
        _s2 = SplitMix64(ref x);
        _s3 = SplitMix64(ref x);
        if ((_s0 | _s1 | _s2 | _s3) == 0) _s0 = 1;
        _hasSpare = false;
        _spare = 0;
    }

    /// <summary>A stream whose seed is a stable hash of this stream's seed material and a name.</summary>
    public static RandomStream FromRoot(ulong rootSeed, string name) => new(Mix(rootSeed, name));

    /// <summary>Derives an independent child stream from the current state and a name, without advancing this stream.</summary>
    public RandomStream Derive(string name) => new(Mix(_s0 ^ RotateLeft(_s1, 17) ^ RotateLeft(_s2, 31) ^ RotateLeft(_s3, 47), name));

    /// <summary>Derives an independent child stream for an integer key (e.g. an environment copy index).</summary>
    public static ulong SeedFor(ulong rootSeed, string name, long index) => Mix(Mix(rootSeed, name) ^ (ulong)index * 0x9E3779B97F4A7C15UL, "#");

    private static ulong Mix(ulong seed, string name)
    {
        // FNV-1a over the name, folded with the seed through SplitMix64: stable across runs and platforms.
        ulong h = 0xcbf29ce484222325UL;
        foreach (char c in name)
        {
            h ^= c;
            h *= 0x100000001b3UL;
        }
        ulong x = seed ^ h;
        return SplitMix64(ref x);
    }

    private static ulong SplitMix64(ref ulong x)
    {
        ulong z = x += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static ulong RotateLeft(ulong x, int k) => (x << k) | (x >> (64 - k));

    /// <summary>Next raw 64-bit value.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public ulong NextUInt64()
    {
        ulong result = RotateLeft(_s1 * 5, 7) * 9;
        ulong t = _s1 << 17;
        _s2 ^= _s0;
        _s3 ^= _s1;
        _s1 ^= _s2;
        _s0 ^= _s3;
        _s2 ^= t;
        _s3 = RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>Uniform double in [0, 1) with 53 random bits.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double NextDouble() => (NextUInt64() >> 11) * (1.0 / 9007199254740992.0);

    /// <summary>Uniform integer in [0, n) without modulo bias (Lemire's method).</summary>
    public int NextInt(int n)
    {
        if (n <= 0) throw new ArgumentOutOfRangeException(nameof(n), n, "upper bound must be positive");
        ulong m = (ulong)n;
        while (true)
        {
            ulong r = NextUInt64();
            UInt128 prod = (UInt128)r * m;
            ulong low = (ulong)prod;
            if (low >= m || low >= (0UL - m) % m)
                return (int)(prod >> 64);
        }
    }

    /// <summary>Standard normal deviate (Marsaglia polar method; the spare value is part of the state).</summary>
    public double NextGaussian()
    {
        if (_hasSpare)
        {
            _hasSpare = false;
            return _spare;
        }
        double u, v, s;
        do
        {
            u = 2.0 * NextDouble() - 1.0;
            v = 2.0 * NextDouble() - 1.0;
            s = u * u + v * v;
        } while (s >= 1.0 || s == 0.0);
        double f = Math.Sqrt(-2.0 * Math.Log(s) / s);
        _spare = v * f;
        _hasSpare = true;
        return u * f;
    }

    /// <summary>Writes the full state (see <see cref="StateWords"/>).</summary>
    public void GetState(Span<ulong> state)
    {
        if (state.Length < StateWords) throw new ArgumentException($"state needs {StateWords} words", nameof(state));
        state[0] = _s0; state[1] = _s1; state[2] = _s2; state[3] = _s3;
        state[4] = _hasSpare ? 1UL : 0UL;
        state[5] = BitConverter.DoubleToUInt64Bits(_spare);
    }

    public ulong[] GetState()
    {
        var s = new ulong[StateWords];
        GetState(s);
        return s;
    }

    /// <summary>Restores a state written by <see cref="GetState(Span{ulong})"/>.</summary>
    public void SetState(ReadOnlySpan<ulong> state)
    {
        if (state.Length < StateWords) throw new ArgumentException($"state needs {StateWords} words", nameof(state));
        if ((state[0] | state[1] | state[2] | state[3]) == 0) throw new ArgumentException("all-zero generator state is invalid", nameof(state));
        _s0 = state[0]; _s1 = state[1]; _s2 = state[2]; _s3 = state[3];
        _hasSpare = state[4] != 0;
        _spare = BitConverter.UInt64BitsToDouble(state[5]);
    }

    public static RandomStream FromState(ReadOnlySpan<ulong> state)
    {
        var r = new RandomStream();
        r.SetState(state);
        return r;
    }
}
