using HybridRL.Training;
using System.Globalization;
using System.Text;
using HybridRL.Checkpoints;

namespace HybridRL.Experiments.Runs;

/// <summary>
/// Appends rows to a run's metrics.csv (header per the shared contract, invariant culture, doubles in "R"
/// round-trip form, empty field for not-applicable). Each row is flushed to the OS when appended; call
/// <see cref="FlushToDisk"/> before writing a checkpoint so the checkpoint's metrics cursor
/// (<see cref="RowsWritten"/>) never counts rows that are not durable.
/// On resume, <see cref="OpenForResume"/> truncates the file back to the cursor stored in the checkpoint,
/// so rows logged after that checkpoint (and a half-written last line) are dropped and never duplicated.
/// </summary>
public sealed class MetricsCsvWriter : IDisposable
{
    /// <summary>The header line, exactly as the shared contract gives it.</summary>
    public const string Header =
        "env_steps,episodes,updates,generations,wall_seconds,train_return,eval_return,loss,fitness_mean,fitness_best,fitness_std,epsilon,sigma,circuit_executions,shots,hardware_executions,parameter_count";

    private static readonly UTF8Encoding Utf8 = new(false);
    private readonly FileStream _file;
    private readonly StringBuilder _line = new(256);
    private byte[] _bytes = new byte[512];

    private MetricsCsvWriter(string path, FileStream file, int rows)
    {
        FilePath = path;
        _file = file;
        RowsWritten = rows;
    }

    public string FilePath { get; }

    /// <summary>Data rows (header excluded) the file holds.</summary>
    public int RowsWritten { get; private set; }

    /// <summary>Starts a new metrics.csv holding only the header (an existing file is replaced atomically).</summary>
    public static MetricsCsvWriter Create(string path)
    {
        string full = Path.GetFullPath(path);
        AtomicFile.WriteAllText(full, Header + "\n");
        return new MetricsCsvWriter(full, OpenAppend(full), 0);
    }

