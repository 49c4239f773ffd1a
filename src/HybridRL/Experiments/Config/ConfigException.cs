namespace HybridRL.Experiments.Config;

/// <summary>
/// Thrown when an experiment configuration is invalid. Carries every problem found, not only the first.
/// The command-line layer maps it to exit code 2.
/// </summary>
public sealed class ConfigException : Exception
{
    public ConfigException(IReadOnlyList<ConfigError> errors)
        : base(BuildMessage(errors))
    {
        if (errors.Count == 0) throw new ArgumentException("A ConfigException needs at least one error.", nameof(errors));
        Errors = errors;
    }

    public IReadOnlyList<ConfigError> Errors { get; }

    private static string BuildMessage(IReadOnlyList<ConfigError> errors)
    {
        var noun = errors.Count == 1 ? "error" : "errors";
        return $"Invalid experiment configuration ({errors.Count} {noun}):" + Environment.NewLine
            + string.Join(Environment.NewLine, errors.Select(e => "  " + e));
    }
}
