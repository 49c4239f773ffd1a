using HybridRL.Environments;
using HybridRL.Models;
using HybridRL.Quantum.Randomness;
using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Training.DeepQ;

/// <summary>
/// Deep Q-learning (Mnih et al. 2015) with optional Double DQN targets (van Hasselt et al. 2016).
/// One unit = one environment step: act ε-greedily, store the transition, and every
/// <see cref="DeepQSettings.UpdateEvery"/> steps after warm-up sample a minibatch, regress Q(s,a)
/// on the Bellman target, clip, step the optimiser, and update the target parameters.
/// </summary>
public sealed class DeepQTrainer : ITrainer
{
    private readonly DeepQSettings _s;
    private readonly IEnvironment _env;
    private readonly IAgentModel _online;
    private readonly IAgentModel _target;
    private readonly GreedyEvaluator? _evaluator;
    private readonly ReplayBuffer _replay;
    private readonly RandomStream _explore;
    private readonly RandomStream _replayRng;
    private readonly RandomStream _episodeSeeds;
    private readonly TorchSharp.Modules.OptimizerHelper _optimizer;
    private readonly ReturnWindow _returns;
    private readonly ExecutionTally _tally;
    private readonly IAgentModel[] _models;

    // Per-step buffers (no allocation on the hot path).
    private readonly double[] _obs, _next, _q;
    private readonly double[] _bStates, _bNext, _bRewards, _bTargets, _bNextTarget, _bNextOnline;
    private readonly int[] _bActions;
    private readonly long[] _bActionIndex;
    private readonly bool[] _bTerminal;
    private readonly double[] _flatOnline, _flatTarget;

    private double _episodeReturn;
    private bool _needsReset = true;
    private double? _lastLoss;
    private double? _lastEval;
    private long _nextEvalAt;
    private double _epsilon;

    public DeepQTrainer(DeepQSettings settings, IEnvironment env, IEnvironment evalEnv, Func<IAgentModel> modelFactory, ulong rootSeed)
    {
        _s = settings;
        _env = env;
        _online = modelFactory();
        _target = modelFactory();
        if (_online.ObservationSize != env.ObservationSize || _online.OutputCount != env.ActionCount)
            throw new ArgumentException($"model maps {_online.ObservationSize} inputs to {_online.OutputCount} outputs, environment has {env.ObservationSize} observations and {env.ActionCount} actions");
        _evaluator = settings.EvalEvery > 0 ? new GreedyEvaluator(evalEnv, settings.EvalEpisodes, rootSeed) : null;
        _nextEvalAt = settings.EvalEvery;
        _replay = new ReplayBuffer(settings.ReplayCapacity, env.ObservationSize, env.ObservationIsBinary);
        _explore = RandomStream.FromRoot(rootSeed, "exploration");
        _replayRng = RandomStream.FromRoot(rootSeed, "replay-sampling");
        _episodeSeeds = RandomStream.FromRoot(rootSeed, "training-episodes");
        _returns = new ReturnWindow(settings.ReturnWindow);
        _models = [_online, _target];
        _tally = new ExecutionTally(_models);

        int n = env.ObservationSize, a = env.ActionCount, b = settings.BatchSize;
        _obs = new double[n];
        _next = new double[n];
        _q = new double[a];
        _bStates = new double[b * n];
        _bNext = new double[b * n];
        _bRewards = new double[b];
        _bTargets = new double[b];
        _bNextTarget = new double[b * a];
        _bNextOnline = new double[b * a];
        _bActions = new int[b];
        _bActionIndex = new long[b];
        _bTerminal = new bool[b];
        _flatOnline = new double[_online.ParameterCount];
        _flatTarget = new double[_online.ParameterCount];
        _online.GetFlat(_flatOnline);
        _target.SetFlat(_flatOnline);

        var parameters = _online.Parameters().ToList();
        _optimizer = settings.Optimizer switch
        {
            OptimizerKind.Adam => optim.Adam(parameters, lr: settings.LearningRate.BaseRate),
            _ => optim.RMSProp(parameters, lr: settings.LearningRate.BaseRate),
        };
        _epsilon = settings.Exploration.At(0);
    }

    public string Kind => "dqn";
    public TrainingCounters Counters { get; } = new();
    public long ParameterCount => _online.ParameterCount;
    public double? LatestEvaluation => _lastEval;
    public IAgentModel OnlineModel => _online;

