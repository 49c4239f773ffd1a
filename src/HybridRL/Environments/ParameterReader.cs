using System.Globalization;

namespace HybridRL.Environments;

/// <summary>
/// Reads typed, range-checked environment parameters from a string dictionary against a table of
/// known keys and defaults. Unknown keys, malformed values and out-of-range values raise
/// <see cref="EnvironmentConfigException"/> naming the key (with a nearest-match suggestion for typos).
/// </summary>
internal sealed class ParameterReader
{
    private readonly string _kind;
    private readonly IReadOnlyDictionary<string, string> _defaults;
    private readonly IReadOnlyDictionary<string, string> _given;
    private readonly SortedDictionary<string, string> _resolved = new(StringComparer.Ordinal);

    /// <param name="passThroughPrefix">Keys starting with this prefix are accepted as free-form (e.g. <c>child.</c> for the bridge).</param>
    public ParameterReader(string kind, IReadOnlyDictionary<string, string> defaults, IReadOnlyDictionary<string, string> given, string? passThroughPrefix = null)
    {
        _kind = kind;
        _defaults = defaults;
        _given = given;
        foreach (var key in given.Keys)
        {
            if (key == "kind")
            {
                if (!string.Equals(given[key].Trim(), kind, StringComparison.Ordinal))
                    throw new EnvironmentConfigException("kind", $"environment parameter 'kind' is '{given[key]}' but the environment is being built as '{kind}'");
                continue;
            }
            if (defaults.ContainsKey(key)) continue;
            if (passThroughPrefix is not null && key.StartsWith(passThroughPrefix, StringComparison.Ordinal) && key.Length > passThroughPrefix.Length)
            {
                _resolved[key] = given[key];
                continue;
            }
            throw UnknownKey(kind, key, defaults.Keys, passThroughPrefix);
        }
    }

    /// <summary>All resolved values (given or default), including pass-through keys, sorted by key.</summary>
    public IReadOnlyDictionary<string, string> Resolved => _resolved;

    internal static EnvironmentConfigException UnknownKey(string kind, string key, IEnumerable<string> known, string? passThroughPrefix)
    {
        var list = known.OrderBy(k => k, StringComparer.Ordinal).ToList();
        string? best = Nearest(key, list);
        string suggestion = best is null ? "" : $" Did you mean '{best}'?";
        string prefix = passThroughPrefix is null ? "" : $" (keys starting with '{passThroughPrefix}' are passed to the child process)";
        return new EnvironmentConfigException(key,
            $"unknown parameter '{key}' for environment kind '{kind}'.{suggestion} Known keys: {string.Join(", ", list)}{prefix}.");
    }

    internal static string? Nearest(string key, IReadOnlyList<string> candidates)
    {
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (var c in candidates)
        {
            int d = Distance(key.ToLowerInvariant(), c.ToLowerInvariant());
            if (d < bestDistance) { bestDistance = d; best = c; }
        }
        // Suggest only plausible typos: at most a third of the longer name changed.
        return best is not null && bestDistance <= Math.Max(2, Math.Max(key.Length, best.Length) / 3) ? best : null;
    }

    /// <summary>Levenshtein edit distance (insert, delete, substitute, each cost 1).</summary>
    private static int Distance(string a, string b)
    {
        var prev = new int[b.Length + 1];
        var cur = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++) prev[j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            cur[0] = i;
            for (int j = 1; j <= b.Length; j++)
            {
                int cost = a[i - 1] == b[j - 1] ? 0 : 1;
                cur[j] = Math.Min(Math.Min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + cost);
            }
            (prev, cur) = (cur, prev);
        }
        return prev[b.Length];
    }

    private string Raw(string key)
    {
        if (!_defaults.TryGetValue(key, out var def))
            throw new InvalidOperationException($"internal: key '{key}' is not declared for kind '{_kind}'");
        string value = _given.TryGetValue(key, out var g) ? g : def;
        return value.Trim();
    }

    private void Record(string key, string value) => _resolved[key] = value;

    private EnvironmentConfigException Bad(string key, string value, string allowed) =>
        new(key, $"parameter '{key}' of environment '{_kind}' has value '{value}'; allowed: {allowed}");

    public int Int(string key, int min, int max)
    {
        string raw = Raw(key);
        if (!int.TryParse(raw, NumberStyles.Integer, CultureInfo.InvariantCulture, out int v))
            throw Bad(key, raw, $"an integer in [{min}, {max}]");
        if (v < min || v > max) throw Bad(key, raw, $"an integer in [{min}, {max}]");
        Record(key, v.ToString(CultureInfo.InvariantCulture));
        return v;
    }

    public ulong UInt64(string key)
    {
        string raw = Raw(key);
        if (!ulong.TryParse(raw, NumberStyles.Integer, CultureInfo.InvariantCulture, out ulong v))
            throw Bad(key, raw, $"an integer in [0, {ulong.MaxValue}]");
        Record(key, v.ToString(CultureInfo.InvariantCulture));
        return v;
    }

    public double Double(string key, double min, double max, bool minExclusive = false, bool maxExclusive = false)
    {
        string raw = Raw(key);
        double v = ParseDouble(key, raw, min, max, minExclusive, maxExclusive);
        Record(key, v.ToString("R", CultureInfo.InvariantCulture));
        return v;
    }

    private double ParseDouble(string key, string raw, double min, double max, bool minExclusive, bool maxExclusive)
    {
        string range = $"a number in {(minExclusive ? "(" : "[")}{Fmt(min)}, {Fmt(max)}{(maxExclusive ? ")" : "]")}";
        if (!double.TryParse(raw, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
            throw Bad(key, raw, range);
        bool ok = (minExclusive ? v > min : v >= min) && (maxExclusive ? v < max : v <= max);
        if (!ok) throw Bad(key, raw, range);
        return v;
    }

    private static string Fmt(double x) => x.ToString("R", CultureInfo.InvariantCulture);

    public bool Bool(string key)
    {
        string raw = Raw(key);
        bool v = raw.ToLowerInvariant() switch
        {
            "true" or "yes" or "on" or "1" => true,
            "false" or "no" or "off" or "0" => false,
            _ => throw Bad(key, raw, "true or false"),
        };
        Record(key, v ? "true" : "false");
        return v;
    }

    public string String(string key, bool allowEmpty = true)
    {
        string raw = Raw(key);
        if (!allowEmpty && raw.Length == 0) throw new EnvironmentConfigException(key, $"parameter '{key}' of environment '{_kind}' is required and must not be empty");
        Record(key, raw);
        return raw;
    }

    public string Choice(string key, params string[] choices)
    {
        string raw = Raw(key);
        if (Array.IndexOf(choices, raw) < 0) throw Bad(key, raw, "one of " + string.Join(", ", choices));
        Record(key, raw);
        return raw;
    }

    /// <summary>A comma-separated list of numbers, each in [min, max], with at least <paramref name="minCount"/> entries.</summary>
    public double[] DoubleList(string key, int minCount, int maxCount, double min, double max)
    {
        string raw = Raw(key);
        var parts = raw.Trim('[', ']').Split(',', StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
        if (parts.Length < minCount || parts.Length > maxCount)
            throw Bad(key, raw, $"a comma-separated list of {minCount} to {maxCount} numbers");
        var values = new double[parts.Length];
        for (int i = 0; i < parts.Length; i++) values[i] = ParseDouble(key, parts[i], min, max, false, false);
        Record(key, string.Join(",", values.Select(v => v.ToString("R", CultureInfo.InvariantCulture))));
        return values;
    }
}
