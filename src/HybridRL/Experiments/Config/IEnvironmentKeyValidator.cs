namespace HybridRL.Experiments.Config;

/// <summary>
/// Hook through which the environment layer checks the free-form <c>environment</c> parameters and tells the
/// configuration layer the shape of the environment (for encoding checks). Plug it in with
/// <see cref="ExperimentSpecLoader.DefaultEnvironmentValidator"/> or pass it to
/// <see cref="ExperimentSpecLoader.Load(IReadOnlyList{string}, IReadOnlyList{string}, IDictionary{string, string}, IEnvironmentKeyValidator?)"/>.
/// </summary>
public interface IEnvironmentKeyValidator
{
    /// <summary>Problems with the parameters of environment <paramref name="kind"/> (unknown keys, bad values); empty when fine.</summary>
    /// <param name="kind">One of <see cref="ConfigKeyTable.EnvironmentKinds"/>.</param>
    /// <param name="parameters">Parameters relative to the section (see <see cref="EnvironmentSettings.Parameters"/>).</param>
    IReadOnlyList<EnvironmentParameterProblem> Validate(string kind, IReadOnlyDictionary<string, string> parameters);

    /// <summary>Observation size, action count and discrete state count of the configured environment, or null when unknown.
    /// Called only when <see cref="Validate"/> found no problems.</summary>
    EnvironmentShape? DescribeShape(string kind, IReadOnlyDictionary<string, string> parameters);
}
