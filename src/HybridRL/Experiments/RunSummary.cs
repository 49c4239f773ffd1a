using System.Text.Json;
using System.Text.Json.Serialization;

namespace HybridRL.Experiments;

/// <summary>The contents of <c>summary.json</c>, written when a run finishes its budget.</summary>
public sealed record RunSummary
{
    [JsonPropertyName("run_id")] public required string RunId { get; init; }
    [JsonPropertyName("name")] public required string Name { get; init; }
    [JsonPropertyName("trainer")] public required string Trainer { get; init; }
    [JsonPropertyName("status")] public string Status { get; init; } = "done";
    [JsonPropertyName("stopped_by")] public string? StoppedBy { get; init; }
    [JsonPropertyName("final_return")] public double? FinalReturn { get; init; }
    [JsonPropertyName("final_eval_episodes")] public int FinalEvalEpisodes { get; init; }
    [JsonPropertyName("best_return")] public double? BestReturn { get; init; }
    [JsonPropertyName("env_steps")] public long EnvSteps { get; init; }
    [JsonPropertyName("episodes")] public long Episodes { get; init; }
    [JsonPropertyName("updates")] public long Updates { get; init; }
    [JsonPropertyName("generations")] public long Generations { get; init; }
    [JsonPropertyName("circuit_executions")] public long CircuitExecutions { get; init; }
    [JsonPropertyName("shots")] public long Shots { get; init; }
    [JsonPropertyName("hardware_executions")] public long HardwareExecutions { get; init; }
    [JsonPropertyName("wall_seconds")] public double WallSeconds { get; init; }
    [JsonPropertyName("parameter_count")] public long ParameterCount { get; init; }
    [JsonPropertyName("parameter_counts")] public required IReadOnlyDictionary<string, int> ParameterCounts { get; init; }
    [JsonPropertyName("config_hash")] public required string ConfigHash { get; init; }
    [JsonPropertyName("ledger")] public required IReadOnlyDictionary<string, object?> Ledger { get; init; }

    public static readonly JsonSerializerOptions Json = new() { WriteIndented = true, DefaultIgnoreCondition = JsonIgnoreCondition.Never };

    public string ToJson() => JsonSerializer.Serialize(this, Json);
}
