using System.Numerics;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Environments;

/// <summary>
/// Qubit steering, after the bang-bang state-preparation setting of Bukov et al. (2018), Phys. Rev. X 8, 031086:
/// a single qubit evolves under H(h) = −(σz + h σx) / 2 (spin-½ operators, ħ = 1); each step the agent picks one of a
/// few drive-field values h for one time slice; after <c>slices</c> steps the episode ends (terminal) and the reward is
/// the fidelity |⟨target|ψ⟩|² with the target state (or, shaped, each step's fidelity gain). The qubit starts in the
/// ground state of H(initial_field) and the target is the ground state of H(target_field) (the setting is recalled
/// from memory of the paper; defaults are our own). Observation: the Bloch components (⟨σx⟩, ⟨σy⟩, ⟨σz⟩), exact or
/// estimated from <c>shots</c> ±1 measurements per axis, optionally followed by the elapsed fraction of the protocol.
/// </summary>
public sealed class QubitSteeringEnvironment : IEnvironment
{
    private const int FormatVersion = 1;
    private readonly QubitSteeringSettings _settings;
    private readonly QubitPropagator[] _propagators;
    private readonly Complex _initial0, _initial1, _target0, _target1;
    private readonly double[] _lastObservation;
    private RandomStream? _rng;
    private Complex _a0, _a1;
    private int _steps;
    private bool _done;
    private double _fidelity;

    public QubitSteeringEnvironment(QubitSteeringSettings settings)
    {
        _settings = settings ?? throw new ArgumentNullException(nameof(settings));
        _propagators = new QubitPropagator[settings.DriveValues.Count];
        for (int a = 0; a < _propagators.Length; a++)
            _propagators[a] = PropagatorFor(settings.DriveValues[a], settings.SliceDuration);
        (_initial0, _initial1) = GroundState(settings.InitialField);
        (_target0, _target1) = GroundState(settings.TargetField);
        ObservationSize = settings.ObserveTime ? 4 : 3;
        _lastObservation = new double[ObservationSize];
    }

    public string Name => QubitSteeringSettings.KindName;
    public int ObservationSize { get; }
    public int ActionCount => _propagators.Length;
    public bool ObservationIsBinary => false;
    public int StateCount => 0;
    public int StateIndex => -1;
    public bool SupportsStateSave => true;
    public int StepCount => _steps;

    /// <summary>Current amplitudes (a0, a1) of the qubit.</summary>
    public (Complex A0, Complex A1) Amplitudes => (_a0, _a1);

    /// <summary>Current fidelity with the target state.</summary>
    public double Fidelity => _fidelity;

    /// <summary>Exact one-slice propagator for drive field h: H(h) = b · σ with b = (−h/2, 0, −1/2).</summary>
    public static QubitPropagator PropagatorFor(double field, double duration) => QubitPropagator.ForField(-field / 2, 0, -0.5, duration);

    /// <summary>Ground state of H(h): the Bloch vector anti-parallel to b, i.e. along (h, 0, 1) / √(1 + h²).</summary>
    public static (Complex A0, Complex A1) GroundState(double field) => QubitPropagator.StateFromBloch(field, 0, 1);

    public void Reset(ulong seed, Span<double> observation)
    {
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        _rng = new RandomStream(seed);
        _a0 = _initial0;
        _a1 = _initial1;
        _steps = 0;
        _done = false;
        _fidelity = QubitPropagator.Fidelity(_target0, _target1, _a0, _a1);
        Measure();
        WriteObservation(observation);
    }

    public StepResult Step(int action, Span<double> observation)
    {
        if (_rng is null) throw new InvalidOperationException($"{Name}: call Reset before Step");
        if (_done) throw new InvalidOperationException($"{Name}: the episode is over; call Reset");
        if ((uint)action >= (uint)_propagators.Length) throw new ArgumentOutOfRangeException(nameof(action), action, $"actions are 0..{_propagators.Length - 1} (one per drive value)");
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        _propagators[action].Apply(ref _a0, ref _a1);
        _steps++;
        double previous = _fidelity;
        _fidelity = QubitPropagator.Fidelity(_target0, _target1, _a0, _a1);
        bool end = _steps >= _settings.Slices;
        _done = end;
        Measure();
        WriteObservation(observation);
        double reward = _settings.ShapedReward ? _fidelity - previous : end ? _fidelity : 0;
        return new StepResult(reward, end, false);
    }