    public void RunUnit(TrainingBudget budget)
    {
        NoiseClock.Advance(_models, budget.DeterministicProgress(Counters));
        if (_needsReset)
        {
            _env.Reset(_episodeSeeds.NextUInt64(), _obs);
            _episodeReturn = 0;
            _needsReset = false;
        }

        _epsilon = _s.Exploration.At(Counters.EnvSteps);
        int action;
        if (_explore.NextDouble() < _epsilon)
        {
            action = _explore.NextInt(_env.ActionCount);
        }
        else
        {
            _online.ForwardNoGrad(_obs, 1, _q);
            action = BellmanTargets.ArgMax(_q);
        }

        var step = _env.Step(action, _next);
        Counters.EnvSteps++;
        _episodeReturn += step.Reward;
        _replay.Add(_obs, action, step.Reward, _next, step.Terminal);
        if (step.Terminal || step.Truncated)
        {
            Counters.Episodes++;
            _returns.Add(_episodeReturn);
            _needsReset = true;
        }
        else
        {
            _next.CopyTo(_obs, 0);
        }

        if (Counters.EnvSteps > _s.WarmupSteps && _replay.Count >= _s.BatchSize && Counters.EnvSteps % _s.UpdateEvery == 0)
        {
            Learn(budget);
        }

        if (_s.PolyakTau <= 0 && Counters.EnvSteps % _s.TargetUpdateEvery == 0)
        {
            _online.GetFlat(_flatOnline);
            _target.SetFlat(_flatOnline);
        }

        if (_evaluator is not null && Counters.EnvSteps >= _nextEvalAt)
        {
            _lastEval = _evaluator.Evaluate(_online, out long evalSteps);
            _nextEvalAt += _s.EvalEvery;
        }

        _tally.Apply(Counters);
    }

    private void Learn(TrainingBudget budget)
    {
        int b = _s.BatchSize, a = _env.ActionCount, n = _env.ObservationSize;
        _replay.Sample(_replayRng, b, _bStates, _bActions, _bRewards, _bNext, _bTerminal);

        _target.ForwardNoGrad(_bNext, b, _bNextTarget);
        if (_s.DoubleDqn)
        {
            _online.ForwardNoGrad(_bNext, b, _bNextOnline);
        }
        BellmanTargets.Compute(_bRewards, _bTerminal, _bNextTarget, _bNextOnline, a, _s.Gamma, _s.DoubleDqn, _bTargets);

        double lr = _s.LearningRate.At(budget.DeterministicProgress(Counters));
        foreach (var g in _optimizer.ParamGroups) g.LearningRate = lr;

        using (var scope = NewDisposeScope())
        {
            _optimizer.zero_grad();
            var states = tensor(_bStates, [b, n], dtype: float64);
            for (int i = 0; i < b; i++) _bActionIndex[i] = _bActions[i];
            var actions = tensor(_bActionIndex, [b, 1], dtype: int64);
            var targets = tensor(_bTargets, [b], dtype: float64);
            var q = _online.Forward(states).gather(1, actions).squeeze(1);
            var loss = _s.Loss == TdLoss.Huber
                ? nn.functional.smooth_l1_loss(q, targets, beta: 1.0)
                : nn.functional.mse_loss(q, targets);
            loss.backward();
            if (_s.GradientClipNorm > 0) nn.utils.clip_grad_norm_(_online.Parameters(), _s.GradientClipNorm);
            _optimizer.step();
            _lastLoss = loss.item<double>();
        }
        Counters.Updates++;

        if (_s.PolyakTau > 0)
        {
            _online.GetFlat(_flatOnline);
            _target.GetFlat(_flatTarget);
            double tau = _s.PolyakTau;
            for (int i = 0; i < _flatTarget.Length; i++) _flatTarget[i] = tau * _flatOnline[i] + (1 - tau) * _flatTarget[i];
            _target.SetFlat(_flatTarget);
        }
    }

    public MetricsRow Metrics(MetricsRow row) => row with
    {
        TrainReturn = _returns.Mean(),
        EvalReturn = _lastEval,
        Loss = _lastLoss,
        Epsilon = _epsilon,
    };

    public double[] AgentParameters()
    {
        var p = new double[_online.ParameterCount];
        _online.GetFlat(p);
        return p;
    }

    public void CheckFinite()
    {
        if (_lastLoss is double l && !double.IsFinite(l)) throw new DivergenceException("the loss", Counters.EnvSteps);
        _online.GetFlat(_flatOnline);
        foreach (var v in _flatOnline)
            if (!double.IsFinite(v)) throw new DivergenceException("a model parameter", Counters.EnvSteps);
    }

