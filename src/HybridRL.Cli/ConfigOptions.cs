using System.Collections;
using System.CommandLine;
using HybridRL.Experiments.Config;

namespace HybridRL.Cli;

/// <summary>Options shared by commands that read experiment files: <c>--set key=value</c> (repeatable).</summary>
public static class ConfigOptions
{
    public static Option<string[]> Set() => new("--set")
    {
        Description = "Override a config key, e.g. --set trainer.dqn.learning_rate=0.005 (repeatable; wins over files and HYBRIDRL_* variables).",
        AllowMultipleArgumentsPerToken = false,
        Arity = ArgumentArity.ZeroOrMore,
    };

    /// <summary>The process environment as a dictionary (the loader picks the HYBRIDRL_ variables).</summary>
    public static IDictionary<string, string> EnvironmentVariables()
    {
        var d = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (DictionaryEntry e in Environment.GetEnvironmentVariables())
            if (e.Key is string k && e.Value is string v) d[k] = v;
        return d;
    }

    public static ExperimentSpec Load(IReadOnlyList<string> files, IReadOnlyList<string>? sets) =>
        ExperimentSpecLoader.Load(files, sets ?? [], EnvironmentVariables());
}
