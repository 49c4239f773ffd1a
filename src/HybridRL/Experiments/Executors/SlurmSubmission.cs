namespace HybridRL.Experiments.Executors;

/// <summary>Result of <c>sweep submit</c>: the script written, the indices submitted, and the job id (null for a dry run or when nothing was left to run).</summary>
public sealed record SlurmSubmission(string ScriptPath, string Script, IReadOnlyList<int> Indices, string? JobId);
