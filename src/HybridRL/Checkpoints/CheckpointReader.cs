using System.Buffers;
using System.Buffers.Binary;
using System.IO.Hashing;
using System.Text;
using Microsoft.Win32.SafeHandles;

namespace HybridRL.Checkpoints;

/// <summary>
/// Opens a checkpoint file and validates all of it up front: magic, version, header checksum, every
/// section's checksum and the footer (which also catches truncation at a section boundary and
/// removed or reordered sections). Any failure throws <see cref="CheckpointCorruptException"/> naming
/// the file, the section and the offset. Section payloads are then read on demand from the open file.
/// </summary>
public sealed class CheckpointReader : IDisposable
{
    private const int ChunkSize = 1 << 20;
    private static readonly UTF8Encoding Utf8 = new(false, true);

    private readonly SafeFileHandle _handle;
    private readonly Dictionary<string, CheckpointSectionInfo> _byName;

    private CheckpointReader(string path, SafeFileHandle handle, CheckpointHeader header, List<CheckpointSectionInfo> sections)
    {
        FilePath = path;
        _handle = handle;
        Header = header;
        Sections = sections;
        _byName = sections.ToDictionary(s => s.Name, StringComparer.Ordinal);
    }

    public string FilePath { get; }
    public CheckpointHeader Header { get; }
    /// <summary>Sections in file order.</summary>
    public IReadOnlyList<CheckpointSectionInfo> Sections { get; }

    /// <summary>Opens and fully validates a checkpoint.</summary>
    /// <exception cref="CheckpointCorruptException">the file is not a valid, complete checkpoint.</exception>
    /// <exception cref="FileNotFoundException">the file does not exist.</exception>
    public static CheckpointReader Open(string path)
    {
        string full = Path.GetFullPath(path);
        if (!File.Exists(full)) throw new FileNotFoundException($"checkpoint file '{full}' does not exist", full);
        var handle = File.OpenHandle(full, FileMode.Open, FileAccess.Read, FileShare.Read, FileOptions.SequentialScan);
        try
        {
            var (header, sections) = Validate(full, handle);
            return new CheckpointReader(full, handle, header, sections);
        }
        catch
        {
            handle.Dispose();
            throw;
        }
    }

    public bool HasSection(string name) => _byName.ContainsKey(name);

    /// <summary>A reader over the section's payload (UTF-8, little-endian). Dispose it when done.</summary>
    public BinaryReader GetSection(string name) => new(OpenSection(name), Utf8, leaveOpen: false);

    /// <summary>A read-only seekable stream over the section's payload.</summary>
    public Stream OpenSection(string name)
    {
        var info = Find(name);
        return new SectionReadStream(_handle, info.PayloadOffset, info.Length);
    }

    /// <summary>The whole section payload copied into memory.</summary>
    public ReadOnlyMemory<byte> ReadSectionBytes(string name)
    {
        var info = Find(name);
        if (info.Length > Array.MaxLength) throw new InvalidOperationException($"section '{name}' of '{FilePath}' is too large to load into one array; use OpenSection");
        var bytes = new byte[info.Length];
        RandomAccess.Read(_handle, bytes, info.PayloadOffset);
        return bytes;
    }

    /// <summary>Restores an <see cref="IStateful"/> part from a section and checks that it consumed the whole section.</summary>
    public void Load(string name, IStateful part)
    {
        ArgumentNullException.ThrowIfNull(part);
        using var r = GetSection(name);
        part.Load(r);
        long left = r.BaseStream.Length - r.BaseStream.Position;
        if (left != 0)
            throw new InvalidDataException($"section '{name}' of checkpoint '{FilePath}' has {left} unread bytes after loading: the reader does not match the writer");
    }

    private CheckpointSectionInfo Find(string name) =>
        _byName.TryGetValue(name, out var info)
            ? info
            : throw new KeyNotFoundException($"checkpoint '{FilePath}' has no section '{name}' (sections: {string.Join(", ", Sections.Select(s => s.Name))})");

    public void Dispose() => _handle.Dispose();

    // ------------------------------------------------------------------ validation

