using HybridRL.Experiments.Config;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// Budget of each sweep run for <see cref="SweepPlanTable"/>: the run's overrides are applied to the base experiment through the
/// real config loader (defaults, layering, validation), and every non-zero <c>experiment.budget.*</c> limit is reported. A run
/// whose config is invalid throws <see cref="SweepFileException"/> naming the run and the config error, so <c>sweep plan</c>
/// catches bad overrides before anything is submitted.
/// </summary>
public sealed class SpecBudgetResolver(string baseConfigPath, IDictionary<string, string> environmentVariables)
{
    public const string EnvSteps = "experiment.budget.env_steps";
    public const string Episodes = "experiment.budget.episodes";
    public const string Generations = "experiment.budget.generations";
    public const string CircuitExecutions = "experiment.budget.circuit_executions";
    public const string WallSeconds = "experiment.budget.wall_seconds";

    /// <summary>The resolved spec of <paramref name="run"/>.</summary>
    public ExperimentSpec Spec(SweepRun run)
    {
        try
        {
            return ExperimentSpecLoader.Load([baseConfigPath], run.OverrideStrings, environmentVariables);
        }
        catch (ConfigException e)
        {
            throw new SweepFileException($"run {run.Index} ({run.Id}, {string.Join(" ", run.OverrideStrings)}): {e.Message}", e) { FilePath = baseConfigPath };
        }
    }

    /// <summary>The run's non-zero budget limits by config key (0 means unlimited and is left out).</summary>
    public IReadOnlyDictionary<string, double> Resolve(SweepRun run)
    {
        var b = Spec(run).Experiment.Budget;
        var result = new Dictionary<string, double>(StringComparer.Ordinal);
        if (b.EnvSteps > 0) result[EnvSteps] = b.EnvSteps;
        if (b.Episodes > 0) result[Episodes] = b.Episodes;
        if (b.Generations > 0) result[Generations] = b.Generations;
        if (b.CircuitExecutions > 0) result[CircuitExecutions] = b.CircuitExecutions;
        if (b.WallSeconds > 0) result[WallSeconds] = b.WallSeconds;
        return result;
    }
}
