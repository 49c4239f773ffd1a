using HybridRL.Experiments.Executors;

namespace HybridRL.Tests.Sweeps;

/// <summary>Test launcher: the same fixed command for every task (the index reaches it as HYBRIDRL_SWEEP_INDEX or SLURM_ARRAY_TASK_ID).</summary>
public sealed class ScriptTaskCommand(IReadOnlyList<string> argv) : ITaskCommand
{
    public IReadOnlyList<string> ForIndex(string sweepFile, int index) => argv;

    public IReadOnlyList<string> ForArrayTask(string sweepFile) => argv;
}