    private static (CheckpointHeader, List<CheckpointSectionInfo>) Validate(string path, SafeFileHandle handle)
    {
        long fileLength = RandomAccess.GetLength(handle);
        Span<byte> small = stackalloc byte[CheckpointFormat.FooterSize];

        // prefix
        if (fileLength < CheckpointFormat.PrefixSize)
            throw new CheckpointCorruptException(path, "header", 0, $"file is {fileLength} bytes, shorter than the {CheckpointFormat.PrefixSize}-byte prefix (truncated or not a checkpoint)");
        ReadExact(path, handle, small[..CheckpointFormat.PrefixSize], 0, "header", fileLength);
        if (!small[..8].SequenceEqual(CheckpointFormat.Magic))
            throw new CheckpointCorruptException(path, "header", 0, $"bad magic bytes {Convert.ToHexString(small[..8])} (expected \"{CheckpointFormat.MagicText}\"): not a HybridRL checkpoint");
        uint version = BinaryPrimitives.ReadUInt32LittleEndian(small[8..]);
        // Version 1 (earlier builds) had the same layout with XxHash3 checksums; its files cannot be verified here.
        if (version != CheckpointFormat.CurrentVersion)
            throw new CheckpointCorruptException(path, "header", 8, $"format version {version} is not supported (this program reads version {CheckpointFormat.CurrentVersion}{(version == 1 ? "; version 1 files come from an earlier build, whose checksums were XxHash3" : "")})");
        uint bodyLength = BinaryPrimitives.ReadUInt32LittleEndian(small[12..]);
        if (bodyLength > CheckpointFormat.MaxHeaderBodySize)
            throw new CheckpointCorruptException(path, "header", 12, $"header length {bodyLength} exceeds the limit of {CheckpointFormat.MaxHeaderBodySize} bytes");
        long headerEnd = CheckpointFormat.PrefixSize + bodyLength + 8;
        if (headerEnd > fileLength)
            throw new CheckpointCorruptException(path, "header", 0, $"truncated: header needs {headerEnd} bytes but the file ends at {fileLength}");

        var headerBytes = new byte[CheckpointFormat.PrefixSize + bodyLength];
        ReadExact(path, handle, headerBytes, 0, "header", fileLength);
        ReadExact(path, handle, small[..8], headerBytes.Length, "header", fileLength);
        ulong storedHeaderHash = BinaryPrimitives.ReadUInt64LittleEndian(small);
        ulong headerHash = XxHash64.HashToUInt64(headerBytes);
        if (storedHeaderHash != headerHash)
            throw new CheckpointCorruptException(path, "header", 0, "header checksum mismatch", storedHeaderHash, headerHash);
        var header = DecodeHeaderBody(path, headerBytes.AsSpan(CheckpointFormat.PrefixSize), (int)version);

        var chain = new XxHash64();
        chain.Append(small[..8]);

        // sections, then footer
        var sections = new List<CheckpointSectionInfo>();
        var names = new HashSet<string>(StringComparer.Ordinal);
        var hash = new XxHash64();
        byte[] chunk = ArrayPool<byte>.Shared.Rent(ChunkSize);
        try
        {
            long pos = headerEnd;
            while (true)
            {
                if (pos + 4 > fileLength)
                    throw new CheckpointCorruptException(path, sections.Count == 0 ? null : "footer", pos,
                        $"truncated at offset {fileLength}: file ends after {sections.Count} complete section(s) without the footer");
                ReadExact(path, handle, small[..4], pos, null, fileLength);
                if (small[..4].SequenceEqual(CheckpointFormat.FooterMarker))
                {
                    ReadFooter(path, handle, pos, fileLength, sections.Count, chain);
                    return (header, sections);
                }
                if (!small[..4].SequenceEqual(CheckpointFormat.SectionMarker))
                    throw new CheckpointCorruptException(path, $"#{sections.Count + 1} (after '{(sections.Count > 0 ? sections[^1].Name : "header")}')", pos,
                        $"expected a section or footer marker but found bytes {Convert.ToHexString(small[..4])}");

                long sectionStart = pos;
                string label = $"#{sections.Count + 1}";
                ReadExact(path, handle, small[..2], pos + 4, label, fileLength);
                int nameLength = BinaryPrimitives.ReadUInt16LittleEndian(small);
                if (nameLength == 0 || nameLength > CheckpointFormat.MaxSectionNameBytes)
                    throw new CheckpointCorruptException(path, label, sectionStart, $"section name length {nameLength} is invalid");
                var nameBytes = new byte[nameLength];
                ReadExact(path, handle, nameBytes, pos + 6, label, fileLength);
                string name;
                try { name = Utf8.GetString(nameBytes); }
                catch (DecoderFallbackException) { name = "<undecodable name " + Convert.ToHexString(nameBytes) + ">"; }
                ReadExact(path, handle, small[..8], pos + 6 + nameLength, name, fileLength);
                ulong length = BinaryPrimitives.ReadUInt64LittleEndian(small);
                long payloadStart = pos + 6 + nameLength + 8;
                if (length > (ulong)(fileLength - payloadStart) || payloadStart + (long)length + 8 > fileLength)
                    throw new CheckpointCorruptException(path, name, sectionStart,
                        $"truncated: section declares {length} payload bytes starting at offset {payloadStart} (+8 checksum bytes) but the file ends at {fileLength}");

                hash.Reset();
                long remaining = (long)length;
                long at = payloadStart;
                while (remaining > 0)
                {
                    int n = (int)Math.Min(remaining, chunk.Length);
                    ReadExact(path, handle, chunk.AsSpan(0, n), at, name, fileLength);
                    hash.Append(chunk.AsSpan(0, n));
                    at += n;
                    remaining -= n;
                }
                hash.Append(nameBytes);
                BinaryPrimitives.WriteUInt64LittleEndian(small, length);
                hash.Append(small[..8]);
                ulong actual = hash.GetCurrentHashAsUInt64();
                ReadExact(path, handle, small[..8], at, name, fileLength);
                ulong expected = BinaryPrimitives.ReadUInt64LittleEndian(small);
                if (expected != actual)
                    throw new CheckpointCorruptException(path, name, sectionStart,
                        $"checksum mismatch over {length} payload bytes starting at offset {payloadStart}", expected, actual);
                if (!names.Add(name))
                    throw new CheckpointCorruptException(path, name, sectionStart, "section name appears twice");
                chain.Append(small[..8]);
                sections.Add(new CheckpointSectionInfo(name, payloadStart, (long)length, expected));
                pos = at + 8;
            }
        }
        finally
        {
            ArrayPool<byte>.Shared.Return(chunk);
        }
    }

