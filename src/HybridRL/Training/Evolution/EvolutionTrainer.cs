using HybridRL.Environments;
using HybridRL.Models;
using HybridRL.Quantum.Randomness;
using HybridRL.Training.DeepQ;

namespace HybridRL.Training.Evolution;

/// <summary>
/// Evolutionary training of any agent model: one unit = one generation. Members are evaluated
/// greedily on common episode seeds, in a fixed number of slices (<see cref="SliceCount"/>) spread over
/// the workers, through the model's population forward path (all members of a slice step their episodes
/// in lock-step, one batched circuit evaluation per time step). Each member's fitness lands in its own
/// slot and each slice samples shots from its own stream, so results are independent of the number of
/// threads, with sampled outputs too. Members the strategy flags in
/// <see cref="IEvolutionStrategy.ExtraEpisodes"/> (genetic search's elites) run that many further episodes on
/// seeds of their own; a member's fitness is the mean return over all of its episodes. On tabular tasks with
/// deterministic model outputs (exact simulation) each member's greedy action is computed once per state and
/// generation and then reused, so only those circuit executions are run (and counted).
/// </summary>
public sealed class EvolutionTrainer : ITrainer
{
    private readonly string _kind;
    private readonly IEvolutionStrategy _strategy;
    private readonly EvolutionTrainerSettings _s;
    private readonly ulong _rootSeed;
    /// <summary>Slices the population is split into (fewer when it is smaller); workers take slices as they finish.</summary>
    public const int SliceCount = 8;
    private readonly Slice[] _slices;
    private readonly int _workers;
    private readonly IAgentModel _evalModel;
    private readonly IAgentModel[] _models;
    private readonly GreedyEvaluator? _evaluator;
    private readonly ExecutionTally _tally;
    private readonly double[] _population;
    private readonly double[] _fitness;
    private readonly long[] _memberSteps;
    private readonly int[] _extra;
    private ulong[] _episodeSeeds;
    private readonly double[] _center;
    private readonly ReturnWindow _returns;
    private double? _lastEval;
    private double _fitMean, _fitBest, _fitStd;
    private bool _hasFitness;

    public EvolutionTrainer(string kind, IEvolutionStrategy strategy, EvolutionTrainerSettings settings,
        Func<IEnvironment> environmentFactory, Func<IAgentModel> modelFactory, ulong rootSeed)
    {
        _kind = kind;
        _strategy = strategy;
        _s = settings;
        _rootSeed = rootSeed;
        int lambda = strategy.PopulationSize;
        // A fixed split of the population, whatever the worker count: each slice has its own model, whose engine draws
        // shot and trajectory samples from a stream of its own, so a member sees the same samples on any worker.
        int sliceCount = Math.Min(lambda, SliceCount);
        _workers = Math.Clamp(settings.EffectiveWorkers, 1, sliceCount);
        _slices = new Slice[sliceCount];
        var models = new List<IAgentModel>();
        for (int w = 0; w < sliceCount; w++)
        {
            int start = (int)((long)lambda * w / sliceCount), end = (int)((long)lambda * (w + 1) / sliceCount);
            var model = modelFactory();
            if (model is ISimulatedModel simulated)
            {
                var state = simulated.GetSimulationState();
                simulated.SetSimulationState(state with { Seed = RandomStream.SeedFor(state.Seed, "population-slice", w) });
            }
            _slices[w] = new Slice(start, end - start, environmentFactory, model);
            models.Add(model);
        }
        _evalModel = modelFactory();
        models.Add(_evalModel);
        if (_evalModel.ParameterCount != strategy.Dimension)
            throw new ArgumentException($"search dimension {strategy.Dimension} does not match the model's {_evalModel.ParameterCount} parameters");
        _evaluator = settings.EvalEpisodes > 0 && settings.EvalEvery > 0 ? new GreedyEvaluator(environmentFactory(), settings.EvalEpisodes, rootSeed) : null;
        _models = models.ToArray();
        _tally = new ExecutionTally(_models);
        _population = new double[lambda * strategy.Dimension];
        _fitness = new double[lambda];
        _memberSteps = new long[lambda];
        _episodeSeeds = new ulong[Math.Max(1, settings.EpisodesPerMember)];
        _extra = new int[lambda];
        _center = new double[strategy.Dimension];
        _returns = new ReturnWindow(Math.Max(1, lambda));
    }

