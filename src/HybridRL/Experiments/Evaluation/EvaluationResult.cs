using System.Text.Json;
using System.Text.Json.Serialization;

namespace HybridRL.Experiments.Evaluation;

/// <summary>One greedy evaluation of a stored agent (the content of <c>eval-&lt;label&gt;.json</c>).</summary>
public sealed record EvaluationResult
{
    [JsonPropertyName("label")] public required string Label { get; init; }
    [JsonPropertyName("run_id")] public required string RunId { get; init; }
    /// <summary>What was asked for (best or latest).</summary>
    [JsonPropertyName("checkpoint")] public required string Checkpoint { get; init; }
    /// <summary>File name of the checkpoint loaded.</summary>
    [JsonPropertyName("checkpoint_file")] public required string CheckpointFile { get; init; }
    [JsonPropertyName("checkpoint_step")] public required long CheckpointStep { get; init; }
    /// <summary>Why another checkpoint than the requested kind was used; null otherwise.</summary>
    [JsonPropertyName("checkpoint_note")] public string? CheckpointNote { get; init; }
    [JsonPropertyName("parameter_section")] public required string ParameterSection { get; init; }
    [JsonPropertyName("episodes")] public required int Episodes { get; init; }
    [JsonPropertyName("mean")] public required double Mean { get; init; }
    /// <summary>Sample standard deviation (n − 1); 0 for one episode.</summary>
    [JsonPropertyName("std")] public required double Std { get; init; }
    [JsonPropertyName("min")] public required double Min { get; init; }
    [JsonPropertyName("max")] public required double Max { get; init; }
    [JsonPropertyName("returns")] public required IReadOnlyList<double> Returns { get; init; }
    [JsonPropertyName("env_steps")] public required long EnvSteps { get; init; }
    [JsonPropertyName("circuit_executions")] public required long CircuitExecutions { get; init; }
    [JsonPropertyName("shots")] public required long Shots { get; init; }
    /// <summary>Config keys that differ from the run's config.yaml: key → {before, after}.</summary>
    [JsonPropertyName("settings_changed")] public required IReadOnlyDictionary<string, ChangedSetting> SettingsChanged { get; init; }
    [JsonPropertyName("config_hash")] public required string ConfigHash { get; init; }
    [JsonPropertyName("episode_seeds")] public required string EpisodeSeeds { get; init; }

    private static readonly JsonSerializerOptions Json = new() { WriteIndented = true, DefaultIgnoreCondition = JsonIgnoreCondition.Never };

    public string ToJson() => JsonSerializer.Serialize(this, Json);

    public static EvaluationResult FromJson(string json) =>
        JsonSerializer.Deserialize<EvaluationResult>(json, Json) ?? throw new InvalidDataException("evaluation file is empty");
}
