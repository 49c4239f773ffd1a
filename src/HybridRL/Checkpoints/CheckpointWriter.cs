using System.Buffers.Binary;
using System.IO.Hashing;
using System.Text;

namespace HybridRL.Checkpoints;

/// <summary>
/// Builds one checkpoint file. Sections are registered as callbacks and run only inside
/// <see cref="Save"/>, where each streams straight into the file (and into an incremental XxHash64),
/// so a large section such as a replay buffer is never copied into an intermediate buffer.
/// <para>
/// Save writes <c>ckpt-&lt;step:D12&gt;.hrlc</c> to a temporary name, flushes it to disk, renames it
/// atomically, fsyncs the directory, updates the <c>latest</c> (and, when the score improves, the
/// <c>best</c>) pointer, and only then deletes checkpoints beyond the newest <c>keep</c> plus the best.
/// </para>
/// </summary>
public sealed class CheckpointWriter
{
    private const int FileBufferSize = 1 << 20;
    private static readonly UTF8Encoding Utf8 = new(false, true);

    private readonly List<(string Name, byte[] NameBytes, Action<Stream> Write)> _sections = [];
    private readonly HashSet<string> _names = new(StringComparer.Ordinal);

    /// <summary>Registered section names in file order.</summary>
    public IReadOnlyList<string> SectionNames => _sections.ConvertAll(s => s.Name);

    /// <summary>Adds a section whose content is written through a <see cref="BinaryWriter"/> (UTF-8, little-endian).</summary>
    public CheckpointWriter AddSection(string name, Action<BinaryWriter> write)
    {
        ArgumentNullException.ThrowIfNull(write);
        return AddStreamSection(name, s =>
        {
            using var w = new BinaryWriter(s, Utf8, leaveOpen: true);
            write(w);
            w.Flush();
        });
    }

    /// <summary>Adds a section written from an <see cref="IStateful"/> part.</summary>
    public CheckpointWriter AddSection(string name, IStateful part)
    {
        ArgumentNullException.ThrowIfNull(part);
        return AddSection(name, part.Save);
    }

    /// <summary>Adds a section from bytes already in memory (the memory is read during <see cref="Save"/>).</summary>
    public CheckpointWriter AddSection(string name, ReadOnlyMemory<byte> bytes) =>
        AddStreamSection(name, s => s.Write(bytes.Span));

    /// <summary>Adds a section written directly to a raw, append-only stream (best for large chunked content).</summary>
    public CheckpointWriter AddStreamSection(string name, Action<Stream> write)
    {
        ArgumentNullException.ThrowIfNull(write);
        byte[] nameBytes = ValidateName(name);
        if (!_names.Add(name)) throw new ArgumentException($"checkpoint section '{name}' was added twice", nameof(name));
        _sections.Add((name, nameBytes, write));
        return this;
    }

    /// <summary>
    /// Returns a stream to fill now for a small section; its bytes are kept in memory until <see cref="Save"/>.
    /// Prefer <see cref="AddSection(string, Action{BinaryWriter})"/> or <see cref="AddStreamSection"/> for large content.
    /// </summary>
    public Stream BeginSection(string name)
    {
        var buffer = new MemoryStream();
        // ToArray works whether or not the caller has disposed the stream.
        AddStreamSection(name, s => s.Write(buffer.ToArray()));
        return buffer;
    }

    /// <summary>
    /// Writes the checkpoint for <paramref name="step"/> into <paramref name="checkpointsDir"/> and applies retention.
    /// Returns the full path of the new file.
    /// </summary>
    /// <param name="score">Higher is better; the best-scoring checkpoint is kept in addition to the newest <paramref name="keep"/>. Null or NaN = not scored.</param>
    /// <param name="keep">How many of the newest checkpoints to keep (at least 1).</param>
    public string Save(string checkpointsDir, long step, CheckpointHeader header, double? score, int keep = 3)
    {
        ArgumentNullException.ThrowIfNull(header);
        ArgumentOutOfRangeException.ThrowIfLessThan(keep, 1);
        if (score is double d && double.IsNaN(d)) score = null;
        DateTime created = header.CreatedUtc == default ? DateTime.UtcNow : header.CreatedUtc.ToUniversalTime();
        var h = header with
        {
            Magic = CheckpointFormat.MagicText,
            FormatVersion = CheckpointFormat.CurrentVersion,
            Step = step,
            Score = score,
            CreatedUtc = created,
        };

        string dir = Path.GetFullPath(checkpointsDir);
        Directory.CreateDirectory(dir);
        string fileName = CheckpointFormat.FileNameFor(step);
        string finalPath = Path.Combine(dir, fileName);
        string temp = AtomicFile.TempPathFor(finalPath);
        try
        {
            using (var fs = new FileStream(temp, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None, FileBufferSize))
            {
                WriteTo(fs, h);
                fs.Flush(flushToDisk: true);
            }
            File.Move(temp, finalPath, overwrite: true);
        }
        catch
        {
            AtomicFile.TryDelete(temp);
            throw;
        }
        DirectorySync.TrySync(dir);

        // The new checkpoint is durable: now move the pointers, then prune.
        CheckpointStore.WriteLatestPointer(dir, fileName);
        if (score is double s)
        {
            var best = CheckpointStore.ReadBestPointer(dir);
            if (best is null || !File.Exists(Path.Combine(dir, best.Value.FileName)) || s > best.Value.Score || best.Value.FileName == fileName)
                CheckpointStore.WriteBestPointer(dir, fileName, s);
        }
        CheckpointStore.ApplyRetention(dir, keep, step);
        return finalPath;
    }

