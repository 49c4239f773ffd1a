using System.CommandLine;
using HybridRL.Analysis;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl report RUN_OR_SWEEP`: a self-contained report.md with plots for a run or a sweep.</summary>
public static class ReportCommand
{
    public static Command Create()
    {
        var input = new Argument<string>("run-or-sweep") { Description = "A run folder, or a sweep folder holding run folders." };
        var outDir = new Option<string?>("--out") { Description = "Folder for report.md and its plots (default: the run or sweep folder)." };
        var x = new Option<string>("--x") { Description = "Curve axis: env_steps, episodes, circuit_executions, hardware_executions, shots, wall_seconds.", DefaultValueFactory = _ => "env_steps" };
        var profile = new Option<string?>("--hardware-profile") { Description = "Hardware profile YAML for estimated device time and cost (estimates, not vendor quotes)." };
        var shots = new Option<double?>("--shots-per-execution") { Description = "Shots per circuit execution for the hardware estimate (default: each run's ledger)." };
        var by = new Option<string>("--by") { Description = "Sweeps: config key the comparison groups by.", DefaultValueFactory = _ => "trainer.kind" };
        var threshold = new Option<double?>("--threshold") { Description = "Sweeps: return threshold for the steps-to-reach table." };
        var resamples = new Option<int>("--resamples") { Description = "Sweeps: bootstrap resamples.", DefaultValueFactory = _ => 2000 };
        var seed = new Option<ulong>("--seed") { Description = "Sweeps: seed of the bootstrap resampling.", DefaultValueFactory = _ => 0 };
        var command = new Command("report", "Write report.md (config, resources, learning curve, evaluations, hardware ledger; for a sweep also the comparison) with plots.")
        {
            input, outDir, x, profile, shots, by, threshold, resamples, seed,
        };
        command.SetAction(r => InputErrors.Guard(() =>
        {
            string path = Report.Write(r.GetValue(input)!, new ReportOptions
            {
                OutDir = r.GetValue(outDir),
                Axis = CurveAxes.Parse(r.GetValue(x)!),
                HardwareProfilePath = r.GetValue(profile),
                ShotsPerExecution = r.GetValue(shots),
                By = r.GetValue(by)!,
                Threshold = r.GetValue(threshold),
                Resamples = r.GetValue(resamples),
                Seed = r.GetValue(seed),
            });
            Console.WriteLine($"report: {path}");
            return ExitCodes.Done;
        }));
        return command;
    }
}
