using System.IO.Hashing;
using System.Text;

namespace HybridRL.Experiments.Config;

/// <summary>A fully resolved, validated, immutable experiment (built by <see cref="ExperimentSpecLoader"/>).</summary>
public sealed record ExperimentSpec
{
    public required ExperimentSettings Experiment { get; init; }
    public required EnvironmentSettings Environment { get; init; }
    public required ModelSettings Model { get; init; }
    public required TrainerSettings Trainer { get; init; }
    public required LoggingSettings Logging { get; init; }
    /// <summary>Null when no hardware profile was given.</summary>
    public required HardwareSettings? Hardware { get; init; }

    /// <summary>
    /// The fully resolved configuration (every applicable key, defaults included) as canonical YAML.
    /// Loading this text again yields an equal spec. Used for <c>config.yaml</c> in a run folder and for <see cref="Hash"/>.
    /// </summary>
    public string ToYaml() => SpecYamlWriter.Write(this, withDescriptions: false);

    /// <summary>Same as <see cref="ToYaml"/> with each key's one-line description as a comment.</summary>
    public string ToAnnotatedYaml() => SpecYamlWriter.Write(this, withDescriptions: true);

    /// <summary>Stable hash of the resolved configuration: xxHash64 (seed 0) of the UTF-8 canonical YAML, 16 lower-case hex digits.</summary>
    public string Hash() => XxHash64.HashToUInt64(Encoding.UTF8.GetBytes(ToYaml())).ToString("x16", System.Globalization.CultureInfo.InvariantCulture);
}
