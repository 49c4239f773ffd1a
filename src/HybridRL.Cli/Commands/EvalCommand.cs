using System.CommandLine;
using System.Globalization;
using HybridRL.Experiments.Evaluation;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl eval RUN_DIR`: greedy evaluation of a run's best or latest agent, optionally under other simulation settings.</summary>
public static class EvalCommand
{
    public static Command Create()
    {
        var dir = new Argument<string>("run-dir") { Description = "The run folder (runs/<name>/<run-id>)." };
        var episodes = new Option<int?>("--episodes") { Description = "Evaluation episodes (default: logging.final_eval_episodes, else the trainer's eval_episodes)." };
        var set = ConfigOptions.Set();
        set.Description = "Change a model.simulation.* or evaluation key for this evaluation, e.g. --set model.simulation.shots=100 (repeatable).";
        var checkpoint = new Option<string>("--checkpoint") { Description = "Which agent to evaluate: best or latest.", DefaultValueFactory = _ => "best" };
        checkpoint.AcceptOnlyFromAmong("best", "latest");
        var label = new Option<string?>("--label") { Description = "Name part of the result file eval-<label>.json (default: checkpoint and changed settings)." };
        var command = new Command("eval", "Evaluate a run's best (or latest) agent greedily, optionally with other shots or noise; writes eval-<label>.json into the run folder.")
        {
            dir, episodes, set, checkpoint, label,
        };
        command.SetAction(result =>
        {
            var choice = result.GetValue(checkpoint) == "latest" ? CheckpointChoice.Latest : CheckpointChoice.Best;
            var (r, path) = RunEvaluator.EvaluateAndWrite(result.GetValue(dir)!, result.GetValue(set) ?? [], choice, result.GetValue(episodes), result.GetValue(label));
            var inv = CultureInfo.InvariantCulture;
            Console.Out.WriteLine($"checkpoint: {r.CheckpointFile} (step {r.CheckpointStep}, {r.Checkpoint})");
            if (r.CheckpointNote is not null) Console.Out.WriteLine($"note: {r.CheckpointNote}");
            foreach (var (k, v) in r.SettingsChanged) Console.Out.WriteLine($"changed: {k}: {v.Before ?? "(absent)"} -> {v.After ?? "(absent)"}");
            Console.Out.WriteLine($"episodes: {r.Episodes}");
            Console.Out.WriteLine($"mean return: {r.Mean.ToString("R", inv)} (std {r.Std.ToString("G6", inv)}, min {r.Min.ToString("G6", inv)}, max {r.Max.ToString("G6", inv)})");
            Console.Out.WriteLine($"written: {path}");
            return ExitCodes.Done;
        });
        return command;
    }
}
