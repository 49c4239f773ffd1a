using Microsoft.Extensions.Configuration;

namespace HybridRL.Experiments.Config;

/// <summary>
/// A layer of single-key overrides (environment variables or <c>--set</c> options), each with its own origin.
/// Build it with <see cref="OverrideLayers"/>.
/// </summary>
public sealed class OverrideConfigurationSource : IConfigurationSource
{
    public OverrideConfigurationSource(IReadOnlyList<(string Key, string? Value, ConfigOrigin Origin)> entries) => Entries = entries;

    /// <summary>Flattened key ("a:b"), value, origin; later entries win over earlier ones.</summary>
    public IReadOnlyList<(string Key, string? Value, ConfigOrigin Origin)> Entries { get; }

    public IConfigurationProvider Build(IConfigurationBuilder builder) => new OverrideConfigurationProvider(Entries);
}
