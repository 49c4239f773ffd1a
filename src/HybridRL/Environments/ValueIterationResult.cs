namespace HybridRL.Environments;

/// <summary>Optimal values, a greedy optimal policy and the optimal expected return from the start distribution.</summary>
public sealed class ValueIterationResult
{
    internal ValueIterationResult(double gamma, double[] values, double[] actionValues, int[] policy, double startReturn, int sweeps, double finalChange)
    {
        Gamma = gamma;
        Values = values;
        ActionValues = actionValues;
        Policy = policy;
        OptimalStartReturn = startReturn;
        Sweeps = sweeps;
        FinalChange = finalChange;
    }

    public double Gamma { get; }

    /// <summary>Optimal state values V*(s) (0 for terminal states).</summary>
    public IReadOnlyList<double> Values { get; }

    /// <summary>Optimal action values Q*(s, a), flat: index s * ActionCount + a.</summary>
    public IReadOnlyList<double> ActionValues { get; }

    /// <summary>A greedy policy with respect to V* (lowest action index among ties; 0 for terminal states).</summary>
    public IReadOnlyList<int> Policy { get; }

    /// <summary>Σ_s start(s) V*(s): the optimal expected discounted return of an episode.</summary>
    public double OptimalStartReturn { get; }

    /// <summary>Number of full sweeps performed.</summary>
    public int Sweeps { get; }

    /// <summary>Largest value change in the last sweep.</summary>
    public double FinalChange { get; }
}