    public void Save(Action<string, Action<BinaryWriter>> addSection)
    {
        // A deep-Q checkpoint holds the environment mid-episode; say so before any section is written.
        if (!_env.SupportsStateSave)
            throw new NotSupportedException($"cannot checkpoint this deep-Q run: environment '{_env.Name}' cannot save its state mid-episode " +
                "(a bridged child must declare \"deterministic\": true in its handshake; see examples/bridge/PROTOCOL.md)");
        addSection("counters", Counters.Save);
        addSection("model.online", w => WriteDoubles(w, Flat(_online, _flatOnline)));
        addSection("model.target", w => WriteDoubles(w, Flat(_target, _flatTarget)));
        addSection(ModelRandomState.Section, w => ModelRandomState.Save(w, [_online, _target]));
        addSection("optimizer", w => _optimizer.save_state_dict(w));
        addSection("replay", _replay.Save);
        addSection("random", w =>
        {
            WriteStream(w, _explore);
            WriteStream(w, _replayRng);
            WriteStream(w, _episodeSeeds);
        });
        addSection("environment", w =>
        {
            w.Write(_needsReset);
            w.Write(_episodeReturn);
            WriteDoubles(w, _obs);
            _env.SaveState(w);
        });
        addSection("trainer", w =>
        {
            w.Write(_lastLoss.HasValue);
            w.Write(_lastLoss ?? 0);
            w.Write(_lastEval.HasValue);
            w.Write(_lastEval ?? 0);
            w.Write(_nextEvalAt);
            w.Write(_epsilon);
            _returns.Save(w);
        });
    }

    public void Load(Func<string, BinaryReader> section)
    {
        Counters.Load(section("counters"));
        ReadDoubles(section("model.online"), _flatOnline);
        _online.SetFlat(_flatOnline);
        ReadDoubles(section("model.target"), _flatTarget);
        _target.SetFlat(_flatTarget);
        ModelRandomState.Load(section(ModelRandomState.Section), [_online, _target]);
        _optimizer.load_state_dict(section("optimizer"));
        _replay.Load(section("replay"));
        var r = section("random");
        ReadStream(r, _explore);
        ReadStream(r, _replayRng);
        ReadStream(r, _episodeSeeds);
        var e = section("environment");
        _needsReset = e.ReadBoolean();
        _episodeReturn = e.ReadDouble();
        ReadDoubles(e, _obs);
        _env.LoadState(e);
        var t = section("trainer");
        bool hasLoss = t.ReadBoolean();
        double loss = t.ReadDouble();
        _lastLoss = hasLoss ? loss : null;
        bool hasEval = t.ReadBoolean();
        double eval = t.ReadDouble();
        _lastEval = hasEval ? eval : null;
        _nextEvalAt = t.ReadInt64();
        _epsilon = t.ReadDouble();
        _returns.Load(t);
        _tally.Resync();
    }

    private static double[] Flat(IAgentModel m, double[] buffer)
    {
        m.GetFlat(buffer);
        return buffer;
    }

    internal static void WriteDoubles(BinaryWriter w, ReadOnlySpan<double> values)
    {
        w.Write(values.Length);
        w.Write(System.Runtime.InteropServices.MemoryMarshal.AsBytes(values));
    }

    internal static void ReadDoubles(BinaryReader r, Span<double> values)
    {
        int n = r.ReadInt32();
        if (n != values.Length) throw new InvalidDataException($"checkpoint holds {n} values where this run has {values.Length}");
        r.BaseStream.ReadExactly(System.Runtime.InteropServices.MemoryMarshal.AsBytes(values));
    }

    internal static void WriteStream(BinaryWriter w, RandomStream s)
    {
        Span<ulong> state = stackalloc ulong[RandomStream.StateWords];
        s.GetState(state);
        foreach (var x in state) w.Write(x);
    }

    internal static void ReadStream(BinaryReader r, RandomStream s)
    {
        Span<ulong> state = stackalloc ulong[RandomStream.StateWords];
        for (int i = 0; i < state.Length; i++) state[i] = r.ReadUInt64();
        s.SetState(state);
    }

    public void Dispose()
    {
        _optimizer.Dispose();
        (_online as IDisposable)?.Dispose();
        (_target as IDisposable)?.Dispose();
    }
}
