namespace HybridRL.Training.DeepQ;

/// <summary>
/// One-step Q-learning targets. DQN (Mnih et al. 2015): y = r + γ · max_a' Q_target(s', a').
/// Double DQN (van Hasselt et al. 2016): y = r + γ · Q_target(s', argmax_a' Q_online(s', a')).
/// A terminal transition has y = r. A time-limit truncation is NOT terminal and still bootstraps.
/// </summary>
public static class BellmanTargets
{
    /// <param name="rewards">r per row.</param>
    /// <param name="terminal">true where s' is terminal (no bootstrap).</param>
    /// <param name="nextTarget">Q_target(s', ·), rows × actions.</param>
    /// <param name="nextOnline">Q_online(s', ·), rows × actions; used only when <paramref name="doubleQ"/>.</param>
    public static void Compute(
        ReadOnlySpan<double> rewards, ReadOnlySpan<bool> terminal, ReadOnlySpan<double> nextTarget, ReadOnlySpan<double> nextOnline,
        int actions, double gamma, bool doubleQ, Span<double> targets)
    {
        int rows = rewards.Length;
        for (int b = 0; b < rows; b++)
        {
            if (terminal[b])
            {
                targets[b] = rewards[b];
                continue;
            }
            var qt = nextTarget.Slice(b * actions, actions);
            double bootstrap;
            if (doubleQ)
            {
                var qo = nextOnline.Slice(b * actions, actions);
                bootstrap = qt[ArgMax(qo)];
            }
            else
            {
                bootstrap = qt[ArgMax(qt)];
            }
            targets[b] = rewards[b] + gamma * bootstrap;
        }
    }

    /// <summary>Index of the largest value; the first one on ties (deterministic).</summary>
    public static int ArgMax(ReadOnlySpan<double> values)
    {
        int best = 0;
        for (int i = 1; i < values.Length; i++)
            if (values[i] > values[best]) best = i;
        return best;
    }
}
