using System.Globalization;

namespace HybridRL.Experiments.Config;

/// <summary>One known configuration key: its type, default, range and description (an entry of <see cref="ConfigKeyTable"/>).</summary>
public sealed class ConfigKey
{
    internal ConfigKey(string path, ConfigValueKind kind, object? defaultValue, string description, Func<ExperimentSpec, object?> read)
    {
        Path = path;
        Kind = kind;
        Default = defaultValue;
        Description = description;
        Read = read;
    }

    /// <summary>Dotted path, e.g. <c>trainer.dqn.batch_size</c>.</summary>
    public string Path { get; }

    /// <summary>Flattened Microsoft.Extensions.Configuration key, e.g. <c>trainer:dqn:batch_size</c>.</summary>
    public string ConfigurationKey => Path.Replace('.', ':');

    public string Section => Path[..Path.LastIndexOf('.')];
    public string Name => Path[(Path.LastIndexOf('.') + 1)..];

    public ConfigValueKind Kind { get; }

    /// <summary>Default in the internal representation (see <see cref="ConfigValueKind"/>); null = no value (optional key or derived).</summary>
    public object? Default { get; }

    public string Description { get; }

    public double? Minimum { get; internal init; }
    public double? Maximum { get; internal init; }
    public bool MinimumExclusive { get; internal init; }

    /// <summary>Allowed names for Choice and ChoiceList keys.</summary>
    public IReadOnlyList<string> Choices { get; internal init; } = Array.Empty<string>();

    /// <summary>All conditions must hold (and their keys must apply) for this key to apply.</summary>
    public IReadOnlyList<ConfigKeyCondition> AppliesWhen { get; internal init; } = Array.Empty<ConfigKeyCondition>();

    /// <summary>Changing this key does not change what a resumed run computes (budgets, logging intervals, threads).</summary>
    public bool SafeOnResume { get; internal init; }

    /// <summary>No default: the key must be given (environment.kind).</summary>
    public bool Required { get; internal init; }

    /// <summary>For list keys: the list must not be empty.</summary>
    public bool NonEmpty { get; internal init; }

    /// <summary>Reads the value back from a spec (internal representation); null = not written.</summary>
    internal Func<ExperimentSpec, object?> Read { get; }

    public string TypeText => Kind switch
    {
        ConfigValueKind.Integer => "integer",
        ConfigValueKind.Number => "number",
        ConfigValueKind.Boolean => "true|false",
        ConfigValueKind.Text => "text",
        ConfigValueKind.Choice => string.Join("|", Choices),
        ConfigValueKind.IntegerList => "list of integers",
        ConfigValueKind.ChoiceList => "list of " + string.Join("|", Choices),
        _ => Kind.ToString(),
    };

    public string RangeText
    {
        get
        {
            string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
            var lower = Minimum is { } min ? (MinimumExclusive ? "> " : ">= ") + F(min) : null;
            var upper = Maximum is { } max ? "<= " + F(max) : null;
            var range = (lower, upper) switch
            {
                (null, null) => "",
                (not null, null) => lower,
                (null, not null) => upper,
                _ => $"{lower} and {upper}",
            };
            if (Kind is ConfigValueKind.IntegerList && range.Length > 0) range = "each " + range;
            if (NonEmpty) range = range.Length > 0 ? "non-empty, " + range : "non-empty";
            return range;
        }
    }

    public string DefaultText => Required ? "(required)" : Default is null ? "(none)" : ConfigValueFormat.Format(Kind, Default);

    public override string ToString() => Path;
}
