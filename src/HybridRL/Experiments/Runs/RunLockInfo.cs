using System.Text.Json.Serialization;

namespace HybridRL.Experiments.Runs;

/// <summary>Content of run.lock: who holds the run (<c>{"pid","host","started","heartbeat"}</c>).</summary>
public sealed record RunLockInfo(
    [property: JsonPropertyName("pid")] int Pid,
    [property: JsonPropertyName("host")] string Host,
    [property: JsonPropertyName("started")] DateTime Started,
    [property: JsonPropertyName("heartbeat")] DateTime? Heartbeat = null)
{
    /// <summary>The most recent sign of life: the heartbeat if any, else the start time.</summary>
    [JsonIgnore]
    public DateTime LastSeenUtc => (Heartbeat is { } h && h > Started ? h : Started).ToUniversalTime();

    public override string ToString() => $"pid {Pid} on host '{Host}' (started {Started.ToUniversalTime():O})";
}
