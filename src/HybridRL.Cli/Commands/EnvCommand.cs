using System.CommandLine;
using HybridRL.Environments;
using HybridRL.Experiments.Inspection;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl env list` and `hybridrl env solve CONFIG`.</summary>
public static class EnvCommand
{
    public static Command Create()
    {
        var command = new Command("env", "Environments: list the kinds with their keys, or solve a tabular one exactly.");
        command.Subcommands.Add(List());
        command.Subcommands.Add(Solve());
        return command;
    }

    private static Command List()
    {
        var command = new Command("list", "List environment kinds with their keys and default values.");
        command.SetAction(_ =>
        {
            foreach (var kind in EnvironmentFactory.Kinds)
            {
                Console.Out.WriteLine(kind);
                foreach (var (key, value) in EnvironmentFactory.Defaults(kind).OrderBy(kv => kv.Key, StringComparer.Ordinal))
                    Console.Out.WriteLine($"  {key}: {(value.Length == 0 ? "(empty)" : value)}");
            }
            return ExitCodes.Done;
        });
        return command;
    }

    private static Command Solve()
    {
        var files = new Argument<string[]>("config") { Description = "Experiment file(s); later files override earlier ones.", Arity = ArgumentArity.OneOrMore };
        var set = ConfigOptions.Set();
        var gamma = new Option<double?>("--gamma") { Description = $"Discount (default: trainer.dqn.gamma, else {EnvironmentSolver.FallbackGamma})." };
        var command = new Command("solve", "Exact value iteration for a tabular environment (slippery-warehouse, survey-drone): optimal values, greedy moves and the optimal expected return.")
        {
            files, set, gamma,
        };
        command.SetAction(result =>
        {
            var spec = ConfigOptions.Load(result.GetValue(files)!, result.GetValue(set));
            Console.Out.Write(EnvironmentSolver.Solve(spec, result.GetValue(gamma)).Format());
            return ExitCodes.Done;
        });
        return command;
    }
}
