using System.CommandLine;
using HybridRL;
using HybridRL.Cli;
using HybridRL.Cli.Commands;

var root = new RootCommand(
    "hybridrl: train and compare reinforcement-learning agents whose value or policy function is a simulated " +
    "variational quantum circuit fed by a tensor-network or neural compressor.\n" + ExitCodes.Description);
root.Options.Add(GlobalOptions.Verbose);
root.Options.Add(GlobalOptions.Quiet);
root.Subcommands.Add(AboutCommand.Create());
root.Subcommands.Add(TrainCommand.Create());
root.Subcommands.Add(ResumeCommand.Create());

return CommandRunner.Invoke(root, args);
