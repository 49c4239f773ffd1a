using HybridRL.Environments;
using HybridRL.Experiments.Config;

namespace HybridRL.Experiments.Inspection;

/// <summary>Exact value iteration for the environment of an experiment (what <c>hybridrl env solve CONFIG</c> prints).</summary>
public static class EnvironmentSolver
{
    /// <summary>Discount used when the experiment has none (no DQN trainer): 0.99 (common practice).</summary>
    public const double FallbackGamma = 0.99;

    /// <summary>trainer.dqn.gamma when the trainer is DQN, else <see cref="FallbackGamma"/>.</summary>
    public static double DefaultGamma(ExperimentSpec spec)
    {
        ArgumentNullException.ThrowIfNull(spec);
        return spec.Trainer.Dqn?.Gamma ?? FallbackGamma;
    }

    /// <summary>
    /// Solves the experiment's environment with discount <paramref name="gamma"/> (default <see cref="DefaultGamma"/>).
    /// A discount outside (0, 1] is a <see cref="ConfigException"/> naming <c>--gamma</c>; an environment without an
    /// exact tabular model an <see cref="EnvironmentConfigException"/> naming the solvable kinds.
    /// </summary>
    public static TabularSolution Solve(ExperimentSpec spec, double? gamma = null)
    {
        ArgumentNullException.ThrowIfNull(spec);
        double g = gamma ?? DefaultGamma(spec);
        if (!(g > 0 && g <= 1))
            throw new ConfigException([new ConfigError("--gamma", null, null, $"--gamma = {g.ToString("R", System.Globalization.CultureInfo.InvariantCulture)} must be in (0, 1]")]);
        var settings = EnvironmentParameters.Parse(spec.Environment.Kind, spec.Environment.Parameters);
        return TabularSolution.Solve(settings, g);
    }
}
