using HybridRL.Experiments;
using HybridRL.Experiments.Executors;

namespace HybridRL.Tests.Experiments;

public class InterruptSignalsTests
{
    [Fact]
    public async Task Usr1_and_term_to_this_process_cancel_the_token_instead_of_ending_the_process()
    {
        if (!OperatingSystem.IsLinux()) return;
        foreach (int signal in new[] { ProcessSignals.SIGUSR1, ProcessSignals.SIGTERM })
        {
            using var signals = new InterruptSignals();
            Assert.False(signals.Token.IsCancellationRequested);
            Assert.True(ProcessSignals.Send(Environment.ProcessId, signal));
            var deadline = DateTime.UtcNow.AddSeconds(10);
            while (!signals.Token.IsCancellationRequested && DateTime.UtcNow < deadline) await Task.Delay(10);
            Assert.True(signals.Token.IsCancellationRequested, $"signal {signal} did not cancel the token");
            Assert.Equal(signal == ProcessSignals.SIGTERM ? "SIGTERM" : "SIGUSR1", signals.Received);
        }
    }
}