    private void Measure()
    {
        var (x, y, z) = QubitPropagator.Bloch(_a0, _a1);
        int shots = _settings.Shots;
        _lastObservation[0] = shots == 0 ? x : Estimate(x, shots);
        _lastObservation[1] = shots == 0 ? y : Estimate(y, shots);
        _lastObservation[2] = shots == 0 ? z : Estimate(z, shots);
        if (_settings.ObserveTime) _lastObservation[3] = _steps / (double)_settings.Slices;
    }

    /// <summary>Mean of <paramref name="shots"/> ±1 outcomes with P(+1) = (1 + expectation) / 2 (Born rule).</summary>
    private double Estimate(double expectation, int shots)
    {
        double pPlus = (1 + expectation) / 2;
        int plus = 0;
        for (int i = 0; i < shots; i++)
            if (_rng!.NextDouble() < pPlus) plus++;
        return (2.0 * plus - shots) / shots;
    }

    public void WriteObservation(Span<double> observation)
    {
        StateFormat.CheckBuffer(observation, ObservationSize, Name);
        _lastObservation.AsSpan().CopyTo(observation);
    }

    /// <summary>
    /// Exhaustive search over all ActionCount^slices protocols (an exact oracle for small tasks): the best final
    /// fidelity and one protocol reaching it (first in lexicographic order). Limited to 2^24 protocols.
    /// </summary>
    public (double Fidelity, int[] Protocol) BestProtocol()
    {
        int n = _settings.Slices, a = ActionCount;
        if (n * Math.Log2(a) > 24) throw new InvalidOperationException($"exhaustive search over {a}^{n} protocols is too large (limit 2^24)");
        var path = new int[n];
        var best = new int[n];
        double bestF = -1;
        var s0 = new Complex[n + 1];
        var s1 = new Complex[n + 1];
        s0[0] = _initial0;
        s1[0] = _initial1;
        void Search(int depth)
        {
            if (depth == n)
            {
                double f = QubitPropagator.Fidelity(_target0, _target1, s0[n], s1[n]);
                if (f > bestF + 1e-15) { bestF = f; path.CopyTo(best, 0); }
                return;
            }
            for (int k = 0; k < a; k++)
            {
                var x0 = s0[depth]; var x1 = s1[depth];
                _propagators[k].Apply(ref x0, ref x1);
                s0[depth + 1] = x0; s1[depth + 1] = x1;
                path[depth] = k;
                Search(depth + 1);
            }
        }
        Search(0);
        return (bestF, best);
    }

    public void SaveState(BinaryWriter writer)
    {
        StateFormat.WriteHeader(writer, Name, FormatVersion);
        writer.Write(_a0.Real); writer.Write(_a0.Imaginary); writer.Write(_a1.Real); writer.Write(_a1.Imaginary);
        writer.Write(_steps);
        writer.Write(_done);
        writer.Write(_fidelity);
        writer.Write(_lastObservation.Length);
        foreach (var v in _lastObservation) writer.Write(v);
        StateFormat.WriteRandom(writer, _rng);
    }

    public void LoadState(BinaryReader reader)
    {
        StateFormat.ReadHeader(reader, Name, FormatVersion);
        _a0 = new Complex(reader.ReadDouble(), reader.ReadDouble());
        _a1 = new Complex(reader.ReadDouble(), reader.ReadDouble());
        _steps = reader.ReadInt32();
        _done = reader.ReadBoolean();
        _fidelity = reader.ReadDouble();
        int len = reader.ReadInt32();
        if (len != _lastObservation.Length) throw new InvalidDataException($"{Name}: saved observation has {len} entries, expected {_lastObservation.Length}");
        for (int i = 0; i < len; i++) _lastObservation[i] = reader.ReadDouble();
        _rng = StateFormat.ReadRandom(reader, _rng);
    }

    public void Dispose() { }
}