    public string Kind => _kind;
    public TrainingCounters Counters { get; } = new();
    public long ParameterCount => _strategy.Dimension;
    public double? LatestEvaluation => _lastEval;

    public void RunUnit(TrainingBudget budget)
    {
        NoiseClock.Advance(_models, budget.DeterministicProgress(Counters));
        int lambda = _strategy.PopulationSize, n = _strategy.Dimension;
        _strategy.Ask(_population);
        long g = Counters.Generations;
        int baseEpisodes = _s.EpisodesPerMember < 1 ? 1 : _s.EpisodesPerMember;
        // Extra episodes the strategy asks for (genetic search: its carried-over elites). They use seeds of their own,
        // shared by every flagged member of the generation (common random numbers), after the generation's shared seeds.
        var extra = _strategy.ExtraEpisodes;
        int maxExtra = 0;
        long totalEpisodes = (long)lambda * baseEpisodes;
        for (int i = 0; i < lambda; i++)
        {
            int x = Math.Max(0, extra[i]);
            _extra[i] = x;
            totalEpisodes += x;
            if (x > maxExtra) maxExtra = x;
        }
        if (_episodeSeeds.Length < baseEpisodes + maxExtra) _episodeSeeds = new ulong[baseEpisodes + maxExtra];
        for (int e = 0; e < baseEpisodes; e++) _episodeSeeds[e] = RandomStream.SeedFor(_rootSeed, "generation-episodes", g * baseEpisodes + e);
        if (maxExtra > 0)
        {
            ulong extraRoot = RandomStream.SeedFor(_rootSeed, "generation-extra-episodes", g);
            for (int e = 0; e < maxExtra; e++) _episodeSeeds[baseEpisodes + e] = RandomStream.SeedFor(extraRoot, "episode", e);
        }
        int rounds = baseEpisodes + maxExtra;

        Array.Clear(_fitness);
        Array.Clear(_memberSteps);
        if (_workers == 1)
            foreach (var slice in _slices) slice.Evaluate(_population, n, _episodeSeeds, rounds, baseEpisodes, _extra, _fitness, _memberSteps);
        else Parallel.For(0, _slices.Length, new ParallelOptions { MaxDegreeOfParallelism = _workers },
            w => _slices[w].Evaluate(_population, n, _episodeSeeds, rounds, baseEpisodes, _extra, _fitness, _memberSteps));

        long steps = 0;
        for (int i = 0; i < lambda; i++)
        {
            steps += _memberSteps[i];
            _returns.Add(_fitness[i]);
        }
        Counters.EnvSteps += steps;
        Counters.Episodes += totalEpisodes;
        Counters.Generations++;
        Summarise();
        _strategy.Tell(_fitness);

        // Greedy evaluation of the centre every EvalEvery generations (the config's eval_every), not every generation.
        if (_evaluator is not null && Counters.Generations % _s.EvalEvery == 0)
        {
            _strategy.Center.CopyTo(_center);
            _evalModel.SetFlat(_center);
            _lastEval = _evaluator.Evaluate(_evalModel, out long evalSteps);
        }
        _tally.Apply(Counters);
    }

    private void Summarise()
    {
        double sum = 0, best = double.NegativeInfinity;
        foreach (var f in _fitness)
        {
            sum += f;
            if (f > best) best = f;
        }
        double mean = sum / _fitness.Length, ss = 0;
        foreach (var f in _fitness) ss += (f - mean) * (f - mean);
        _fitMean = mean;
        _fitBest = best;
        _fitStd = Math.Sqrt(ss / _fitness.Length);
        _hasFitness = true;
    }

