using Microsoft.Win32.SafeHandles;

namespace HybridRL.Checkpoints;

/// <summary>
/// Read-only, seekable view of one section's payload inside an open checkpoint file. Reads go through
/// <see cref="RandomAccess"/> at absolute offsets, so several section streams can be used at once.
/// </summary>
internal sealed class SectionReadStream : Stream
{
    private readonly SafeFileHandle _handle;
    private readonly long _start;
    private readonly long _length;
    private long _position;

    public SectionReadStream(SafeFileHandle handle, long start, long length)
    {
        _handle = handle;
        _start = start;
        _length = length;
    }

    public override bool CanRead => true;
    public override bool CanSeek => true;
    public override bool CanWrite => false;
    public override long Length => _length;

    public override long Position
    {
        get => _position;
        set
        {
            ArgumentOutOfRangeException.ThrowIfNegative(value);
            _position = value;
        }
    }

    public override int Read(Span<byte> buffer)
    {
        long remaining = _length - _position;
        if (remaining <= 0) return 0;
        if (buffer.Length > remaining) buffer = buffer[..(int)remaining];
        int n = RandomAccess.Read(_handle, buffer, _start + _position);
        _position += n;
        return n;
    }

    public override int Read(byte[] buffer, int offset, int count) => Read(buffer.AsSpan(offset, count));

    public override int ReadByte()
    {
        Span<byte> one = stackalloc byte[1];
        return Read(one) == 1 ? one[0] : -1;
    }

    public override long Seek(long offset, SeekOrigin origin)
    {
        long target = origin switch
        {
            SeekOrigin.Begin => offset,
            SeekOrigin.Current => _position + offset,
            SeekOrigin.End => _length + offset,
            _ => throw new ArgumentOutOfRangeException(nameof(origin)),
        };
        Position = target;
        return target;
    }

    public override void Flush() { }
    public override void SetLength(long value) => throw new NotSupportedException();
    public override void Write(byte[] buffer, int offset, int count) => throw new NotSupportedException();
}
