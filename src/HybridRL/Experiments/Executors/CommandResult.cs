namespace HybridRL.Experiments.Executors;

/// <summary>Exit code and captured output of an external command (sbatch, squeue, scontrol).</summary>
public sealed record CommandResult(int ExitCode, string StandardOutput, string StandardError);
