using HybridRL.Experiments.Executors;

namespace HybridRL.Tests.Sweeps;

public class ShutdownSignalsTests
{
    [Fact]
    public async Task Usr1_to_this_process_cancels_the_token_instead_of_ending_the_process()
    {
        if (OperatingSystem.IsWindows()) return;
        using var cts = new CancellationTokenSource();
        using (new ShutdownSignals(cts))
        {
            Assert.True(ProcessSignals.Send(Environment.ProcessId, ProcessSignals.SIGUSR1));
            var deadline = DateTime.UtcNow.AddSeconds(10);
            while (!cts.IsCancellationRequested && DateTime.UtcNow < deadline) await Task.Delay(10);
        }
        Assert.True(cts.IsCancellationRequested);
    }
}
