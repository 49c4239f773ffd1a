namespace HybridRL.Environments;

/// <summary>
/// Value iteration (Sutton &amp; Barto 2018, ch. 4.4): in-place sweeps of the Bellman optimality
/// backup V(s) ← max_a Σ p(s'|s,a) [r + γ V(s')] until the largest change falls below the tolerance,
/// then a greedy policy. Terminal states have value 0.
/// </summary>
public static class ValueIteration
{
    /// <param name="gamma">Discount in (0, 1]. With γ = 1 every policy considered must terminate or the values diverge (then an exception is raised after <paramref name="maxSweeps"/>).</param>
    /// <param name="tolerance">Stop when a sweep changes no value by more than this.</param>
    public static ValueIterationResult Solve(TabularModel model, double gamma, double tolerance = 1e-12, int maxSweeps = 1_000_000)
    {
        ArgumentNullException.ThrowIfNull(model);
        if (!(gamma > 0 && gamma <= 1)) throw new ArgumentOutOfRangeException(nameof(gamma), gamma, "discount must be in (0, 1]");
        if (!(tolerance > 0)) throw new ArgumentOutOfRangeException(nameof(tolerance), tolerance, "tolerance must be positive");
        int n = model.StateCount, na = model.ActionCount;
        var v = new double[n];
        int sweeps = 0;
        double delta;
        do
        {
            if (sweeps >= maxSweeps)
                throw new InvalidOperationException($"value iteration did not converge within {maxSweeps} sweeps (γ = {gamma:R}); with γ = 1 some state may never terminate");
            delta = 0;
            for (int s = 0; s < n; s++)
            {
                if (model.IsTerminal(s)) continue;
                double best = double.NegativeInfinity;
                for (int a = 0; a < na; a++)
                {
                    double q = Backup(model, v, s, a, gamma);
                    if (q > best) best = q;
                }
                double change = Math.Abs(best - v[s]);
                if (change > delta) delta = change;
                v[s] = best;
            }
            sweeps++;
        } while (delta > tolerance);

        var qValues = new double[n * na];
        var policy = new int[n];
        for (int s = 0; s < n; s++)
        {
            if (model.IsTerminal(s)) continue;
            double best = double.NegativeInfinity;
            for (int a = 0; a < na; a++)
            {
                double q = Backup(model, v, s, a, gamma);
                qValues[s * na + a] = q;
                if (a == 0 || q > best + 1e-12 * Math.Max(1, Math.Abs(best))) { best = q; policy[s] = a; }
            }
        }
        double start = 0;
        var dist = model.StartDistribution;
        for (int s = 0; s < n; s++) start += dist[s] * v[s];
        return new ValueIterationResult(gamma, v, qValues, policy, start, sweeps, delta);
    }

    private static double Backup(TabularModel model, double[] v, int s, int a, double gamma)
    {
        double q = 0;
        foreach (var t in model.Transitions(s, a))
            q += t.Probability * (t.Reward + (model.IsTerminal(t.NextState) ? 0 : gamma * v[t.NextState]));
        return q;
    }
}
