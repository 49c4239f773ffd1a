namespace HybridRL.Experiments.Executors;

/// <summary>One run's result in <c>sweep run</c>: its exit code when a child ran (null otherwise) and how long it took.</summary>
public sealed record LocalRunOutcome(int Index, string RunId, LocalRunResult Result, int? ExitCode, TimeSpan Elapsed);