    /// <summary>
    /// Opens an existing metrics.csv for a resumed run and truncates it to <paramref name="rowsInCheckpoint"/> data rows.
    /// With no file and a cursor of 0 a new file is created.
    /// </summary>
    /// <exception cref="InvalidDataException">the header differs from <see cref="Header"/>, or the file holds fewer complete rows than the checkpoint recorded.</exception>
    public static MetricsCsvWriter OpenForResume(string path, int rowsInCheckpoint)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(rowsInCheckpoint);
        string full = Path.GetFullPath(path);
        if (!File.Exists(full))
        {
            if (rowsInCheckpoint == 0) return Create(full);
            throw new InvalidDataException($"metrics file '{full}' is missing but the checkpoint records {rowsInCheckpoint} rows");
        }
        var file = OpenAppend(full);
        try
        {
            var writer = new MetricsCsvWriter(full, file, 0);
            writer.CheckHeader();
            writer.TruncateToRows(rowsInCheckpoint);
            return writer;
        }
        catch
        {
            file.Dispose();
            throw;
        }
    }

    /// <summary>Counts complete data rows (newline-terminated lines after the header) in a metrics file.</summary>
    public static int CountRows(string path)
    {
        using var fs = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.ReadWrite);
        long lines = 0;
        var buf = new byte[64 * 1024];
        int n;
        while ((n = fs.Read(buf)) > 0) lines += buf.AsSpan(0, n).Count((byte)'\n');
        return (int)Math.Max(0, lines - 1);
    }

    /// <summary>Appends one row and flushes it to the operating system.</summary>
    public void Append(MetricsRow row)
    {
        ArgumentNullException.ThrowIfNull(row);
        var sb = _line.Clear();
        Field(sb, row.EnvSteps); sb.Append(',');
        Field(sb, row.Episodes); sb.Append(',');
        Field(sb, row.Updates); sb.Append(',');
        Field(sb, row.Generations); sb.Append(',');
        Field(sb, row.WallSeconds); sb.Append(',');
        Field(sb, row.TrainReturn); sb.Append(',');
        Field(sb, row.EvalReturn); sb.Append(',');
        Field(sb, row.Loss); sb.Append(',');
        Field(sb, row.FitnessMean); sb.Append(',');
        Field(sb, row.FitnessBest); sb.Append(',');
        Field(sb, row.FitnessStd); sb.Append(',');
        Field(sb, row.Epsilon); sb.Append(',');
        Field(sb, row.Sigma); sb.Append(',');
        Field(sb, row.CircuitExecutions); sb.Append(',');
        Field(sb, row.Shots); sb.Append(',');
        Field(sb, row.HardwareExecutions); sb.Append(',');
        Field(sb, row.ParameterCount);
        sb.Append('\n');

        int max = Utf8.GetMaxByteCount(sb.Length);
        if (_bytes.Length < max) _bytes = new byte[max];
        int count = 0;
        foreach (var chunk in sb.GetChunks())
            count += Utf8.GetBytes(chunk.Span, _bytes.AsSpan(count));
        _file.Write(_bytes, 0, count);
        _file.Flush(flushToDisk: false);
        RowsWritten++;
    }

    /// <summary>Forces written rows to disk (fsync). Call before a checkpoint records <see cref="RowsWritten"/>.</summary>
    public void FlushToDisk() => _file.Flush(flushToDisk: true);

    /// <summary>Cuts the file back to the header plus the first <paramref name="rows"/> complete data rows.</summary>
    /// <exception cref="InvalidDataException">the file holds fewer complete rows.</exception>
    public void TruncateToRows(int rows)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(rows);
        _file.Flush(flushToDisk: false);
        _file.Position = 0;
        long wantedLines = rows + 1L; // the header line, then the rows
        long seen = 0;
        long cut = -1;
        var buf = new byte[64 * 1024];
        long offset = 0;
        int n;
        while (cut < 0 && (n = _file.Read(buf)) > 0)
        {
            var span = buf.AsSpan(0, n);
            int i = 0;
            while (i < span.Length)
            {
                int nl = span[i..].IndexOf((byte)'\n');
                if (nl < 0) break;
                i += nl + 1;
                if (++seen == wantedLines)
                {
                    cut = offset + i;
                    break;
                }
            }
            offset += n;
        }
        if (cut < 0)
            throw new InvalidDataException($"metrics file '{FilePath}' holds {Math.Max(0, seen - 1)} complete rows but {rows} were requested (the checkpoint's metrics cursor is ahead of the file)");
        _file.SetLength(cut);
        _file.Position = cut;
        _file.Flush(flushToDisk: true);
        RowsWritten = rows;
    }

    public void Dispose()
    {
        _file.Flush(flushToDisk: true);
        _file.Dispose();
    }

    private void CheckHeader()
    {
        _file.Position = 0;
        var buf = new byte[Header.Length + 2];
        int got = 0, n;
        while (got < buf.Length && (n = _file.Read(buf, got, buf.Length - got)) > 0) got += n;
        string start = Utf8.GetString(buf, 0, got);
        int nl = start.IndexOf('\n');
        string first = (nl < 0 ? start : start[..nl]).TrimEnd('\r');
        if (nl < 0 || first != Header)
            throw new InvalidDataException($"metrics file '{FilePath}' does not start with the expected header line \"{Header}\" (found \"{first}\")");
    }

    private static FileStream OpenAppend(string path)
    {
        var fs = new FileStream(path, FileMode.Open, FileAccess.ReadWrite, FileShare.Read, 4096);
        fs.Position = fs.Length;
        return fs;
    }

    private static void Field(StringBuilder sb, long? v)
    {
        if (v is long x) sb.Append(CultureInfo.InvariantCulture, $"{x}");
    }

    private static void Field(StringBuilder sb, double? v)
    {
        if (v is double x) sb.Append(CultureInfo.InvariantCulture, $"{x:R}");
    }
}
