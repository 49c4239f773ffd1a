using HybridRL.Quantum.Randomness;

namespace HybridRL.Environments;

/// <summary>
/// Survey drone (our own scenario): a drone on a grid map must find a survey target but sees only a k × k window
/// around itself, each cell one-hot over four kinds — 0 free, 1 wall (also outside the map), 2 target, 3 visited
/// (cells the drone has already flown over, its own cell included). The reward is sparse: <c>target_reward</c> on
/// reaching the target (terminal), minus an optional step cost. Maps are procedural from <c>seed_map</c> or given as
/// text. Actions: 0 north, 1 east, 2 south, 3 west (slip model of <see cref="GridMoves"/>; default no slip).
/// Feature layout: index ((dr + h) · k + (dc + h)) · 4 + kind, h = (k − 1) / 2, rows first.
/// </summary>
public sealed class SurveyDroneEnvironment : IEnvironment
{
    public const int CellKinds = 4;
    private const int FormatVersion = 1;
    private readonly SurveyDroneSettings _settings;
    private readonly GridMap _map;
    private readonly int[] _starts;
    private readonly bool[] _visited;
    private RandomStream? _rng;
    private int _state = -1;
    private int _steps;
    private bool _done;

    public SurveyDroneEnvironment(SurveyDroneSettings settings)
    {
        _settings = settings ?? throw new ArgumentNullException(nameof(settings));
        _map = settings.Map;
        _starts = Enumerable.Range(0, _map.StateCount).Where(s => _map.CellOfState(s) == GridCell.Start).ToArray();
        _visited = new bool[_map.StateCount];
        ObservationSize = settings.Window * settings.Window * CellKinds;
    }

    public string Name => SurveyDroneSettings.KindName;
    public GridMap Map => _map;
    public int ObservationSize { get; }
    public int ActionCount => GridMoves.ActionCount;
    public bool ObservationIsBinary => true;
    public int StateCount => _map.StateCount;
    public int StateIndex => _state;
    public bool ObservationIsFunctionOfState => true;
    public bool SupportsStateSave => true;
    public int StepCount => _steps;

    public TabularModel ToTabularModel() => _settings.ToTabularModel();

    public void Reset(ulong seed, Span<double> observation)
    {
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        _rng = new RandomStream(seed);
        _state = _starts.Length == 1 ? _starts[0] : _starts[_rng.NextInt(_starts.Length)];
        Array.Clear(_visited);
        _visited[_state] = true;
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
        int outcome = _settings.SlipProbability > 0 ? GridMoves.SampleOutcome(_rng.NextDouble(), _settings.SlipProbability) : 0;
        _state = GridMoves.Move(_map, _state, GridMoves.Direction(action, outcome));
        _steps++;
        var cell = _map.CellOfState(_state);
        bool terminal = cell == GridCell.Goal;
        if (!terminal) _visited[_state] = true;
        bool truncated = !terminal && _steps >= _settings.MaxSteps;
        _done = terminal || truncated;
        WriteObservation(observation);
        return new StepResult(_settings.Rewards.For(cell), terminal, truncated);
    }

    public void WriteObservation(Span<double> observation)
    {
        if (_state < 0) throw new InvalidOperationException($"{Name}: call Reset first");
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        int k = _settings.Window, h = (k - 1) / 2;
        int row = _map.RowOf(_state), col = _map.ColumnOf(_state);
        var o = observation[..ObservationSize];
        o.Clear();
        for (int dr = -h; dr <= h; dr++)
            for (int dc = -h; dc <= h; dc++)
            {
                int r = row + dr, c = col + dc;
                int kind;
                if (!_map.IsOpen(r, c)) kind = 1;
                else
                {
                    int s = _map.StateOf(r, c);
                    kind = _map.CellOfState(s) == GridCell.Goal ? 2 : _visited[s] ? 3 : 0;
                }
                o[((dr + h) * k + (dc + h)) * CellKinds + kind] = 1;
            }
    }

    public void SaveState(BinaryWriter writer)
    {
        StateFormat.WriteHeader(writer, Name, FormatVersion);
        writer.Write(_map.StateCount);
        writer.Write(_state);
        writer.Write(_steps);
        writer.Write(_done);
        for (int i = 0; i < _visited.Length; i++) writer.Write(_visited[i]);
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
        for (int i = 0; i < _visited.Length; i++) _visited[i] = reader.ReadBoolean();
        _rng = StateFormat.ReadRandom(reader, _rng);
    }

    public void Dispose() { }
}
