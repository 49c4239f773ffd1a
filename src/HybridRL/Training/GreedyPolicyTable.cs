using HybridRL.Environments;
using HybridRL.Models;
using HybridRL.Training.DeepQ;

namespace HybridRL.Training;

/// <summary>
/// Reads the greedy policy of a model off a tabular task: for every state, the observation the agent
/// would see there, then the action with the largest model output (first on ties, as when acting).
/// With <see cref="PolicyEvaluation"/> on the task's <see cref="TabularModel"/> this gives the exact
/// expected return of what a trainer learned, free of evaluation-episode noise.
/// </summary>
public static class GreedyPolicyTable
{
    /// <summary>Greedy action per state of <paramref name="env"/> (terminal states included; their entry is never used).</summary>
    public static int[] Extract(IAgentModel model, SlipperyWarehouseEnvironment env)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(env);
        if (model.ObservationSize != env.ObservationSize || model.OutputCount != env.ActionCount)
            throw new ArgumentException($"model maps {model.ObservationSize} inputs to {model.OutputCount} outputs, environment has {env.ObservationSize} observations and {env.ActionCount} actions");
        var obs = new double[env.ObservationSize];
        var q = new double[env.ActionCount];
        var policy = new int[env.StateCount];
        for (int s = 0; s < policy.Length; s++)
        {
            env.WriteObservationOf(s, obs);
            model.ForwardNoGrad(obs, 1, q);
            policy[s] = BellmanTargets.ArgMax(q);
        }
        return policy;
    }

    /// <summary>Exact expected discounted return from the start distribution of the greedy policy of <paramref name="model"/>.</summary>
    public static double ExactReturn(IAgentModel model, SlipperyWarehouseEnvironment env, double gamma) =>
        PolicyEvaluation.Evaluate(env.ToTabularModel(), Extract(model, env), gamma);
}
