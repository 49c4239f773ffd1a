namespace HybridRL.Environments;

/// <summary>
/// Typed, immutable, validated description of an environment. Built by <see cref="EnvironmentFactory.Parse"/>
/// from a string dictionary; <see cref="Values"/> holds every key with its resolved value (defaults filled in),
/// which the config layer writes back into the resolved experiment file.
/// </summary>
public abstract class EnvironmentSettings
{
    protected EnvironmentSettings(string kind, IReadOnlyDictionary<string, string> values)
    {
        Kind = kind;
        // The reader's resolved table is handed over and never changed after parsing completes.
        Values = values;
    }

    /// <summary>Environment kind (e.g. <c>slippery-warehouse</c>).</summary>
    public string Kind { get; }

    /// <summary>All parameters with their resolved values, in invariant-culture text, sorted by key.</summary>
    public IReadOnlyDictionary<string, string> Values { get; }

    /// <summary>Builds a fresh environment instance (call <see cref="IEnvironment.Reset"/> before stepping).</summary>
    public abstract IEnvironment CreateEnvironment();

    /// <summary>The exact tabular model of the task when it has one (grid tasks); null otherwise.</summary>
    public virtual TabularModel? ToTabularModel() => null;
}
