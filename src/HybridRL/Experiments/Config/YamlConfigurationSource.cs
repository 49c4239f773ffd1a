using Microsoft.Extensions.Configuration;

namespace HybridRL.Experiments.Config;

/// <summary>Feeds one flattened YAML file (<see cref="YamlConfigFile"/>) into Microsoft.Extensions.Configuration.</summary>
public sealed class YamlConfigurationSource : IConfigurationSource
{
    public YamlConfigurationSource(YamlConfigFile file) => File = file;

    public YamlConfigFile File { get; }

    public IConfigurationProvider Build(IConfigurationBuilder builder) => new YamlConfigurationProvider(File);
}
