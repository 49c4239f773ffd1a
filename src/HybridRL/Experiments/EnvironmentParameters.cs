using HybridRL.Environments;

namespace HybridRL.Experiments;

/// <summary>
/// Turns the environment section of an experiment spec (flattened YAML: lists arrive as
/// <c>key:0</c>, <c>key:1</c> …) into the string parameters the environment layer parses:
/// a list named <c>map</c> becomes one text map with rows separated by '/', any other list a
/// bracketed comma list.
/// </summary>
public static class EnvironmentParameters
{
    public static IReadOnlyDictionary<string, string> FromSpec(IReadOnlyDictionary<string, string> flat)
    {
        var result = new Dictionary<string, string>(StringComparer.Ordinal);
        var lists = new SortedDictionary<string, SortedDictionary<int, string>>(StringComparer.Ordinal);
        foreach (var (key, value) in flat)
        {
            int colon = key.IndexOf(':');
            if (colon > 0 && int.TryParse(key.AsSpan(colon + 1), out int index))
            {
                string name = key[..colon];
                if (!lists.TryGetValue(name, out var items)) lists[name] = items = new SortedDictionary<int, string>();
                items[index] = value;
            }
            else
            {
                result[key] = value;
            }
        }
        foreach (var (name, items) in lists)
            result[name] = name == "map" ? string.Join('/', items.Values) : "[" + string.Join(',', items.Values) + "]";
        return result;
    }

    /// <summary>Parsed, validated environment settings for a spec's environment section.</summary>
    public static HybridRL.Environments.EnvironmentSettings Parse(string kind, IReadOnlyDictionary<string, string> flat) =>
        EnvironmentFactory.Parse(kind, FromSpec(flat));
}
