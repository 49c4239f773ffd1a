using HybridRL.Cli;

return CliApplication.Run(args);
