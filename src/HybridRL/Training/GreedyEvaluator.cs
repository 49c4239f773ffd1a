using HybridRL.Environments;
using HybridRL.Models;
using HybridRL.Quantum.Randomness;
using HybridRL.Training.DeepQ;

namespace HybridRL.Training;

/// <summary>
/// Greedy evaluation on its own environment copy: the same fixed episode seeds every time
/// (derived from the root seed), so evaluations are comparable across training and across methods.
/// </summary>
public sealed class GreedyEvaluator
{
    private readonly IEnvironment _env;
    private readonly ulong[] _seeds;
    private readonly double[] _obs;
    private readonly double[] _q;

    public GreedyEvaluator(IEnvironment env, int episodes, ulong rootSeed)
    {
        if (episodes <= 0) throw new ArgumentOutOfRangeException(nameof(episodes), episodes, "evaluation episodes must be positive");
        _env = env;
        _seeds = new ulong[episodes];
        for (int k = 0; k < episodes; k++) _seeds[k] = RandomStream.SeedFor(rootSeed, "evaluation-episodes", k);
        _obs = new double[env.ObservationSize];
        _q = new double[env.ActionCount];
    }

    public int Episodes => _seeds.Length;

    /// <summary>Mean undiscounted return of the greedy policy of <paramref name="model"/>; counts steps in <paramref name="steps"/>.</summary>
    public double Evaluate(IAgentModel model, out long steps)
    {
        steps = 0;
        double total = 0;
        foreach (var seed in _seeds)
        {
            _env.Reset(seed, _obs);
            double ret = 0;
            while (true)
            {
                model.ForwardNoGrad(_obs, 1, _q);
                var r = _env.Step(BellmanTargets.ArgMax(_q), _obs);
                steps++;
                ret += r.Reward;
                if (r.Terminal || r.Truncated) break;
            }
            total += ret;
        }
        return total / _seeds.Length;
    }
}