    public MetricsRow Metrics(MetricsRow row) => row with
    {
        TrainReturn = _returns.Mean(),
        EvalReturn = _lastEval,
        FitnessMean = _hasFitness ? _fitMean : null,
        FitnessBest = _hasFitness ? _fitBest : null,
        FitnessStd = _hasFitness ? _fitStd : null,
        Sigma = _strategy.StepSize,
    };

    public double[] AgentParameters() => _strategy.Center.ToArray();

    public void CheckFinite()
    {
        if (_hasFitness && !double.IsFinite(_fitMean)) throw new DivergenceException("the fitness", Counters.EnvSteps);
        foreach (var v in _strategy.Center)
            if (!double.IsFinite(v)) throw new DivergenceException("a parameter of the search distribution", Counters.EnvSteps);
        if (!double.IsFinite(_strategy.StepSize)) throw new DivergenceException("the step size σ", Counters.EnvSteps);
    }

    public void Save(Action<string, Action<BinaryWriter>> addSection)
    {
        addSection("counters", Counters.Save);
        addSection("model.center", w => DeepQTrainer.WriteDoubles(w, _strategy.Center));
        addSection("search", _strategy.Save);
        addSection(ModelRandomState.Section, w => ModelRandomState.Save(w, _models));
        addSection("trainer", w =>
        {
            w.Write(_lastEval.HasValue);
            w.Write(_lastEval ?? 0);
            w.Write(_hasFitness);
            w.Write(_fitMean);
            w.Write(_fitBest);
            w.Write(_fitStd);
            _returns.Save(w);
        });
    }

    public void Load(Func<string, BinaryReader> section)
    {
        Counters.Load(section("counters"));
        _strategy.Load(section("search"));
        ModelRandomState.Load(section(ModelRandomState.Section), _models);
        var t = section("trainer");
        bool hasEval = t.ReadBoolean();
        double eval = t.ReadDouble();
        _lastEval = hasEval ? eval : null;
        _hasFitness = t.ReadBoolean();
        _fitMean = t.ReadDouble();
        _fitBest = t.ReadDouble();
        _fitStd = t.ReadDouble();
        _returns.Load(t);
        _tally.Resync();
    }

    public void Dispose()
    {
        foreach (var s in _slices) (s.Model as IDisposable)?.Dispose();
        (_evalModel as IDisposable)?.Dispose();
    }

    /// <summary>A contiguous range of members evaluated by one worker, with its own model and environment copies.</summary>
    private sealed class Slice
    {
        private readonly int _start, _count;
        private readonly IEnvironment[] _envs;
        private readonly int[] _active, _round, _chosen, _pending;
        private readonly double[] _obs, _params, _q, _returns, _sums, _pendingObs;
        private readonly int _obsSize, _actions;
        // Greedy action of each member per discrete state, −1 until computed in this generation; null unless the
        // environment's observation is a function of its state index and the model's outputs are deterministic.
        private readonly int[]? _actionCache;
        private readonly int _states;

        public Slice(int start, int count, Func<IEnvironment> envFactory, IAgentModel model)
        {
            _start = start;
            _count = count;
            Model = model;
            _envs = new IEnvironment[count];
            for (int i = 0; i < count; i++) _envs[i] = envFactory();
            _obsSize = _envs.Length > 0 ? _envs[0].ObservationSize : 0;
            _actions = model.OutputCount;
            _active = new int[count];
            _obs = new double[count * _obsSize];
            _params = new double[count * model.ParameterCount];
            _q = new double[count * _actions];
            _returns = new double[count];
            _sums = new double[count];
            _round = new int[count];
            _chosen = new int[count];
            _pending = new int[count];
            _states = count > 0 && model.DeterministicOutputs && _envs[0].ObservationIsFunctionOfState ? Math.Max(0, _envs[0].StateCount) : 0;
            _actionCache = _states > 0 ? new int[count * _states] : null;
            _pendingObs = _actionCache is null ? [] : new double[count * _obsSize];
        }

        public IAgentModel Model { get; }

