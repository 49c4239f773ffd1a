namespace HybridRL.Experiments.Config;

/// <summary>Typed value of every known key (explicit or default), where it came from, and the errors found so far.</summary>
internal sealed class ResolvedValues
{
    private readonly Dictionary<string, object?> _values = new(StringComparer.Ordinal);
    private readonly Dictionary<string, ConfigOrigin> _origins = new(StringComparer.Ordinal);
    private readonly HashSet<string> _explicit = new(StringComparer.Ordinal);
    private readonly HashSet<string> _failed = new(StringComparer.Ordinal);

    public ResolvedValues(List<ConfigError> errors, ConfigOrigin? fallbackOrigin)
    {
        Errors = errors;
        FallbackOrigin = fallbackOrigin;
    }

    public List<ConfigError> Errors { get; }

    /// <summary>Origin used for whole-config problems (the last experiment file).</summary>
    public ConfigOrigin? FallbackOrigin { get; }

    public void Set(string path, object? value, ConfigOrigin? origin, bool isExplicit)
    {
        _values[path] = value;
        if (origin is not null) _origins[path] = origin;
        if (isExplicit) _explicit.Add(path);
    }

    public void MarkFailed(string path) => _failed.Add(path);

    public bool Failed(params string[] paths) => paths.Any(_failed.Contains);

    public bool IsExplicit(string path) => _explicit.Contains(path);

    public ConfigOrigin? Origin(string path) => _origins.GetValueOrDefault(path);

    public object? Raw(string path) => _values[path];

    public long Int(string path) => (long)_values[path]!;
    public int Int32(string path) => checked((int)(long)_values[path]!);
    public double Num(string path) => (double)_values[path]!;
    public double? NumOrNull(string path) => (double?)_values[path];
    public bool Bool(string path) => (bool)_values[path]!;
    public string Text(string path) => (string?)_values[path] ?? "";
    public string ChoiceText(string path) => (string?)_values[path] ?? "";
    public T Choice<T>(string path) where T : struct, Enum => ChoiceNames.Parse<T>((string)_values[path]!);
    public EquatableList<int> Ints(string path) => new(((EquatableList<long>)_values[path]!).Select(v => checked((int)v)));
    public EquatableList<T> Choices<T>(string path) where T : struct, Enum =>
        new(((EquatableList<string>)_values[path]!).Select(ChoiceNames.Parse<T>));

    /// <summary>Whether a key applies given the current choices (all its conditions hold, recursively).</summary>
    public bool Applies(string path)
    {
        var key = ConfigKeyTable.Find(path) ?? throw new ArgumentException($"unknown key {path}");
        return key.AppliesWhen.All(c => Applies(c.Key) && c.Values.Contains(ChoiceText(c.Key)));
    }

    /// <summary>Adds an error located at <paramref name="path"/>'s origin (or, for a default, at <paramref name="alternative"/>'s or the fallback).</summary>
    public void Error(string path, string message, string? alternative = null)
    {
        var origin = Origin(path) ?? (alternative is null ? null : Origin(alternative)) ?? FallbackOrigin;
        Errors.Add(new ConfigError(path, origin?.Source, origin?.Line, message));
    }
}
