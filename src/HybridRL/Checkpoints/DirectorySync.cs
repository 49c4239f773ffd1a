using System.Runtime.InteropServices;

namespace HybridRL.Checkpoints;

/// <summary>
/// Makes a rename durable by fsync-ing the containing directory. .NET has no managed API for this
/// (a directory cannot be opened as a FileStream), so on Linux and macOS this calls libc
/// <c>open(dir, O_RDONLY)</c> + <c>fsync</c> + <c>close</c> through P/Invoke. On Windows it is skipped:
/// NTFS journals the rename's metadata and there is no directory handle flush to call from .NET.
/// Failures are not fatal: the file itself has already been flushed, only the rename's durability
/// across a power cut is at stake.
/// </summary>
internal static partial class DirectorySync
{
    private const int ReadOnly = 0; // O_RDONLY is 0 on Linux and macOS

    /// <summary>Returns true when the directory was fsync-ed.</summary>
    public static bool TrySync(string directory)
    {
        if (!(OperatingSystem.IsLinux() || OperatingSystem.IsMacOS() || OperatingSystem.IsFreeBSD()))
            return false;
        try
        {
            int fd = Open(directory, ReadOnly);
            if (fd < 0) return false;
            try
            {
                return Fsync(fd) == 0;
            }
            finally
            {
                _ = Close(fd);
            }
        }
        catch (DllNotFoundException) { return false; }
        catch (EntryPointNotFoundException) { return false; }
    }

    [LibraryImport("libc", EntryPoint = "open", StringMarshalling = StringMarshalling.Utf8, SetLastError = true)]
    private static partial int Open(string path, int flags);

    [LibraryImport("libc", EntryPoint = "fsync", SetLastError = true)]
    private static partial int Fsync(int fd);

    [LibraryImport("libc", EntryPoint = "close", SetLastError = true)]
    private static partial int Close(int fd);
}
