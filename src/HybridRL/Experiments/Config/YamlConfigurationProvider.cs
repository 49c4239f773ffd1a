using Microsoft.Extensions.Configuration;

namespace HybridRL.Experiments.Config;

/// <summary>Configuration provider over a flattened YAML file; remembers the file and line of every value.</summary>
public sealed class YamlConfigurationProvider : ConfigurationProvider, IConfigOriginSource
{
    public YamlConfigurationProvider(YamlConfigFile file) => File = file;

    public YamlConfigFile File { get; }

    public override void Load()
    {
        Data = new Dictionary<string, string?>(File.Values, StringComparer.OrdinalIgnoreCase);
    }

    public IEnumerable<string> DefinedKeys => File.Values.Keys;

    public bool TryGetOrigin(string key, out ConfigOrigin origin) =>
        File.Origins.TryGetValue(key, out origin!);

    public override string ToString() => File.DisplayPath;
}