    private static void ReadFooter(string path, SafeFileHandle handle, long pos, long fileLength, int sectionCount, XxHash64 chain)
    {
        if (pos + CheckpointFormat.FooterSize > fileLength)
            throw new CheckpointCorruptException(path, "footer", pos, $"truncated: footer needs {CheckpointFormat.FooterSize} bytes but the file ends at {fileLength}");
        Span<byte> footer = stackalloc byte[CheckpointFormat.FooterSize];
        ReadExact(path, handle, footer, pos, "footer", fileLength);
        uint count = BinaryPrimitives.ReadUInt32LittleEndian(footer[4..]);
        ulong offset = BinaryPrimitives.ReadUInt64LittleEndian(footer[8..]);
        chain.Append(footer[4..16]);
        ulong actual = chain.GetCurrentHashAsUInt64();
        ulong expected = BinaryPrimitives.ReadUInt64LittleEndian(footer[16..]);
        if (expected != actual)
            throw new CheckpointCorruptException(path, "footer", pos, "footer checksum mismatch (sections missing, reordered or footer damaged)", expected, actual);
        if (count != sectionCount)
            throw new CheckpointCorruptException(path, "footer", pos, $"footer records {count} sections but {sectionCount} were found");
        if (offset != (ulong)pos)
            throw new CheckpointCorruptException(path, "footer", pos, $"footer records its offset as {offset}");
        if (pos + CheckpointFormat.FooterSize != fileLength)
            throw new CheckpointCorruptException(path, "footer", pos + CheckpointFormat.FooterSize, $"{fileLength - pos - CheckpointFormat.FooterSize} unexpected bytes after the footer");
    }

    private static void ReadExact(string path, SafeFileHandle handle, Span<byte> buffer, long offset, string? section, long fileLength)
    {
        int done = 0;
        while (done < buffer.Length)
        {
            int n = RandomAccess.Read(handle, buffer[done..], offset + done);
            if (n == 0)
                throw new CheckpointCorruptException(path, section, offset, $"truncated at offset {offset + done} (file length {fileLength}) while reading {buffer.Length} bytes");
            done += n;
        }
    }

    private static CheckpointHeader DecodeHeaderBody(string path, ReadOnlySpan<byte> body, int version)
    {
        try
        {
            int p = 0;
            string trainer = ReadShortString(body, ref p);
            string config = ReadShortString(body, ref p);
            long ticks = BinaryPrimitives.ReadInt64LittleEndian(body[p..]); p += 8;
            long step = BinaryPrimitives.ReadInt64LittleEndian(body[p..]); p += 8;
            double score = BinaryPrimitives.ReadDoubleLittleEndian(body[p..]); p += 8;
            if (ticks < DateTime.MinValue.Ticks || ticks > DateTime.MaxValue.Ticks)
                throw new CheckpointCorruptException(path, "header", CheckpointFormat.PrefixSize, $"creation time ticks {ticks} are out of range");
            return new CheckpointHeader
            {
                Magic = CheckpointFormat.MagicText,
                FormatVersion = version,
                TrainerKind = trainer,
                ConfigHash = config,
                CreatedUtc = new DateTime(ticks, DateTimeKind.Utc),
                Step = step,
                Score = double.IsNaN(score) ? null : score,
            };
        }
        catch (Exception ex) when (ex is ArgumentOutOfRangeException or IndexOutOfRangeException or DecoderFallbackException)
        {
            throw new CheckpointCorruptException(path, "header", CheckpointFormat.PrefixSize, "header fields are malformed: " + ex.Message);
        }
    }

    private static string ReadShortString(ReadOnlySpan<byte> body, ref int p)
    {
        int n = BinaryPrimitives.ReadUInt16LittleEndian(body[p..]);
        p += 2;
        string s = Utf8.GetString(body.Slice(p, n));
        p += n;
        return s;
    }
}
