using System.Text;

namespace HybridRL.Checkpoints;

/// <summary>
/// Writes a file so that readers see either the old content or the complete new content, never a part:
/// the bytes go to a temporary file in the same directory (<c>.&lt;name&gt;.tmp-&lt;pid&gt;-&lt;random&gt;</c>),
/// are flushed to disk (<see cref="FileStream.Flush(bool)"/> with true = fsync), the temporary file is renamed
/// over the target (atomic on POSIX and NTFS within one volume) and the directory is fsync-ed where possible.
/// </summary>
public static class AtomicFile
{
    private static readonly UTF8Encoding Utf8NoBom = new(encoderShouldEmitUTF8Identifier: false);

    public static void WriteAllText(string path, string text) =>
        Write(path, s =>
        {
            byte[] bytes = Utf8NoBom.GetBytes(text);
            s.Write(bytes);
        });

    public static void WriteAllBytes(string path, ReadOnlySpan<byte> bytes)
    {
        byte[] copy = bytes.ToArray();
        Write(path, s => s.Write(copy));
    }

    public static void WriteAllBytes(string path, byte[] bytes) => Write(path, s => s.Write(bytes));

    /// <summary>Writes through <paramref name="write"/> into a temporary file, then renames it over <paramref name="path"/>.</summary>
    public static void Write(string path, Action<Stream> write)
    {
        ArgumentNullException.ThrowIfNull(write);
        string full = Path.GetFullPath(path);
        string dir = Path.GetDirectoryName(full) ?? throw new ArgumentException($"path '{path}' has no directory", nameof(path));
        Directory.CreateDirectory(dir);
        string temp = TempPathFor(full);
        try
        {
            using (var fs = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, 64 * 1024))
            {
                write(fs);
                fs.Flush(flushToDisk: true);
            }
            File.Move(temp, full, overwrite: true);
        }
        catch
        {
            TryDelete(temp);
            throw;
        }
        DirectorySync.TrySync(dir);
    }

    /// <summary>
    /// For writers that only take a path (plot exporters): <paramref name="write"/> writes a temporary file with the
    /// same extension, which is then renamed over <paramref name="path"/>.
    /// </summary>
    public static void WriteViaPath(string path, Action<string> write)
    {
        ArgumentNullException.ThrowIfNull(write);
        string full = Path.GetFullPath(path);
        string dir = Path.GetDirectoryName(full) ?? throw new ArgumentException($"path '{path}' has no directory", nameof(path));
        Directory.CreateDirectory(dir);
        string temp = TempPathFor(full) + Path.GetExtension(full);
        try
        {
            write(temp);
            File.Move(temp, full, overwrite: true);
        }
        finally
        {
            TryDelete(temp);
        }
    }

    /// <summary>A fresh temporary name next to <paramref name="fullPath"/>; such names are ignored by checkpoint readers.</summary>
    internal static string TempPathFor(string fullPath)
    {
        string dir = Path.GetDirectoryName(fullPath)!;
        string name = Path.GetFileName(fullPath);
        string suffix = Convert.ToHexStringLower(Guid.NewGuid().ToByteArray().AsSpan(0, 4));
        return Path.Combine(dir, $".{name}.tmp-{Environment.ProcessId}-{suffix}");
    }

    internal static void TryDelete(string path)
    {
        try { File.Delete(path); } catch (IOException) { } catch (UnauthorizedAccessException) { }
    }
}
