using HybridRL.Environments;
using HybridRL.Experiments.Config;

namespace HybridRL.Experiments;

/// <summary>Lets the config layer validate environment parameters (and learn the task's shape) through the environment layer.</summary>
public sealed class EnvironmentKeyValidator : IEnvironmentKeyValidator
{
    public IReadOnlyList<EnvironmentParameterProblem> Validate(string kind, IReadOnlyDictionary<string, string> parameters)
    {
        try
        {
            EnvironmentParameters.Parse(kind, parameters);
            return [];
        }
        catch (EnvironmentConfigException ex)
        {
            return [new EnvironmentParameterProblem(ex.Key, ex.Message)];
        }
    }

    public EnvironmentShape? DescribeShape(string kind, IReadOnlyDictionary<string, string> parameters)
    {
        if (kind == "external") return null; // finding the shape would start the child process
        try
        {
            var settings = EnvironmentParameters.Parse(kind, parameters);
            using var env = settings.CreateEnvironment();
            return new EnvironmentShape(env.ObservationSize, env.ActionCount, env.StateCount > 0 ? env.StateCount : null);
        }
        catch (EnvironmentConfigException)
        {
            return null; // reported by Validate
        }
    }
}
