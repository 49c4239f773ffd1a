using System.CommandLine;
using HybridRL.Experiments.Estimation;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl estimate CONFIG_OR_SWEEP`: calibrates the real training briefly and predicts wall time, memory, checkpoint size and a Slurm --time.</summary>
public static class EstimateCommand
{
    public static Command Create()
    {
        var files = new Argument<string[]>("config-or-sweep") { Description = "Experiment file(s) (later override earlier), or one sweep file.", Arity = ArgumentArity.OneOrMore };
        var set = ConfigOptions.Set();
        var seconds = new Option<double>("--calibration-seconds") { Description = "Seconds of real training per calibrated configuration.", DefaultValueFactory = _ => 5 };
        var factor = new Option<double>("--time-factor") { Description = "Safety factor on the predicted time for the Slurm --time suggestion.", DefaultValueFactory = _ => 1.5 };
        var margin = new Option<double>("--time-margin-minutes") { Description = "Minutes added after the factor.", DefaultValueFactory = _ => 5 };
        var command = new Command("estimate", "Train briefly on this node and predict wall time, peak memory and checkpoint size for the full budget (a sweep: every run), with a Slurm --time suggestion.")
        {
            files, set, seconds, factor, margin,
        };
        command.SetAction(r => InputErrors.Guard(() =>
        {
            var paths = r.GetValue(files)!;
            var sets = r.GetValue(set) ?? [];
            var options = new EstimationOptions { CalibrationSeconds = r.GetValue(seconds), TimeFactor = r.GetValue(factor), TimeMarginMinutes = r.GetValue(margin) };
            options.Validate();
            if (CostEstimator.IsSweepFile(paths[0]))
            {
                if (paths.Length > 1) throw new ArgumentException($"{paths[0]} is a sweep file: give it alone (its base experiment is named inside it)");
                var plan = SweepPlan.Load(paths[0]);
                Console.Write(CostEstimateText.Format(CostEstimator.EstimateSweep(plan, sets, ConfigOptions.EnvironmentVariables(), options)));
            }
            else
            {
                var spec = ConfigOptions.Load(paths, sets);
                Console.Write(CostEstimateText.Format(CostEstimator.EstimateRun(spec, string.Join(" + ", paths), options)));
            }
            return ExitCodes.Done;
        }));
        return command;
    }
}
