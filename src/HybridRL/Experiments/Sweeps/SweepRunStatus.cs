namespace HybridRL.Experiments.Sweeps;

/// <summary>One row of <c>sweep status</c>: the run, its folder state, and its Slurm state (e.g. <c>RUNNING</c> in job 123) when queued.</summary>
public sealed record SweepRunStatus(int Index, string RunId, RunFolderStatus Folder, string? SlurmJob, string? SlurmState);
