using System.CommandLine;
using HybridRL.Analysis;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl compare RUNS_OR_SWEEP...`: groups runs by a config key and compares their learning curves and final returns.</summary>
public static class CompareCommand
{
    public static Command Create()
    {
        var inputs = new Argument<string[]>("runs") { Description = "Run folders and/or sweep folders (every run folder below them is used).", Arity = ArgumentArity.OneOrMore };
        var by = new Option<string>("--by") { Description = "Config key whose value names a run's group.", DefaultValueFactory = _ => "trainer.kind" };
        var x = new Option<string>("--x") { Description = "Curve axis: env_steps, episodes, circuit_executions, hardware_executions (equal device budget), shots, wall_seconds.", DefaultValueFactory = _ => "env_steps" };
        var threshold = new Option<double?>("--threshold") { Description = "Return threshold: report the axis value at which each run first reaches it." };
        var outDir = new Option<string>("--out") { Description = "Folder for comparison.md, comparison*.csv and plots.", DefaultValueFactory = _ => "comparison" };
        var metric = new Option<string>("--metric") { Description = "Return column: auto (eval_return, else train_return, else fitness_mean) or a metrics.csv column.", DefaultValueFactory = _ => "auto" };
        var resamples = new Option<int>("--resamples") { Description = "Bootstrap resamples.", DefaultValueFactory = _ => 2000 };
        var seed = new Option<ulong>("--seed") { Description = "Seed of the bootstrap resampling.", DefaultValueFactory = _ => 0 };
        var profile = new Option<string?>("--hardware-profile") { Description = "Hardware profile YAML for estimated device time and cost (estimates, not vendor quotes)." };
        var shots = new Option<double?>("--shots-per-execution") { Description = "Shots per circuit execution for the hardware estimate (default: each run's ledger)." };
        var stratify = new Option<string?>("--stratify-by") { Description = "Config key whose values are bootstrap strata inside a group (e.g. environment.kind)." };
        var noPlots = new Option<bool>("--no-plots") { Description = "Write tables only." };
        var command = new Command("compare", "Compare runs grouped by a config key: learning curves aligned on one axis, final returns with bootstrap intervals, pairwise tests, plots.")
        {
            inputs, by, x, threshold, outDir, metric, resamples, seed, profile, shots, stratify, noPlots,
        };
        command.SetAction(r => InputErrors.Guard(() =>
        {
            var result = Comparison.Run(new ComparisonOptions
            {
                Inputs = r.GetValue(inputs)!,
                By = r.GetValue(by)!,
                Axis = CurveAxes.Parse(r.GetValue(x)!),
                Threshold = r.GetValue(threshold),
                OutDir = r.GetValue(outDir)!,
                Metric = r.GetValue(metric)!,
                Resamples = r.GetValue(resamples),
                Seed = r.GetValue(seed),
                HardwareProfilePath = r.GetValue(profile),
                ShotsPerExecution = r.GetValue(shots),
                StratifyBy = r.GetValue(stratify),
                WritePlots = !r.GetValue(noPlots),
            });
            Console.Write(result.TerminalTable);
            Console.WriteLine();
            Console.WriteLine($"wrote {result.Files.Count} file(s) to {Path.GetFullPath(r.GetValue(outDir)!)}:");
            foreach (var f in result.Files) Console.WriteLine("  " + f);
            return ExitCodes.Done;
        }));
        return command;
    }
}
