using System.Runtime.InteropServices;

namespace HybridRL.Experiments.Executors;

/// <summary>
/// Turns SIGINT, SIGTERM and SIGUSR1 into cancellation of a token (the process keeps running so it can stop its children or
/// checkpoint and exit 3). Dispose to restore the default handling.
/// </summary>
public sealed class ShutdownSignals : IDisposable
{
    private readonly List<PosixSignalRegistration> _registrations = [];

    public ShutdownSignals(CancellationTokenSource cts, TextWriter? log = null)
    {
        void Handler(PosixSignalContext ctx)
        {
            ctx.Cancel = true; // do not terminate: cancellation lets the work stop cleanly
            log?.WriteLine($"received signal {ctx.Signal}, stopping");
            try { cts.Cancel(); } catch (ObjectDisposedException) { }
        }
        _registrations.Add(PosixSignalRegistration.Create(PosixSignal.SIGINT, Handler));
        _registrations.Add(PosixSignalRegistration.Create(PosixSignal.SIGTERM, Handler));
        if (!OperatingSystem.IsWindows())
            _registrations.Add(PosixSignalRegistration.Create((PosixSignal)ProcessSignals.SIGUSR1, Handler));
    }

    public void Dispose()
    {
        foreach (var r in _registrations) r.Dispose();
        _registrations.Clear();
    }
}
