namespace HybridRL.Environments;

/// <summary>
/// Reads newline-terminated lines from a child's stdout on a background thread and hands them one at a time to the
/// consumer, who can wait with a timeout. Buffers are reused: no allocation per line once they have grown.
/// </summary>
internal sealed class ChildLineReader
{
    public const int MaxLineBytes = 64 * 1024 * 1024;
    private readonly Stream _stream;
    private readonly object _gate = new();
    private readonly Thread _thread;
    private byte[] _line = new byte[4096];
    private int _lineLength;
    private bool _hasLine;
    private bool _eof;
    private bool _stopped;
    private string? _readError;

    public ChildLineReader(Stream stream)
    {
        _stream = stream;
        _thread = new Thread(Run) { IsBackground = true, Name = "external-environment-stdout" };
        _thread.Start();
    }

    public enum Outcome { Line, EndOfStream, Timeout }

    /// <summary>Why the stream ended, when reading failed rather than reaching a clean end.</summary>
    public string? ReadError { get { lock (_gate) return _readError; } }

    /// <summary>Waits for the next line. On <see cref="Outcome.Line"/> the line is valid until <see cref="Release"/>.</summary>
    public Outcome Wait(TimeSpan timeout, out ReadOnlySpan<byte> line)
    {
        line = default;
        long deadline = Environment.TickCount64 + (long)Math.Ceiling(timeout.TotalMilliseconds);
        lock (_gate)
        {
            while (!_hasLine && !_eof)
            {
                long left = deadline - Environment.TickCount64;
                if (left <= 0) return Outcome.Timeout;
                Monitor.Wait(_gate, (int)Math.Min(left, int.MaxValue));
            }
            if (!_hasLine) return Outcome.EndOfStream;
            line = new ReadOnlySpan<byte>(_line, 0, _lineLength);
            return Outcome.Line;
        }
    }

    /// <summary>Frees the slot for the next line.</summary>
    public void Release()
    {
        lock (_gate)
        {
            _hasLine = false;
            Monitor.PulseAll(_gate);
        }
    }

    public void Stop()
    {
        lock (_gate)
        {
            _stopped = true;
            Monitor.PulseAll(_gate);
        }
    }

    private void Run()
    {
        var chunk = new byte[8192];
        var acc = new byte[4096];
        int accLength = 0;
        try
        {
            while (true)
            {
                int n = _stream.Read(chunk, 0, chunk.Length);
                if (n <= 0) break;
                for (int i = 0; i < n; i++)
                {
                    byte b = chunk[i];
                    if (b == (byte)'\n')
                    {
                        if (!Deliver(acc, accLength)) return;
                        accLength = 0;
                        continue;
                    }
                    if (accLength == acc.Length)
                    {
                        if (acc.Length >= MaxLineBytes) throw new IOException($"a line from the child is longer than {MaxLineBytes} bytes");
                        Array.Resize(ref acc, acc.Length * 2);
                    }
                    acc[accLength++] = b;
                }
            }
            if (accLength > 0) Deliver(acc, accLength);
        }
        catch (Exception e) when (e is IOException or ObjectDisposedException)
        {
            lock (_gate) _readError = e.Message;
        }
        finally
        {
            lock (_gate)
            {
                _eof = true;
                Monitor.PulseAll(_gate);
            }
        }
    }

    private bool Deliver(byte[] acc, int length)
    {
        // A trailing carriage return (Windows line ends) is dropped.
        if (length > 0 && acc[length - 1] == (byte)'\r') length--;
        lock (_gate)
        {
            while (_hasLine && !_stopped) Monitor.Wait(_gate);
            if (_stopped) return false;
            if (_line.Length < length) _line = new byte[Math.Max(length, _line.Length * 2)];
            Array.Copy(acc, _line, length);
            _lineLength = length;
            _hasLine = true;
            Monitor.PulseAll(_gate);
            return true;
        }
    }
}
