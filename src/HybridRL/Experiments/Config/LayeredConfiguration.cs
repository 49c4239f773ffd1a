using System.Globalization;
using Microsoft.Extensions.Configuration;

namespace HybridRL.Experiments.Config;

/// <summary>
/// Layer-aware reading of a configuration root built from HybridRL providers (lowest precedence first).
/// Unlike a plain merged lookup, a list or scalar is taken whole from the highest layer that defines it,
/// so a derived file's <c>[32]</c> replaces a base file's <c>[64, 64]</c> instead of merging index by index.
/// </summary>
internal sealed class LayeredConfiguration
{
    private readonly IReadOnlyList<IConfigurationProvider> _providers;

    public LayeredConfiguration(IConfigurationRoot root)
    {
        _providers = root.Providers.ToList();
        foreach (var p in _providers)
        {
            if (p is not IConfigOriginSource)
                throw new InvalidOperationException($"Provider {p.GetType().Name} does not report value origins.");
        }
    }

    private static IConfigOriginSource Origins(IConfigurationProvider p) => (IConfigOriginSource)p;

    /// <summary>Highest layer defining <paramref name="key"/> as a value or as a parent of values; null if none.</summary>
    public LayerValue? Find(string key)
    {
        for (var i = _providers.Count - 1; i >= 0; i--)
        {
            var p = _providers[i];
            if (MaskedByAncestor(p, key)) return null; // "section: ~" in a higher layer removes the whole section below it
            var hasScalar = p.TryGet(key, out var scalar);
            var children = p.GetChildKeys(Array.Empty<string>(), key).Distinct(StringComparer.OrdinalIgnoreCase).ToList();
            if (!hasScalar && children.Count == 0) continue;
            Origins(p).TryGetOrigin(key, out var origin);
            var childValues = new List<(string Segment, string? Value, bool Nested, ConfigOrigin? Origin)>();
            foreach (var child in children)
            {
                var childKey = key + ":" + child;
                var nested = p.GetChildKeys(Array.Empty<string>(), childKey).Any();
                p.TryGet(childKey, out var v);
                Origins(p).TryGetOrigin(childKey, out var childOrigin);
                childValues.Add((child, v, nested, childOrigin));
            }
            return new LayerValue(i, hasScalar, scalar, childValues, origin);
        }
        return null;
    }

    private static bool MaskedByAncestor(IConfigurationProvider p, string key)
    {
        for (var cut = key.IndexOf(':'); cut > 0; cut = key.IndexOf(':', cut + 1))
            if (p.TryGet(key[..cut], out var v) && v is null) return true;
        return false;
    }

    /// <summary>Every flattened key any layer defines, with the origin from the highest layer defining it.</summary>
    public IReadOnlyList<(string Key, string? Value, ConfigOrigin? Origin)> AllKeys()
    {
        var result = new Dictionary<string, (string?, ConfigOrigin?)>(StringComparer.OrdinalIgnoreCase);
        foreach (var p in _providers)
        {
            foreach (var key in Origins(p).DefinedKeys)
            {
                p.TryGet(key, out var v);
                Origins(p).TryGetOrigin(key, out var o);
                result[key] = (v, o);
            }
        }
        return result.Select(kv => (kv.Key, kv.Value.Item1, kv.Value.Item2)).ToList();
    }

    /// <summary>Origin of a key or section prefix from the highest layer that knows it.</summary>
    public ConfigOrigin? OriginOf(string key)
    {
        for (var i = _providers.Count - 1; i >= 0; i--)
            if (Origins(_providers[i]).TryGetOrigin(key, out var o)) return o;
        return null;
    }

    /// <summary>
    /// Resolves a free-form subtree (the environment parameters) to flattened values relative to <paramref name="prefix"/>:
    /// mappings merge key by key across layers; a scalar or a list is taken whole from the highest layer; null removes.
    /// </summary>
    public List<(string RelativeKey, string Value, ConfigOrigin? Origin)> ResolveTree(string prefix, IReadOnlySet<string> exclude)
    {
        var result = new List<(string, string, ConfigOrigin?)>();
        var segments = new SortedSet<string>(StringComparer.Ordinal);
        foreach (var p in _providers)
            foreach (var child in p.GetChildKeys(Array.Empty<string>(), prefix))
                segments.Add(child);
        foreach (var segment in segments)
        {
            var key = prefix + ":" + segment;
            if (exclude.Contains(key)) continue;
            ResolveNode(key, prefix.Length + 1, result);
        }
        return result;
    }

    private void ResolveNode(string key, int cut, List<(string, string, ConfigOrigin?)> result)
    {
        var found = Find(key);
        if (found is null) return;
        if (found.HasScalar)
        {
            if (found.Scalar is not null) result.Add((key[cut..], found.Scalar, found.Origin));
            return;
        }
        var isList = found.Children.All(c => int.TryParse(c.Segment, NumberStyles.None, CultureInfo.InvariantCulture, out _));
        if (isList)
        {
            var p = _providers[found.Layer];
            foreach (var k in Origins(p).DefinedKeys.Where(k => k.StartsWith(key + ":", StringComparison.OrdinalIgnoreCase)).OrderBy(k => k, StringComparer.Ordinal))
            {
                if (p.TryGet(k, out var v) && v is not null)
                {
                    Origins(p).TryGetOrigin(k, out var o);
                    result.Add((k[cut..], v, o));
                }
            }
            return;
        }
        var segments = new SortedSet<string>(StringComparer.Ordinal);
        foreach (var p in _providers)
            foreach (var child in p.GetChildKeys(Array.Empty<string>(), key))
                segments.Add(child);
        foreach (var segment in segments) ResolveNode(key + ":" + segment, cut, result);
    }
}

/// <summary>What the highest defining layer holds for a key.</summary>
internal sealed record LayerValue(
    int Layer,
    bool HasScalar,
    string? Scalar,
    IReadOnlyList<(string Segment, string? Value, bool Nested, ConfigOrigin? Origin)> Children,
    ConfigOrigin? Origin);
