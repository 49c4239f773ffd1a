using System.CommandLine;
using HybridRL.Experiments.Inspection;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl inspect CONFIG...`: parameter counts, circuit drawing and resources, executions per step/update, memory.</summary>
public static class InspectCommand
{
    public static Command Create()
    {
        var files = new Argument<string[]>("config") { Description = "Experiment file(s); later files override earlier ones.", Arity = ArgumentArity.OneOrMore };
        var set = ConfigOptions.Set();
        var json = new Option<bool>("--json") { Description = "Print the inspection as JSON." };
        var qasm = new Option<bool>("--qasm") { Description = "Include the circuit as an OpenQASM 3 program." };
        var resolved = new Option<bool>("--resolved") { Description = "Print only the resolved configuration (every key with its value and a one-line description) as YAML." };
        var command = new Command("inspect", "Show what an experiment builds and costs without training: parameter counts per component, " +
            "a drawing of the circuit, gate counts, depth, circuit executions per environment step and per update or generation, and memory.")
        {
            files, set, json, qasm, resolved,
        };
        command.SetAction(result =>
        {
            var spec = ConfigOptions.Load(result.GetValue(files)!, result.GetValue(set));
            if (result.GetValue(resolved))
            {
                Console.Out.Write(spec.ToAnnotatedYaml());
                return ExitCodes.Done;
            }
            var inspection = ExperimentInspection.Of(spec, result.GetValue(qasm));
            Console.Out.Write(result.GetValue(json) ? inspection.ToJson() + "\n" : inspection.ToText());
            return ExitCodes.Done;
        });
        return command;
    }
}
