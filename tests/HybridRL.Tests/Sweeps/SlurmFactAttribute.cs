using HybridRL.Experiments.Executors;

namespace HybridRL.Tests.Sweeps;

/// <summary>A fact that needs a Slurm cluster: skipped, with the reason shown, when <c>sbatch</c> is not on PATH
/// (start one with <c>scripts/local-slurm.sh start</c>).</summary>
public sealed class SlurmFactAttribute : FactAttribute
{
    public SlurmFactAttribute()
    {
        if (ProcessCommandRunner.FindOnPath("sbatch") is null)
            Skip = "sbatch is not on PATH: no Slurm here (scripts/local-slurm.sh start provides a single-node one)";
    }
}
