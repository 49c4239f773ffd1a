using System.CommandLine;
using HybridRL.Cli.Commands;

namespace HybridRL.Cli;

/// <summary>The `hybridrl` command tree (Program.cs runs it; tests invoke it in-process through <see cref="CommandRunner"/>).</summary>
public static class CliApplication
{
    public static RootCommand Build()
    {
        var root = new RootCommand(
            "hybridrl: train and compare reinforcement-learning agents whose value or policy function is a simulated " +
            "variational quantum circuit fed by a tensor-network or neural compressor.\n" + ExitCodes.Description);
        root.Options.Add(GlobalOptions.Verbose);
        root.Options.Add(GlobalOptions.Quiet);
        root.Subcommands.Add(AboutCommand.Create());
        root.Subcommands.Add(TrainCommand.Create());
        root.Subcommands.Add(ResumeCommand.Create());
        root.Subcommands.Add(InspectCommand.Create());
        root.Subcommands.Add(EvalCommand.Create());
        root.Subcommands.Add(EnvCommand.Create());
        root.Subcommands.Add(BenchCommand.Create());
        root.Subcommands.Add(CompareCommand.Create());
        root.Subcommands.Add(ReportCommand.Create());
        root.Subcommands.Add(EstimateCommand.Create());
        root.Subcommands.Add(SweepCommand.Create());
        return root;
    }

    /// <summary>Parses and runs <paramref name="args"/>; returns the exit code.</summary>
    public static int Run(string[] args) => CommandRunner.Invoke(Build(), args);
}
