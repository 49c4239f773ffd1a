using HybridRL.Quantum.Randomness;

namespace HybridRL.Environments;

/// <summary>
/// Slippery warehouse (our own scenario): a robot on a warehouse floor map must reach a charging dock. Some floor
/// tiles are open hatches (holes) that end the episode; each move slips sideways with the Russell &amp; Norvig model
/// (<see cref="GridMoves"/>); every step costs a little. Reaching the dock or a hole is terminal; reaching
/// <c>max_steps</c> truncates. Actions: 0 north, 1 east, 2 south, 3 west. With <c>start: random</c> an episode starts on
/// any non-terminal cell (drawn from the episode's seed), otherwise on a start cell of the map.
/// </summary>
public sealed class SlipperyWarehouseEnvironment : IEnvironment
{
    private const int FormatVersion = 1;
    private readonly SlipperyWarehouseSettings _settings;
    private readonly GridMap _map;
    private readonly int[] _starts;
    private readonly int _bits;
    private RandomStream? _rng;
    private int _state = -1;
    private int _steps;
    private bool _done;

    public SlipperyWarehouseEnvironment(SlipperyWarehouseSettings settings)
    {
        _settings = settings ?? throw new ArgumentNullException(nameof(settings));
        _map = settings.Map;
        _starts = Enumerable.Range(0, _map.StateCount)
            .Where(s => settings.RandomStart ? _map.CellOfState(s) is not (GridCell.Goal or GridCell.Hole) : _map.CellOfState(s) == GridCell.Start).ToArray();
        _bits = Math.Max(1, (int)Math.Ceiling(Math.Log2(_map.StateCount)));
        ObservationSize = settings.Observation switch
        {
            GridObservation.OneHot => _map.StateCount,
            GridObservation.Binary => _bits,
            GridObservation.Index => 1,
            _ => 2,
        };
    }

    public string Name => SlipperyWarehouseSettings.KindName;
    public GridMap Map => _map;
    public int ObservationSize { get; }
    public int ActionCount => GridMoves.ActionCount;
    public bool ObservationIsBinary => _settings.Observation is GridObservation.OneHot or GridObservation.Binary;
    public int StateCount => _map.StateCount;
    public int StateIndex => _state;
    public bool ObservationIsFunctionOfState => true;
    public bool SupportsStateSave => true;
    public int StepCount => _steps;

    /// <summary>The exact tabular model of this task (for value iteration and policy evaluation).</summary>
    public TabularModel ToTabularModel() => _settings.ToTabularModel();

    public void Reset(ulong seed, Span<double> observation)
    {
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        _rng = new RandomStream(seed);
        _state = _starts.Length == 1 ? _starts[0] : _starts[_rng.NextInt(_starts.Length)];
        _steps = 0;
        _done = false;
        WriteObservation(observation);
    }

    public StepResult Step(int action, Span<double> observation)
    {
        if (_rng is null) throw new InvalidOperationException($"{Name}: call Reset before Step");
        if (_done) throw new InvalidOperationException($"{Name}: the episode is over; call Reset");
        if ((uint)action >= GridMoves.ActionCount) throw new ArgumentOutOfRangeException(nameof(action), action, "actions are 0..3 (north, east, south, west)");
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        int outcome = GridMoves.SampleOutcome(_rng.NextDouble(), _settings.SlipProbability);
        _state = GridMoves.Move(_map, _state, GridMoves.Direction(action, outcome));
        _steps++;
        var cell = _map.CellOfState(_state);
        double reward = _settings.Rewards.For(cell);
        bool terminal = cell is GridCell.Goal or GridCell.Hole;
        bool truncated = !terminal && _steps >= _settings.MaxSteps;
        _done = terminal || truncated;
        WriteObservation(observation);
        return new StepResult(reward, terminal, truncated);
    }

    public void WriteObservation(Span<double> observation)
    {
        if (_state < 0) throw new InvalidOperationException($"{Name}: call Reset first");
        WriteObservationOf(_state, observation);
    }

    /// <summary>
    /// Writes the observation the agent would see in tabular state <paramref name="state"/> (the state numbering of
    /// <see cref="ToTabularModel"/>), without changing the episode. Used to read a greedy policy table off a model.
    /// </summary>
    public void WriteObservationOf(int state, Span<double> observation)
    {
        if ((uint)state >= (uint)_map.StateCount)
            throw new ArgumentOutOfRangeException(nameof(state), state, $"{Name}: states are 0..{_map.StateCount - 1}");
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        var o = observation[..ObservationSize];
        switch (_settings.Observation)
        {
            case GridObservation.OneHot:
                o.Clear();
                o[state] = 1;
                break;
            case GridObservation.Binary:
                // Most significant bit first.
                for (int i = 0; i < _bits; i++) o[i] = (state >> (_bits - 1 - i)) & 1;
                break;
            case GridObservation.Index:
                o[0] = state;
                break;
            default:
                o[0] = _map.Height > 1 ? _map.RowOf(state) / (double)(_map.Height - 1) : 0;
                o[1] = _map.Width > 1 ? _map.ColumnOf(state) / (double)(_map.Width - 1) : 0;
                break;
        }
    }

    public void SaveState(BinaryWriter writer)
    {
        StateFormat.WriteHeader(writer, Name, FormatVersion);
        writer.Write(_map.StateCount);
        writer.Write(_state);
        writer.Write(_steps);
        writer.Write(_done);
        StateFormat.WriteRandom(writer, _rng);
    }

    public void LoadState(BinaryReader reader)
    {
        StateFormat.ReadHeader(reader, Name, FormatVersion);
        int states = reader.ReadInt32();
        if (states != _map.StateCount) throw new InvalidDataException($"{Name}: saved state is for a map with {states} states, this map has {_map.StateCount}");
        int state = reader.ReadInt32();
        if (state < -1 || state >= states) throw new InvalidDataException($"{Name}: saved state index {state} is out of range");
        _state = state;
        _steps = reader.ReadInt32();
        _done = reader.ReadBoolean();
        _rng = StateFormat.ReadRandom(reader, _rng);
    }

    public void Dispose() { }
}
