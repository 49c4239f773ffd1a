using HybridRL.Quantum.Randomness;

namespace HybridRL.Environments;

/// <summary>Shared pieces of the environment state format: a header (kind name, version) and random-stream words.</summary>
internal static class StateFormat
{
    public static void WriteHeader(BinaryWriter w, string name, int version)
    {
        w.Write(name);
        w.Write(version);
    }

    public static void ReadHeader(BinaryReader r, string name, int version)
    {
        string got = r.ReadString();
        int v = r.ReadInt32();
        if (got != name || v != version)
            throw new InvalidDataException($"environment state was written by '{got}' (format {v}), expected '{name}' (format {version})");
    }

    public static void WriteRandom(BinaryWriter w, RandomStream? rng)
    {
        w.Write(rng is not null);
        if (rng is null) return;
        Span<ulong> s = stackalloc ulong[RandomStream.StateWords];
        rng.GetState(s);
        foreach (var x in s) w.Write(x);
    }

    public static RandomStream? ReadRandom(BinaryReader r, RandomStream? existing)
    {
        if (!r.ReadBoolean()) return null;
        Span<ulong> s = stackalloc ulong[RandomStream.StateWords];
        for (int i = 0; i < s.Length; i++) s[i] = r.ReadUInt64();
        if (existing is null) return RandomStream.FromState(s);
        existing.SetState(s);
        return existing;
    }

    public static void CheckBuffer(Span<double> observation, int size, string name)
    {
        if (observation.Length < size)
            throw new ArgumentException($"observation buffer of '{name}' needs {size} entries, got {observation.Length}", nameof(observation));
    }
}
