using System.Buffers.Binary;
using System.Runtime.InteropServices;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Checkpoints;

/// <summary>
/// Fast helpers for checkpoint sections. Arrays are written as an <c>int64</c> element count followed by
/// the raw little-endian elements (one bulk copy via <see cref="MemoryMarshal.AsBytes{T}(Span{T})"/>; on a
/// big-endian machine elements are byte-swapped one at a time). Random streams are written as their
/// <see cref="RandomStream.StateWords"/> state words.
/// </summary>
public static class StateBinaryExtensions
{
    private const int SwapChunk = 4096;

    public static void WriteDoubles(this BinaryWriter w, ReadOnlySpan<double> values) => WriteArray(w, values);
    public static void WriteSingles(this BinaryWriter w, ReadOnlySpan<float> values) => WriteArray(w, values);
    public static void WriteUInt64s(this BinaryWriter w, ReadOnlySpan<ulong> values) => WriteArray(w, values);
    public static void WriteInt64s(this BinaryWriter w, ReadOnlySpan<long> values) => WriteArray(w, values);
    public static void WriteInt32s(this BinaryWriter w, ReadOnlySpan<int> values) => WriteArray(w, values);
    public static void WriteByteArray(this BinaryWriter w, ReadOnlySpan<byte> values) => WriteArray(w, values);

    public static double[] ReadDoubles(this BinaryReader r) => ReadArray<double>(r);
    public static float[] ReadSingles(this BinaryReader r) => ReadArray<float>(r);
    public static ulong[] ReadUInt64s(this BinaryReader r) => ReadArray<ulong>(r);
    public static long[] ReadInt64s(this BinaryReader r) => ReadArray<long>(r);
    public static int[] ReadInt32s(this BinaryReader r) => ReadArray<int>(r);
    public static byte[] ReadByteArray(this BinaryReader r) => ReadArray<byte>(r);

    /// <summary>Reads an array written by the matching Write method into <paramref name="destination"/>, whose length must equal the stored count.</summary>
    public static void ReadDoubles(this BinaryReader r, Span<double> destination) => ReadArrayInto(r, destination);
    public static void ReadSingles(this BinaryReader r, Span<float> destination) => ReadArrayInto(r, destination);
    public static void ReadUInt64s(this BinaryReader r, Span<ulong> destination) => ReadArrayInto(r, destination);
    public static void ReadInt64s(this BinaryReader r, Span<long> destination) => ReadArrayInto(r, destination);
    public static void ReadInt32s(this BinaryReader r, Span<int> destination) => ReadArrayInto(r, destination);
    public static void ReadByteArray(this BinaryReader r, Span<byte> destination) => ReadArrayInto(r, destination);

    /// <summary>Writes a random stream's full state.</summary>
    public static void WriteRandomStream(this BinaryWriter w, RandomStream stream)
    {
        ArgumentNullException.ThrowIfNull(stream);
        Span<ulong> s = stackalloc ulong[RandomStream.StateWords];
        stream.GetState(s);
        w.Write(RandomStream.StateWords);
        WriteRaw(w, (ReadOnlySpan<ulong>)s);
    }

    /// <summary>Restores a state written by <see cref="WriteRandomStream"/> into an existing stream.</summary>
    public static void ReadRandomStreamInto(this BinaryReader r, RandomStream stream)
    {
        ArgumentNullException.ThrowIfNull(stream);
        Span<ulong> s = stackalloc ulong[RandomStream.StateWords];
        ReadRandomState(r, s);
        stream.SetState(s);
    }

    /// <summary>A new stream with a state written by <see cref="WriteRandomStream"/>.</summary>
    public static RandomStream ReadRandomStream(this BinaryReader r)
    {
        Span<ulong> s = stackalloc ulong[RandomStream.StateWords];
        ReadRandomState(r, s);
        return RandomStream.FromState(s);
    }

    /// <summary>Writes named random streams (count, then name + state for each, in the given order).</summary>
    public static void WriteRandomStreams(this BinaryWriter w, IReadOnlyList<KeyValuePair<string, RandomStream>> streams)
    {
        w.Write(streams.Count);
        foreach (var (name, stream) in streams)
        {
            w.Write(name);
            w.WriteRandomStream(stream);
        }
    }

