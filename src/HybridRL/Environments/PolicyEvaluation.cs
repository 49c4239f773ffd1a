using MathNet.Numerics.LinearAlgebra;

namespace HybridRL.Environments;

/// <summary>
/// Exact evaluation of a deterministic policy (Sutton &amp; Barto 2018, ch. 4.1): the Bellman
/// expectation equations v = r_π + γ P_π v are solved as one linear system (LU, MathNet.Numerics)
/// over the states reachable from the start distribution under the policy.
/// </summary>
public static class PolicyEvaluation
{
    /// <summary>Expected discounted return from the start distribution when following <paramref name="policy"/>.</summary>
    public static double Evaluate(TabularModel model, Func<int, int> policy, double gamma)
    {
        var values = StateValues(model, policy, gamma);
        double total = 0;
        var dist = model.StartDistribution;
        for (int s = 0; s < model.StateCount; s++)
            if (dist[s] > 0) total += dist[s] * values[s];
        return total;
    }

    /// <summary>Expected discounted return when following the policy given as a table (state → action).</summary>
    public static double Evaluate(TabularModel model, IReadOnlyList<int> policy, double gamma)
    {
        ArgumentNullException.ThrowIfNull(policy);
        if (policy.Count != model.StateCount) throw new ArgumentException($"policy has {policy.Count} entries, the model {model.StateCount} states", nameof(policy));
        return Evaluate(model, s => policy[s], gamma);
    }

    /// <summary>
    /// State values v_π(s) for states reachable from the start under the policy; NaN for states that are not reachable
    /// (the policy is only queried on reachable states). Terminal states are 0.
    /// </summary>
    public static double[] StateValues(TabularModel model, Func<int, int> policy, double gamma)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(policy);
        if (!(gamma > 0 && gamma <= 1)) throw new ArgumentOutOfRangeException(nameof(gamma), gamma, "discount must be in (0, 1]");
        int n = model.StateCount;
        var action = new int[n];
        Array.Fill(action, -1);
        // Breadth-first search of states reachable under the policy.
        var order = new List<int>();
        var index = new int[n];
        Array.Fill(index, -1);
        var queue = new Queue<int>();
        var start = model.StartDistribution;
        for (int s = 0; s < n; s++)
            if (start[s] > 0) { index[s] = order.Count; order.Add(s); queue.Enqueue(s); }
        while (queue.Count > 0)
        {
            int s = queue.Dequeue();
            if (model.IsTerminal(s)) continue;
            int a = policy(s);
            if ((uint)a >= (uint)model.ActionCount)
                throw new ArgumentException($"policy chose action {a} in state {s}; actions are 0..{model.ActionCount - 1}", nameof(policy));
            action[s] = a;
            foreach (var t in model.Transitions(s, a))
                if (index[t.NextState] < 0) { index[t.NextState] = order.Count; order.Add(t.NextState); queue.Enqueue(t.NextState); }
        }

        if (gamma == 1) CheckTerminates(model, order, action);

        int m = order.Count;
        var a0 = Matrix<double>.Build.Dense(m, m);
        var b = Vector<double>.Build.Dense(m);
        for (int i = 0; i < m; i++)
        {
            int s = order[i];
            a0[i, i] = 1;
            if (model.IsTerminal(s)) continue;
            foreach (var t in model.Transitions(s, action[s]))
            {
                b[i] += t.Probability * t.Reward;
                if (!model.IsTerminal(t.NextState)) a0[i, index[t.NextState]] -= gamma * t.Probability;
            }
        }
        var x = a0.LU().Solve(b);
        var values = new double[n];
        Array.Fill(values, double.NaN);
        for (int i = 0; i < m; i++) values[order[i]] = model.IsTerminal(order[i]) ? 0 : x[i];
        return values;
    }

    private static void CheckTerminates(TabularModel model, List<int> reachable, int[] action)
    {
        // With γ = 1 the system is singular unless every reachable state reaches a terminal state with positive probability.
        var reaches = new bool[model.StateCount];
        foreach (int s in reachable) if (model.IsTerminal(s)) reaches[s] = true;
        bool changed = true;
        while (changed)
        {
            changed = false;
            foreach (int s in reachable)
            {
                if (reaches[s]) continue;
                foreach (var t in model.Transitions(s, action[s]))
                    if (reaches[t.NextState]) { reaches[s] = true; changed = true; break; }
            }
        }
        foreach (int s in reachable)
            if (!reaches[s])
                throw new InvalidOperationException($"with discount 1 the policy never terminates from state {s}: its return is unbounded or undefined; use a discount below 1");
    }
}
