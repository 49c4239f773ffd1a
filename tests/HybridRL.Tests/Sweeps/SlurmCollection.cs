namespace HybridRL.Tests.Sweeps;

/// <summary>
/// The Slurm tests share one small node (2 CPUs): run them one after another so one test's array cannot hold the CPUs
/// another test's requeued task waits for. They still run beside the other test classes.
/// </summary>
[CollectionDefinition(Name)]
public sealed class SlurmCollection
{
    public const string Name = "slurm";
}
