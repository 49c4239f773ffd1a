using System.IO.Hashing;

namespace HybridRL.Checkpoints;

/// <summary>
/// Write-only pass-through stream used while a section is produced: bytes go straight to the
/// checkpoint file and into an incremental XxHash64 at the same time, so no copy of the section is kept.
/// Disposing it does not close the file.
/// </summary>
internal sealed class SectionWriteStream : Stream
{
    private readonly Stream _inner;
    private readonly XxHash64 _hash;
    private bool _closed;

    public SectionWriteStream(Stream inner, XxHash64 hash)
    {
        _inner = inner;
        _hash = hash;
    }

    public long BytesWritten { get; private set; }

    public override bool CanRead => false;
    public override bool CanSeek => false;
    public override bool CanWrite => !_closed;
    public override long Length => BytesWritten;
    public override long Position
    {
        get => BytesWritten;
        set => throw new NotSupportedException("checkpoint section streams are append-only");
    }

    public override void Write(ReadOnlySpan<byte> buffer)
    {
        if (_closed) throw new ObjectDisposedException(nameof(SectionWriteStream), "the section has already been closed");
        _hash.Append(buffer);
        _inner.Write(buffer);
        BytesWritten += buffer.Length;
    }

    public override void Write(byte[] buffer, int offset, int count) => Write(buffer.AsSpan(offset, count));

    public override void WriteByte(byte value)
    {
        Span<byte> one = [value];
        Write(one);
    }

    public override void Flush() { }
    public override int Read(byte[] buffer, int offset, int count) => throw new NotSupportedException();
    public override long Seek(long offset, SeekOrigin origin) => throw new NotSupportedException();
    public override void SetLength(long value) => throw new NotSupportedException();

    /// <summary>Called by the owner when the section is finished; later writes (e.g. from a leaked writer) fail.</summary>
    internal void MarkFinished() => _closed = true;
}
