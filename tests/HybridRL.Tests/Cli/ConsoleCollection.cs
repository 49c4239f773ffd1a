namespace HybridRL.Tests.Cli;

/// <summary>Tests that redirect the process-wide console run alone, not in parallel with other test classes.</summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class ConsoleCollection
{
    public const string Name = "console";
}
