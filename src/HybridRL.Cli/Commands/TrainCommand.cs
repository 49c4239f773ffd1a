using System.CommandLine;
using HybridRL.Experiments;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl train CONFIG...`: one training run in a new (or its existing) run folder.</summary>
public static class TrainCommand
{
    public static Command Create()
    {
        var files = new Argument<string[]>("config") { Description = "Experiment file(s); later files override earlier ones.", Arity = ArgumentArity.OneOrMore };
        var set = ConfigOptions.Set();
        var runsDir = new Option<string>("--runs-dir") { Description = "Folder that holds run folders.", DefaultValueFactory = _ => "runs" };
        var name = new Option<string?>("--name") { Description = "Run name (default: experiment.name)." };
        var runId = new Option<string?>("--run-id") { Description = "Run id (default: derived from the resolved config, so the same config is the same run)." };
        var command = new Command("train", "Train an agent from experiment file(s). Prints the run folder first; a run stopped by a signal (exit 3) continues with 'hybridrl resume'.")
        {
            files, set, runsDir, name, runId,
        };
        command.SetAction(result =>
        {
            var spec = ConfigOptions.Load(result.GetValue(files)!, result.GetValue(set));
            var session = TrainingSession.Create(spec, result.GetValue(runsDir)!, result.GetValue(name), result.GetValue(runId),
                GlobalOptions.VerbosityOf(result), Console.Out);
            using var signals = new InterruptSignals();
            return session.Run(signals.Token);
        });
        return command;
    }
}
