using System.Text.RegularExpressions;

namespace HybridRL.Experiments.Config;

/// <summary>Turns environment variables and <c>--set</c> options into override layers.</summary>
public static partial class OverrideLayers
{
    /// <summary>Prefix of environment variables that set configuration keys.</summary>
    public const string EnvironmentPrefix = "HYBRIDRL_";

    [GeneratedRegex("^[a-z][a-z0-9_]*(\\.[a-z0-9_]+)+$")]
    private static partial Regex SetKeyPattern();

    /// <summary>
    /// <c>HYBRIDRL_TRAINER__DQN__LEARNING_RATE=0.01</c> → <c>trainer:dqn:learning_rate</c>. Double underscore separates
    /// sections; names are lower-cased. Variables with the prefix but without any "__" are not configuration keys
    /// (they are left for other tool settings) and are ignored here.
    /// </summary>
    public static OverrideConfigurationSource FromEnvironment(IDictionary<string, string> variables)
    {
        var entries = new List<(string, string?, ConfigOrigin)>();
        foreach (var (name, value) in variables.OrderBy(kv => kv.Key, StringComparer.Ordinal))
        {
            if (!name.StartsWith(EnvironmentPrefix, StringComparison.Ordinal)) continue;
            var rest = name[EnvironmentPrefix.Length..];
            if (!rest.Contains("__", StringComparison.Ordinal)) continue;
            var key = string.Join(':', rest.Split("__").Select(s => s.ToLowerInvariant()));
            entries.Add((key, NullIfTilde(value), new ConfigOrigin("environment variable " + name, null)));
        }
        return new OverrideConfigurationSource(entries);
    }

    /// <summary>
    /// Parses <c>section.key=value</c> options (later ones win). Syntax problems are added to <paramref name="errors"/>.
    /// A value of <c>~</c> or <c>null</c> removes the key (falls back to the default).
    /// </summary>
    public static OverrideConfigurationSource FromSetOptions(IReadOnlyList<string> options, List<ConfigError> errors)
    {
        var entries = new List<(string, string?, ConfigOrigin)>();
        foreach (var option in options)
        {
            var eq = option.IndexOf('=');
            if (eq <= 0)
            {
                errors.Add(new ConfigError("", "--set", null,
                    $"--set expects section.key=value (e.g. --set trainer.dqn.learning_rate=0.001), got '{option}'"));
                continue;
            }
            var dotted = option[..eq].Trim();
            if (!SetKeyPattern().IsMatch(dotted))
            {
                errors.Add(new ConfigError(dotted, "--set", null,
                    $"--set expects section.key=value with a lower-case dotted key (e.g. trainer.dqn.batch_size=64), got key '{dotted}'"));
                continue;
            }
            var value = option[(eq + 1)..].Trim();
            entries.Add((dotted.Replace('.', ':'), NullIfTilde(value), new ConfigOrigin("--set", null)));
        }
        return new OverrideConfigurationSource(entries);
    }

    private static string? NullIfTilde(string value) => value is "~" or "null" ? null : value;
}
