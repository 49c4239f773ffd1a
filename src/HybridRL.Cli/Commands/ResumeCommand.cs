using System.CommandLine;
using HybridRL.Experiments;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl resume RUN_DIR`: continue a run from its newest valid checkpoint.</summary>
public static class ResumeCommand
{
    public static Command Create()
    {
        var dir = new Argument<string>("run-dir") { Description = "The run folder (runs/<name>/<run-id>)." };
        var set = ConfigOptions.Set();
        var command = new Command("resume", "Continue a run from its newest valid checkpoint. --set may change only keys that are safe on resume (budgets, logging).")
        {
            dir, set,
        };
        command.SetAction(result =>
        {
            var session = TrainingSession.ForExisting(result.GetValue(dir)!, result.GetValue(set) ?? [], GlobalOptions.VerbosityOf(result), Console.Out);
            using var signals = new InterruptSignals();
            return session.Run(signals.Token);
        });
        return command;
    }
}
