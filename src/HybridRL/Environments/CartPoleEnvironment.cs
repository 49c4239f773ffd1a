using HybridRL.Quantum.Randomness;

namespace HybridRL.Environments;

/// <summary>
/// Cart–pole balancing with the dynamics and constants of Barto, Sutton &amp; Anderson (1983), "Neuronlike adaptive
/// elements that can solve difficult learning control problems", IEEE Trans. SMC 13(5), appendix:
/// <code>
/// θ'' = [g sinθ + cosθ · (−F − m l θ'² sinθ + μc sgn(x')) / (mc + m) − μp θ' / (m l)] / [l (4/3 − m cos²θ / (mc + m))]
/// x''  = [F + m l (θ'² sinθ − θ'' cosθ) − μc sgn(x')] / (mc + m)
/// </code>
/// with g = 9.8 m/s², mc = 1.0 kg, m = 0.1 kg, l = 0.5 m (half the pole), μc = 0.0005, μp = 0.000002, F = ±10 N,
/// and Euler steps of τ = 0.02 s (all constants from memory of the paper; the paper quotes g = −9.8 m/s² under its
/// sign convention — used literally in this form it makes the upright pole stable, so the magnitude is used here so that
/// a tilt grows, as for a real pole). sgn(0) = 0. The episode fails (terminal) when |θ| &gt; 12° or |x| &gt; 2.4 m.
/// Observation: (x, x', θ, θ') in SI units. Actions: 0 push left (−F), 1 push right (+F). Reward 1 per step; the failing
/// step earns <c>failure_reward</c>. Reaching <c>max_steps</c> truncates.
/// </summary>
public sealed class CartPoleEnvironment : IEnvironment
{
    public const double Gravity = 9.8;
    public const double CartMass = 1.0;
    public const double PoleMass = 0.1;
    public const double HalfPoleLength = 0.5;
    public const double CartFriction = 0.0005;
    public const double PoleFriction = 0.000002;
    public const double ForceMagnitude = 10.0;
    public const double TimeStep = 0.02;
    public const double AngleLimit = 12.0 * Math.PI / 180.0;
    public const double PositionLimit = 2.4;
    private const int FormatVersion = 1;

    private readonly CartPoleSettings _settings;
    private RandomStream? _rng;
    private double _x, _xDot, _theta, _thetaDot;
    private int _steps;
    private bool _done;

    public CartPoleEnvironment(CartPoleSettings settings) => _settings = settings ?? throw new ArgumentNullException(nameof(settings));

    public string Name => CartPoleSettings.KindName;
    public int ObservationSize => 4;
    public int ActionCount => 2;
    public bool ObservationIsBinary => false;
    public int StateCount => 0;
    public int StateIndex => -1;
    public bool SupportsStateSave => true;
    public int StepCount => _steps;

    /// <summary>Current physical state (x, x', θ, θ').</summary>
    public (double X, double XDot, double Theta, double ThetaDot) State => (_x, _xDot, _theta, _thetaDot);

    /// <summary>Sets the physical state directly (tests, demonstrations); clears the step counter.</summary>
    public void SetState(double x, double xDot, double theta, double thetaDot)
    {
        _rng ??= new RandomStream(0);
        (_x, _xDot, _theta, _thetaDot) = (x, xDot, theta, thetaDot);
        _steps = 0;
        _done = false;
    }

    public void Reset(ulong seed, Span<double> observation)
    {
        StateFormat.CheckBuffer(observation, 4, Name);
        _rng = new RandomStream(seed);
        double s = _settings.InitialSpread;
        _x = s * (2 * _rng.NextDouble() - 1);
        _xDot = s * (2 * _rng.NextDouble() - 1);
        _theta = s * (2 * _rng.NextDouble() - 1);
        _thetaDot = s * (2 * _rng.NextDouble() - 1);
        _steps = 0;
        _done = false;
        WriteObservation(observation);
    }

    public StepResult Step(int action, Span<double> observation)
    {
        if (_rng is null) throw new InvalidOperationException($"{Name}: call Reset before Step");
        if (_done) throw new InvalidOperationException($"{Name}: the episode is over; call Reset");
        if ((uint)action >= 2) throw new ArgumentOutOfRangeException(nameof(action), action, "actions are 0 (push left) and 1 (push right)");
        StateFormat.CheckBuffer(observation, 4, Name);
        double force = action == 1 ? ForceMagnitude : -ForceMagnitude;
        double muC = _settings.Friction ? CartFriction : 0;
        double muP = _settings.Friction ? PoleFriction : 0;
        const double totalMass = CartMass + PoleMass;
        double sin = Math.Sin(_theta), cos = Math.Cos(_theta);
        double sgn = Math.Sign(_xDot);
        double thetaAcc = (Gravity * sin
                           + cos * (-force - PoleMass * HalfPoleLength * _thetaDot * _thetaDot * sin + muC * sgn) / totalMass
                           - muP * _thetaDot / (PoleMass * HalfPoleLength))
                          / (HalfPoleLength * (4.0 / 3.0 - PoleMass * cos * cos / totalMass));
        double xAcc = (force + PoleMass * HalfPoleLength * (_thetaDot * _thetaDot * sin - thetaAcc * cos) - muC * sgn) / totalMass;
        // Euler step: positions advance with the old velocities.
        _x += TimeStep * _xDot;
        _xDot += TimeStep * xAcc;
        _theta += TimeStep * _thetaDot;
        _thetaDot += TimeStep * thetaAcc;
        _steps++;
        bool failed = Math.Abs(_theta) > AngleLimit || Math.Abs(_x) > PositionLimit;
        bool truncated = !failed && _steps >= _settings.MaxSteps;
        _done = failed || truncated;
        WriteObservation(observation);
        return new StepResult(failed ? _settings.FailureReward : 1.0, failed, truncated);
    }

    public void WriteObservation(Span<double> observation)
    {
        StateFormat.CheckBuffer(observation, 4, Name);
        observation[0] = _x;
        observation[1] = _xDot;
        observation[2] = _theta;
        observation[3] = _thetaDot;
    }

    public void SaveState(BinaryWriter writer)
    {
        StateFormat.WriteHeader(writer, Name, FormatVersion);
        writer.Write(_x); writer.Write(_xDot); writer.Write(_theta); writer.Write(_thetaDot);
        writer.Write(_steps);
        writer.Write(_done);
        StateFormat.WriteRandom(writer, _rng);
    }

    public void LoadState(BinaryReader reader)
    {
        StateFormat.ReadHeader(reader, Name, FormatVersion);
        _x = reader.ReadDouble(); _xDot = reader.ReadDouble(); _theta = reader.ReadDouble(); _thetaDot = reader.ReadDouble();
        _steps = reader.ReadInt32();
        _done = reader.ReadBoolean();
        _rng = StateFormat.ReadRandom(reader, _rng);
    }

    public void Dispose() { }
}