        /// <summary>
        /// Runs episode round e = 0 … rounds−1 (seed <c>seeds[e]</c>) for every member of the slice that takes part in it
        /// (all members in the first <paramref name="baseEpisodes"/> rounds, then those with more extra episodes than
        /// e − baseEpisodes), all taking part stepping in lock-step; fitness = mean return over the member's own episodes.
        /// </summary>
        public void Evaluate(double[] population, int dim, ulong[] seeds, int rounds, int baseEpisodes, int[] extra, double[] fitness, long[] steps)
        {
            if (_count == 0) return;
            for (int i = 0; i < _count; i++) _sums[i] = 0;
            _actionCache?.AsSpan().Fill(-1); // new parameters this generation
            for (int e = 0; e < rounds; e++)
            {
                ulong seed = seeds[e];
                int active = 0;
                for (int i = 0; i < _count; i++)
                {
                    if (e >= baseEpisodes + extra[_start + i]) continue;
                    _returns[i] = 0;
                    _envs[i].Reset(seed, _obs.AsSpan(active * _obsSize, _obsSize));
                    _active[active++] = i;
                }
                int taking = active;
                for (int k = 0; k < taking; k++) _round[k] = _active[k];
                while (active > 0)
                {
                    ChooseActions(population, dim, active);
                    int stillActive = 0;
                    for (int k = 0; k < active; k++)
                    {
                        int i = _active[k];
                        var r = _envs[i].Step(_chosen[k], _obs.AsSpan(k * _obsSize, _obsSize));
                        steps[_start + i]++;
                        _returns[i] += r.Reward;
                        if (r.Terminal || r.Truncated) continue;
                        if (stillActive != k) _obs.AsSpan(k * _obsSize, _obsSize).CopyTo(_obs.AsSpan(stillActive * _obsSize, _obsSize));
                        _active[stillActive++] = i;
                    }
                    active = stillActive;
                }
                for (int k = 0; k < taking; k++) _sums[_round[k]] += _returns[_round[k]];
            }
            for (int i = 0; i < _count; i++) fitness[_start + i] = _sums[i] / (baseEpisodes + extra[_start + i]);
        }

        /// <summary>
        /// Greedy action of each active member into <c>_chosen</c>, by one batched forward over the rows that need it.
        /// Row k of the observation buffer always holds member _active[k] (kept by the compaction in the caller). With the
        /// action cache, a member's action in a state it has met before in this generation is reused (identical, since
        /// the outputs are deterministic) and only new (member, state) pairs are evaluated.
        /// </summary>
        private void ChooseActions(double[] population, int dim, int active)
        {
            if (_actionCache is null)
            {
                for (int k = 0; k < active; k++)
                    population.AsSpan((_start + _active[k]) * dim, dim).CopyTo(_params.AsSpan(k * dim, dim));
                Model.PopulationForward(_params.AsSpan(0, active * dim), _obs.AsSpan(0, active * _obsSize), active, _q.AsSpan(0, active * _actions));
                for (int k = 0; k < active; k++) _chosen[k] = BellmanTargets.ArgMax(_q.AsSpan(k * _actions, _actions));
                return;
            }
            int pending = 0;
            for (int k = 0; k < active; k++)
            {
                int i = _active[k];
                int cached = _actionCache[i * _states + _envs[i].StateIndex];
                _chosen[k] = cached;
                if (cached >= 0) continue;
                population.AsSpan((_start + i) * dim, dim).CopyTo(_params.AsSpan(pending * dim, dim));
                _obs.AsSpan(k * _obsSize, _obsSize).CopyTo(_pendingObs.AsSpan(pending * _obsSize, _obsSize));
                _pending[pending++] = k;
            }
            if (pending == 0) return;
            Model.PopulationForward(_params.AsSpan(0, pending * dim), _pendingObs.AsSpan(0, pending * _obsSize), pending, _q.AsSpan(0, pending * _actions));
            for (int j = 0; j < pending; j++)
            {
                int k = _pending[j], i = _active[k];
                int a = BellmanTargets.ArgMax(_q.AsSpan(j * _actions, _actions));
                _chosen[k] = a;
                _actionCache[i * _states + _envs[i].StateIndex] = a;
            }
        }
    }
}
