using System.Collections;

namespace HybridRL.Experiments.Config;

/// <summary>Immutable string dictionary (ordinal keys, sorted) with value equality.</summary>
public sealed class EquatableStringMap : IReadOnlyDictionary<string, string>, IEquatable<EquatableStringMap>
{
    private readonly SortedDictionary<string, string> _map;

    public EquatableStringMap(IEnumerable<KeyValuePair<string, string>> entries)
    {
        _map = new SortedDictionary<string, string>(StringComparer.Ordinal);
        foreach (var (k, v) in entries) _map[k] = v;
    }

    public static EquatableStringMap Empty { get; } = new(Array.Empty<KeyValuePair<string, string>>());

    public string this[string key] => _map[key];
    public IEnumerable<string> Keys => _map.Keys;
    public IEnumerable<string> Values => _map.Values;
    public int Count => _map.Count;
    public bool ContainsKey(string key) => _map.ContainsKey(key);
    public bool TryGetValue(string key, out string value) => _map.TryGetValue(key, out value!);
    public IEnumerator<KeyValuePair<string, string>> GetEnumerator() => _map.GetEnumerator();
    IEnumerator IEnumerable.GetEnumerator() => _map.GetEnumerator();

    public bool Equals(EquatableStringMap? other) =>
        other is not null && _map.Count == other._map.Count
        && _map.All(kv => other._map.TryGetValue(kv.Key, out var v) && string.Equals(v, kv.Value, StringComparison.Ordinal));

    public override bool Equals(object? obj) => Equals(obj as EquatableStringMap);

    public override int GetHashCode()
    {
        var hash = new HashCode();
        foreach (var (k, v) in _map) { hash.Add(k, StringComparer.Ordinal); hash.Add(v, StringComparer.Ordinal); }
        return hash.ToHashCode();
    }
}
