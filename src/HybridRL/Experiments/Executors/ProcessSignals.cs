using System.Runtime.InteropServices;

namespace HybridRL.Experiments.Executors;

/// <summary>Sends POSIX signals to child processes (Linux numbering), so children can checkpoint and exit 3 instead of being killed.</summary>
public static partial class ProcessSignals
{
    public const int SIGINT = 2;
    public const int SIGKILL = 9;
    public const int SIGUSR1 = 10;
    public const int SIGTERM = 15;

    [LibraryImport("libc", EntryPoint = "kill", SetLastError = true)]
    private static partial int SysKill(int pid, int signal);

    /// <summary>Sends <paramref name="signal"/> to <paramref name="pid"/>; false when the process is gone or the call failed.</summary>
    public static bool Send(int pid, int signal)
    {
        if (OperatingSystem.IsWindows()) throw new PlatformNotSupportedException("POSIX signals are not available on Windows");
        return SysKill(pid, signal) == 0;
    }
}
