using System.Text.Json.Serialization;

namespace HybridRL.Experiments.Evaluation;

/// <summary>One config key whose value an evaluation changed relative to the run's config.yaml.</summary>
public sealed record ChangedSetting([property: JsonPropertyName("before")] string? Before, [property: JsonPropertyName("after")] string? After);
