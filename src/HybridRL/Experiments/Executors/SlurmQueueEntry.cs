namespace HybridRL.Experiments.Executors;

/// <summary>One job or array element in the Slurm queue: job id, array index (null for a plain job), and state (PENDING, RUNNING, ...).</summary>
public sealed record SlurmQueueEntry(string JobId, int? ArrayIndex, string State);
