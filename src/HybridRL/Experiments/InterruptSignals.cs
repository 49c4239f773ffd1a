using System.Runtime.InteropServices;

namespace HybridRL.Experiments;

/// <summary>
/// Turns SIGTERM, SIGINT and SIGUSR1 (Slurm's early warning) into a cancellation request: the
/// trainer finishes its current unit, writes a checkpoint and the process exits with code 3.
/// A second SIGINT exits at once with code 130 (the previous checkpoint stays valid, since
/// checkpoints are only ever replaced by an atomic rename).
/// </summary>
public sealed class InterruptSignals : IDisposable
{
    /// <summary>Exit code of an immediate stop on a second SIGINT (128 + signal 2, common practice for shells).</summary>
    public const int ImmediateExitCode = 130;

    private const int SigUsr1 = 10; // Linux x86-64 / arm64 numbering
    private readonly CancellationTokenSource _cts = new();
    private readonly List<PosixSignalRegistration> _registrations = [];
    private int _interrupts;

    public InterruptSignals()
    {
        _registrations.Add(PosixSignalRegistration.Create(PosixSignal.SIGTERM, OnSignal));
        _registrations.Add(PosixSignalRegistration.Create(PosixSignal.SIGINT, OnInterrupt));
        if (OperatingSystem.IsLinux())
            _registrations.Add(PosixSignalRegistration.Create((PosixSignal)SigUsr1, OnSignal));
    }

    public CancellationToken Token => _cts.Token;

    /// <summary>Name of the first signal received, for the log.</summary>
    public string? Received { get; private set; }

    private void OnSignal(PosixSignalContext context)
    {
        context.Cancel = true;
        Received ??= context.Signal == PosixSignal.SIGTERM ? "SIGTERM" : "SIGUSR1";
        _cts.Cancel();
    }

    private void OnInterrupt(PosixSignalContext context)
    {
        context.Cancel = true;
        if (Interlocked.Increment(ref _interrupts) > 1)
        {
            Console.Error.WriteLine("second interrupt: stopping now; the previous checkpoint is still valid (hybridrl resume continues from it)");
            Console.Error.Flush();
            // _exit, not Environment.Exit: no managed shutdown or native destructors run while the training
            // thread may be inside the tensor library (which can crash the teardown). Files on disk are safe:
            // checkpoints and results are only ever replaced by atomic renames.
            if (OperatingSystem.IsLinux() || OperatingSystem.IsMacOS()) LibC._exit(ImmediateExitCode);
            Environment.Exit(ImmediateExitCode);
        }
        Received ??= "SIGINT";
        Console.Error.WriteLine("interrupt: finishing the current step and writing a checkpoint (press Ctrl+C again to stop at once)");
        _cts.Cancel();
    }

    public void Dispose()
    {
        foreach (var r in _registrations) r.Dispose();
        _cts.Dispose();
    }

    private static class LibC
    {
        [DllImport("libc", EntryPoint = "_exit")]
        public static extern void _exit(int status);
    }
}
