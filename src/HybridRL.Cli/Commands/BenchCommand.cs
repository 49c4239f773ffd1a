using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using HybridRL.Benchmarks;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl bench [GROUP...] [--json] [--quick]`: speed figures, as ratios measured in one run.</summary>
public static class BenchCommand
{
    public static Command Create()
    {
        var groups = new Argument<string[]>("group") { Description = $"Groups to run: {string.Join(", ", BenchmarkSuite.Groups)} (default: all).", Arity = ArgumentArity.ZeroOrMore };
        var json = new Option<bool>("--json") { Description = "Print one JSON object {group: {figure: value}}." };
        var quick = new Option<bool>("--quick") { Description = "Short measurements (smoke test; figures are rough)." };
        var command = new Command("bench", "Measure speed: the simulator against a memory copy and against plain tensor ops, the adjoint gradient against a forward pass, models, training and checkpoints.")
        {
            groups, json, quick,
        };
        command.SetAction(result =>
        {
            var chosen = result.GetValue(groups) is { Length: > 0 } g ? g : BenchmarkSuite.Groups.ToArray();
            foreach (var name in chosen)
                if (!BenchmarkSuite.Groups.Contains(name))
                {
                    Console.Error.WriteLine($"error: unknown benchmark group '{name}'; one of: {string.Join(", ", BenchmarkSuite.Groups)}");
                    return ExitCodes.InvalidInput;
                }
            var all = new SortedDictionary<string, IReadOnlyDictionary<string, double>>(StringComparer.Ordinal);
            foreach (var name in chosen)
            {
                if (!result.GetValue(json)) Console.Error.WriteLine($"running {name} ...");
                all[name] = BenchmarkSuite.Run(name, result.GetValue(quick));
            }
            if (result.GetValue(json))
            {
                Console.WriteLine(JsonSerializer.Serialize(all, new JsonSerializerOptions { WriteIndented = true }));
            }
            else
            {
                foreach (var (name, figures) in all)
                {
                    Console.WriteLine(name);
                    foreach (var (k, v) in figures) Console.WriteLine($"  {k,-44} {v.ToString("G6", CultureInfo.InvariantCulture)}");
                }
            }
            return ExitCodes.Done;
        });
        return command;
    }
}
