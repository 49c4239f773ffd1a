namespace HybridRL.Environments;

/// <summary>
/// A finite Markov decision process: states 0..StateCount-1, actions 0..ActionCount-1, for each
/// non-terminal (state, action) a list of transitions (next state, probability, reward), terminal
/// flags (absorbing, value 0) and a start-state distribution. Built with <see cref="TabularModelBuilder"/>.
/// </summary>
public sealed class TabularModel
{
    private readonly int[] _offsets;          // (StateCount*ActionCount + 1) offsets into _transitions
    private readonly Transition[] _transitions;
    private readonly bool[] _terminal;
    private readonly double[] _start;

    internal TabularModel(int stateCount, int actionCount, int[] offsets, Transition[] transitions, bool[] terminal, double[] start)
    {
        StateCount = stateCount;
        ActionCount = actionCount;
        _offsets = offsets;
        _transitions = transitions;
        _terminal = terminal;
        _start = start;
    }

    public int StateCount { get; }
    public int ActionCount { get; }

    /// <summary>Transitions for taking <paramref name="action"/> in <paramref name="state"/> (empty for terminal states).</summary>
    public ReadOnlySpan<Transition> Transitions(int state, int action)
    {
        int k = state * ActionCount + action;
        return new ReadOnlySpan<Transition>(_transitions, _offsets[k], _offsets[k + 1] - _offsets[k]);
    }

    public bool IsTerminal(int state) => _terminal[state];

    /// <summary>Probability of each state being the first state of an episode.</summary>
    public ReadOnlySpan<double> StartDistribution => _start;

    /// <summary>Expected immediate reward of (state, action).</summary>
    public double ExpectedReward(int state, int action)
    {
        double r = 0;
        foreach (var t in Transitions(state, action)) r += t.Probability * t.Reward;
        return r;
    }
}
