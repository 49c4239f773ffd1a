namespace HybridRL.Experiments.Sweeps;

/// <summary>The state of one run folder and a short human-readable reason (e.g. "pid 123 on node7").</summary>
public sealed record RunFolderStatus(RunFolderState State, string Detail);