    /// <summary>Writes the whole container to a seekable stream positioned at its start (used by Save and by tests).</summary>
    internal void WriteTo(Stream fs, CheckpointHeader h)
    {
        if (!fs.CanSeek) throw new ArgumentException("checkpoint output must be seekable", nameof(fs));
        long origin = fs.Position;
        Span<byte> scratch = stackalloc byte[16];

        // --- header ---
        byte[] body = EncodeHeaderBody(h);
        var headerBytes = new byte[CheckpointFormat.PrefixSize + body.Length];
        CheckpointFormat.Magic.CopyTo(headerBytes);
        BinaryPrimitives.WriteUInt32LittleEndian(headerBytes.AsSpan(8), (uint)CheckpointFormat.CurrentVersion);
        BinaryPrimitives.WriteUInt32LittleEndian(headerBytes.AsSpan(12), (uint)body.Length);
        body.CopyTo(headerBytes, CheckpointFormat.PrefixSize);
        ulong headerHash = XxHash64.HashToUInt64(headerBytes);
        fs.Write(headerBytes);
        BinaryPrimitives.WriteUInt64LittleEndian(scratch, headerHash);
        fs.Write(scratch[..8]);

        var chain = new XxHash64();
        chain.Append(scratch[..8]);

        // --- sections ---
        var hash = new XxHash64();
        foreach (var (name, nameBytes, write) in _sections)
        {
            fs.Write(CheckpointFormat.SectionMarker);
            BinaryPrimitives.WriteUInt16LittleEndian(scratch, (ushort)nameBytes.Length);
            fs.Write(scratch[..2]);
            fs.Write(nameBytes);
            long lengthPos = fs.Position;
            BinaryPrimitives.WriteUInt64LittleEndian(scratch, 0);
            fs.Write(scratch[..8]);

            hash.Reset();
            var section = new SectionWriteStream(fs, hash);
            try
            {
                write(section);
            }
            catch (Exception ex) when (ex is not OutOfMemoryException)
            {
                throw new IOException($"writing checkpoint section '{name}' failed: {ex.Message}", ex);
            }
            finally
            {
                section.MarkFinished();
            }
            long length = section.BytesWritten;

            // checksum = XxHash64-64(payload ‖ name bytes ‖ payload length as u64 LE)
            hash.Append(nameBytes);
            BinaryPrimitives.WriteUInt64LittleEndian(scratch, (ulong)length);
            hash.Append(scratch[..8]);
            ulong sum = hash.GetCurrentHashAsUInt64();

            long end = fs.Position;
            fs.Position = lengthPos;
            fs.Write(scratch[..8]);
            fs.Position = end;

            BinaryPrimitives.WriteUInt64LittleEndian(scratch, sum);
            fs.Write(scratch[..8]);
            chain.Append(scratch[..8]);
        }

        // --- footer ---
        long footerOffset = fs.Position - origin;
        Span<byte> footer = stackalloc byte[CheckpointFormat.FooterSize];
        CheckpointFormat.FooterMarker.CopyTo(footer);
        BinaryPrimitives.WriteUInt32LittleEndian(footer[4..], (uint)_sections.Count);
        BinaryPrimitives.WriteUInt64LittleEndian(footer[8..], (ulong)footerOffset);
        chain.Append(footer[4..16]);
        BinaryPrimitives.WriteUInt64LittleEndian(footer[16..], chain.GetCurrentHashAsUInt64());
        fs.Write(footer);
    }

    internal static byte[] EncodeHeaderBody(CheckpointHeader h)
    {
        using var ms = new MemoryStream();
        using (var w = new BinaryWriter(ms, Utf8, leaveOpen: true))
        {
            WriteShortString(w, h.TrainerKind, "trainer kind");
            WriteShortString(w, h.ConfigHash, "config hash");
            w.Write(h.CreatedUtc.ToUniversalTime().Ticks);
            w.Write(h.Step);
            w.Write(h.Score ?? double.NaN);
        }
        return ms.ToArray();
    }

    private static void WriteShortString(BinaryWriter w, string value, string what)
    {
        ArgumentNullException.ThrowIfNull(value, what);
        byte[] b = Utf8.GetBytes(value);
        if (b.Length > ushort.MaxValue) throw new ArgumentException($"checkpoint header {what} is too long ({b.Length} bytes)");
        w.Write((ushort)b.Length);
        w.Write(b);
    }

    private static byte[] ValidateName(string name)
    {
        if (string.IsNullOrEmpty(name)) throw new ArgumentException("checkpoint section name must not be empty", nameof(name));
        byte[] b = Utf8.GetBytes(name);
        if (b.Length > CheckpointFormat.MaxSectionNameBytes)
            throw new ArgumentException($"checkpoint section name '{name}' is longer than {CheckpointFormat.MaxSectionNameBytes} bytes", nameof(name));
        return b;
    }
}
