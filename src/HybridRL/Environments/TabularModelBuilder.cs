namespace HybridRL.Environments;

/// <summary>
/// Collects transitions of a finite MDP and validates them into a <see cref="TabularModel"/>.
/// Transitions of one (state, action) to the same next state with the same reward are merged.
/// </summary>
public sealed class TabularModelBuilder
{
    private readonly List<Transition>[] _lists;
    private readonly bool[] _terminal;
    private readonly double[] _start;

    public TabularModelBuilder(int stateCount, int actionCount)
    {
        if (stateCount <= 0) throw new ArgumentOutOfRangeException(nameof(stateCount), stateCount, "need at least one state");
        if (actionCount <= 0) throw new ArgumentOutOfRangeException(nameof(actionCount), actionCount, "need at least one action");
        StateCount = stateCount;
        ActionCount = actionCount;
        _lists = new List<Transition>[stateCount * actionCount];
        for (int i = 0; i < _lists.Length; i++) _lists[i] = new List<Transition>(4);
        _terminal = new bool[stateCount];
        _start = new double[stateCount];
    }

    public int StateCount { get; }
    public int ActionCount { get; }

    public TabularModelBuilder AddTransition(int state, int action, int nextState, double probability, double reward)
    {
        CheckState(state, nameof(state));
        CheckState(nextState, nameof(nextState));
        if ((uint)action >= (uint)ActionCount) throw new ArgumentOutOfRangeException(nameof(action), action, $"action must be in [0, {ActionCount})");
        if (!(probability >= 0 && probability <= 1)) throw new ArgumentOutOfRangeException(nameof(probability), probability, "probability must be in [0, 1]");
        if (!double.IsFinite(reward)) throw new ArgumentOutOfRangeException(nameof(reward), reward, "reward must be finite");
        if (probability == 0) return this;
        var list = _lists[state * ActionCount + action];
        for (int i = 0; i < list.Count; i++)
        {
            if (list[i].NextState == nextState && list[i].Reward == reward)
            {
                list[i] = list[i] with { Probability = list[i].Probability + probability };
                return this;
            }
        }
        list.Add(new Transition(nextState, probability, reward));
        return this;
    }

    public TabularModelBuilder SetTerminal(int state, bool terminal = true)
    {
        CheckState(state, nameof(state));
        _terminal[state] = terminal;
        return this;
    }

    public TabularModelBuilder SetStartProbability(int state, double probability)
    {
        CheckState(state, nameof(state));
        if (!(probability >= 0 && probability <= 1)) throw new ArgumentOutOfRangeException(nameof(probability), probability, "probability must be in [0, 1]");
        _start[state] = probability;
        return this;
    }

    private void CheckState(int s, string name)
    {
        if ((uint)s >= (uint)StateCount) throw new ArgumentOutOfRangeException(name, s, $"state must be in [0, {StateCount})");
    }

    /// <summary>Validates (probabilities of each non-terminal state-action and of the start distribution sum to 1) and builds the model.</summary>
    public TabularModel Build()
    {
        const double tol = 1e-9;
        var offsets = new int[_lists.Length + 1];
        var all = new List<Transition>();
        for (int s = 0; s < StateCount; s++)
        {
            for (int a = 0; a < ActionCount; a++)
            {
                int k = s * ActionCount + a;
                offsets[k] = all.Count;
                if (_terminal[s]) continue;
                double sum = 0;
                foreach (var t in _lists[k]) sum += t.Probability;
                if (Math.Abs(sum - 1) > tol)
                    throw new InvalidOperationException($"transition probabilities of state {s}, action {a} sum to {sum:R}, not 1");
                all.AddRange(_lists[k]);
            }
        }
        offsets[_lists.Length] = all.Count;
        double startSum = _start.Sum();
        if (Math.Abs(startSum - 1) > tol) throw new InvalidOperationException($"start distribution sums to {startSum:R}, not 1");
        return new TabularModel(StateCount, ActionCount, offsets, all.ToArray(), (bool[])_terminal.Clone(), (double[])_start.Clone());
    }
}
