using Microsoft.Extensions.Configuration;

namespace HybridRL.Experiments.Config;

/// <summary>Provider for <see cref="OverrideConfigurationSource"/>.</summary>
public sealed class OverrideConfigurationProvider : ConfigurationProvider, IConfigOriginSource
{
    private readonly Dictionary<string, ConfigOrigin> _origins = new(StringComparer.OrdinalIgnoreCase);
    private readonly Dictionary<string, string?> _values = new(StringComparer.OrdinalIgnoreCase);

    public OverrideConfigurationProvider(IReadOnlyList<(string Key, string? Value, ConfigOrigin Origin)> entries)
    {
        foreach (var (key, value, origin) in entries)
        {
            _values[key] = value;
            _origins[key] = origin;
            // A section prefix set by an override points at the override too.
            var cut = key.LastIndexOf(':');
            while (cut > 0)
            {
                _origins.TryAdd(key[..cut], origin);
                cut = key.LastIndexOf(':', cut - 1);
            }
        }
    }

    public override void Load() => Data = new Dictionary<string, string?>(_values, StringComparer.OrdinalIgnoreCase);

    public IEnumerable<string> DefinedKeys => _values.Keys;

    public bool TryGetOrigin(string key, out ConfigOrigin origin) => _origins.TryGetValue(key, out origin!);
}