    /// <summary>
    /// Restores named streams written by <see cref="WriteRandomStreams"/> into <paramref name="streams"/>.
    /// The stored names must be exactly the given ones (any order); a missing or extra stream is an error naming it.
    /// </summary>
    public static void ReadRandomStreamsInto(this BinaryReader r, IReadOnlyDictionary<string, RandomStream> streams)
    {
        int count = r.ReadInt32();
        if (count < 0) throw new InvalidDataException($"random stream count {count} is negative");
        var seen = new HashSet<string>(StringComparer.Ordinal);
        for (int i = 0; i < count; i++)
        {
            string name = r.ReadString();
            if (!streams.TryGetValue(name, out var target))
                throw new InvalidDataException($"checkpoint holds random stream '{name}' which this trainer does not have (it has: {string.Join(", ", streams.Keys)})");
            if (!seen.Add(name)) throw new InvalidDataException($"checkpoint holds random stream '{name}' twice");
            r.ReadRandomStreamInto(target);
        }
        foreach (string name in streams.Keys)
            if (!seen.Contains(name))
                throw new InvalidDataException($"checkpoint has no state for random stream '{name}'");
    }

    private static void ReadRandomState(BinaryReader r, Span<ulong> s)
    {
        int words = r.ReadInt32();
        if (words != RandomStream.StateWords)
            throw new InvalidDataException($"random stream state has {words} words, expected {RandomStream.StateWords}");
        ReadRaw(r, s);
    }

    private static void WriteArray<T>(BinaryWriter w, ReadOnlySpan<T> values) where T : unmanaged
    {
        w.Write((long)values.Length);
        WriteRaw(w, values);
    }

    private static T[] ReadArray<T>(BinaryReader r) where T : unmanaged
    {
        long n = ReadCount<T>(r);
        var result = GC.AllocateUninitializedArray<T>((int)n);
        ReadRaw(r, result.AsSpan());
        return result;
    }

    private static void ReadArrayInto<T>(BinaryReader r, Span<T> destination) where T : unmanaged
    {
        long n = ReadCount<T>(r);
        if (n != destination.Length)
            throw new InvalidDataException($"stored array of {typeof(T).Name} has {n} elements but the destination holds {destination.Length}");
        ReadRaw(r, destination);
    }

    private static long ReadCount<T>(BinaryReader r) where T : unmanaged
    {
        long n = r.ReadInt64();
        if (n < 0 || n > Array.MaxLength)
            throw new InvalidDataException($"stored array of {typeof(T).Name} has invalid length {n}");
        if (r.BaseStream.CanSeek && n * System.Runtime.CompilerServices.Unsafe.SizeOf<T>() > r.BaseStream.Length - r.BaseStream.Position)
            throw new InvalidDataException($"stored array of {typeof(T).Name} claims {n} elements, more than the section holds");
        return n;
    }

    private static void WriteRaw<T>(BinaryWriter w, ReadOnlySpan<T> values) where T : unmanaged
    {
        if (BitConverter.IsLittleEndian || System.Runtime.CompilerServices.Unsafe.SizeOf<T>() == 1)
        {
            w.Write(MemoryMarshal.AsBytes(values));
            return;
        }
        // Big-endian host: swap into a small scratch buffer, chunk by chunk.
        Span<T> scratch = new T[Math.Min(values.Length, SwapChunk)];
        for (int i = 0; i < values.Length; i += scratch.Length)
        {
            int n = Math.Min(scratch.Length, values.Length - i);
            values.Slice(i, n).CopyTo(scratch);
            SwapInPlace(MemoryMarshal.AsBytes(scratch[..n]), System.Runtime.CompilerServices.Unsafe.SizeOf<T>());
            w.Write(MemoryMarshal.AsBytes(scratch[..n]));
        }
    }

    private static void ReadRaw<T>(BinaryReader r, Span<T> destination) where T : unmanaged
    {
        Span<byte> bytes = MemoryMarshal.AsBytes(destination);
        int done = 0;
        while (done < bytes.Length)
        {
            int n = r.Read(bytes[done..]);
            if (n == 0) throw new EndOfStreamException($"section ended after {done} of {bytes.Length} bytes of a {typeof(T).Name} array");
            done += n;
        }
        if (!BitConverter.IsLittleEndian)
            SwapInPlace(bytes, System.Runtime.CompilerServices.Unsafe.SizeOf<T>());
    }

    private static void SwapInPlace(Span<byte> bytes, int size)
    {
        switch (size)
        {
            case 1: return;
            case 2: { var s = MemoryMarshal.Cast<byte, ushort>(bytes); BinaryPrimitives.ReverseEndianness(s, s); return; }
            case 4: { var s = MemoryMarshal.Cast<byte, uint>(bytes); BinaryPrimitives.ReverseEndianness(s, s); return; }
            case 8: { var s = MemoryMarshal.Cast<byte, ulong>(bytes); BinaryPrimitives.ReverseEndianness(s, s); return; }
            default: throw new NotSupportedException($"element size {size} is not supported");
        }
    }
}
