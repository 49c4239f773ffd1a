namespace HybridRL.Experiments.Config;

/// <summary>
/// Loads experiment files, environment variables and <c>--set</c> options into one validated <see cref="ExperimentSpec"/>.
/// Precedence, lowest first: hardware profile &lt; base files (via <c>extends</c>) &lt; files in the order given
/// &lt; <c>HYBRIDRL_*</c> environment variables &lt; <c>--set</c> options. All problems are collected and thrown
/// together as one <see cref="ConfigException"/>.
/// </summary>
public static class ExperimentSpecLoader
{
    /// <summary>Validator used by the overload without one (the lead plugs the environment layer in here at start-up).</summary>
    public static IEnvironmentKeyValidator? DefaultEnvironmentValidator { get; set; }

    /// <summary>Loads with <see cref="DefaultEnvironmentValidator"/>.</summary>
    /// <exception cref="ConfigException">The configuration is invalid (all problems listed).</exception>
    public static ExperimentSpec Load(IReadOnlyList<string> files, IReadOnlyList<string> setOverrides, IDictionary<string, string> environmentVariables) =>
        Load(files, setOverrides, environmentVariables, DefaultEnvironmentValidator);

    /// <summary>Loads and validates. <paramref name="environmentValidator"/> may be null (environment parameters then pass unchecked).</summary>
    /// <exception cref="ConfigException">The configuration is invalid (all problems listed).</exception>
    public static ExperimentSpec Load(IReadOnlyList<string> files, IReadOnlyList<string> setOverrides, IDictionary<string, string> environmentVariables,
        IEnvironmentKeyValidator? environmentValidator)
    {
        ArgumentNullException.ThrowIfNull(files);
        ArgumentNullException.ThrowIfNull(setOverrides);
        ArgumentNullException.ThrowIfNull(environmentVariables);
        return new SpecResolver(files, setOverrides, environmentVariables, environmentValidator).Resolve();
    }

    /// <summary>Loads a single file with no overrides.</summary>
    public static ExperimentSpec LoadFile(string file) => Load([file], [], new Dictionary<string, string>());
}
