using HybridRL.Environments;
using HybridRL.Experiments.Config;
using HybridRL.Models;
using HybridRL.Quantum.Randomness;
using HybridRL.Training;
using HybridRL.Training.DeepQ;
using HybridRL.Training.Evolution;
using Cfg = HybridRL.Experiments.Config;
using Mdl = HybridRL.Models;
using Q = HybridRL.Quantum;

namespace HybridRL.Experiments;

/// <summary>
/// Builds what an experiment spec describes: environment copies, the agent model, the trainer and
/// the budget. The one place where config settings are mapped onto the library's own types.
/// Random streams are derived from the root seed by name (DESIGN.md, Determinism).
/// </summary>
public sealed class ExperimentComponents : IDisposable
{
    private readonly ExperimentSpec _spec;
    private readonly List<IDisposable> _owned = [];

    private ExperimentComponents(ExperimentSpec spec)
    {
        _spec = spec;
        EnvironmentSettings = EnvironmentParameters.Parse(spec.Environment.Kind, spec.Environment.Parameters);
        using (var probe = EnvironmentSettings.CreateEnvironment())
        {
            ObservationSize = probe.ObservationSize;
            ActionCount = probe.ActionCount;
            ObservationIsBinary = probe.ObservationIsBinary;
        }
        ModelSettings = MapModel(spec.Model, spec.Trainer.Kind);
        Budget = new TrainingBudget(spec.Experiment.Budget.EnvSteps, spec.Experiment.Budget.Episodes, spec.Experiment.Budget.Generations,
            spec.Experiment.Budget.CircuitExecutions, spec.Experiment.Budget.WallSeconds);
    }

    public HybridRL.Environments.EnvironmentSettings EnvironmentSettings { get; }
    public Mdl.ModelSettings ModelSettings { get; }
    public int ObservationSize { get; }
    public int ActionCount { get; }
    /// <summary>Whether observations are 0/1 only (the replay buffer then stores them as bytes).</summary>
    public bool ObservationIsBinary { get; }
    public TrainingBudget Budget { get; }
    public ITrainer Trainer { get; private set; } = null!;
    public IReadOnlyDictionary<string, int> ParameterCounts { get; private set; } = new Dictionary<string, int>();

    /// <summary>Builds the environment and one model, then disposes them: surfaces every config problem before files are written.</summary>
    public static IDisposable Validate(ExperimentSpec spec)
    {
        var c = new ExperimentComponents(spec);
        using var model = c.CreateModel();
        c.ParameterCounts = model.ParameterCounts;
        return c;
    }

    /// <summary>The environment and model settings without a trainer (for inspection and evaluation: no replay buffer is allocated).</summary>
    public static ExperimentComponents Describe(ExperimentSpec spec) => new(spec);

    /// <summary>Everything needed to train.</summary>
    public static ExperimentComponents Build(ExperimentSpec spec)
    {
        var c = new ExperimentComponents(spec);
        c.Trainer = c.CreateTrainer();
        c._owned.Add(c.Trainer);
        return c;
    }

    public IEnvironment CreateEnvironment()
    {
        var env = EnvironmentSettings.CreateEnvironment();
        _owned.Add(env);
        return env;
    }

    /// <summary>A model with the initial parameters of this seed (every copy is identical).</summary>
    public IAgentModel CreateModel() =>
        ModelFactory.Create(ModelSettings, ObservationSize, ActionCount, RandomStream.SeedFor(_spec.Experiment.Seed, "model-initialisation", 0));

    private ITrainer CreateTrainer()
    {
        ulong seed = _spec.Experiment.Seed;
        var t = _spec.Trainer;
        using (var probe = CreateModel()) ParameterCounts = probe.ParameterCounts;
        if (t.Kind == TrainerKind.Dqn)
        {
            return new DeepQTrainer(MapDqn(t.Dqn!), CreateEnvironment(), CreateEnvironment(), CreateModel, seed);
        }
        double[] initial;
        using (var probe = CreateModel())
        {
            initial = new double[probe.ParameterCount];
            probe.GetFlat(initial);
        }
        ulong searchSeed = RandomStream.SeedFor(seed, "search-distribution", 0);
        int threads = _spec.Model.Simulation?.Threads ?? 0;
        (EvolutionSettings settings, EvolutionTrainerSettings loop, string kind) = t.Kind switch
        {
            TrainerKind.Genetic => ((EvolutionSettings)new GeneticSearchSettings(t.Genetic!.Population, TruncationCount(t.Genetic), t.Genetic.MutationSigma, t.Genetic.Elites, t.Genetic.Crossover ? 0.5 : 0.0, t.Genetic.EliteEpisodes),
                new EvolutionTrainerSettings(t.Genetic.EpisodesPerMember, t.Genetic.EvalEpisodes, threads, t.Genetic.EvalEvery), "genetic"),
            TrainerKind.EvolutionStrategies => (new Training.Evolution.EvolutionStrategiesSettings(t.EvolutionStrategies!.Population, t.EvolutionStrategies.Sigma, t.EvolutionStrategies.LearningRate, t.EvolutionStrategies.WeightDecay),
                new EvolutionTrainerSettings(t.EvolutionStrategies.EpisodesPerMember, t.EvolutionStrategies.EvalEpisodes, threads, t.EvolutionStrategies.EvalEvery), "evolution_strategies"),
            _ => (new Training.Evolution.CmaEsSettings(t.CmaEs!.Population, t.CmaEs.Sigma0),
                new EvolutionTrainerSettings(t.CmaEs.EpisodesPerMember, t.CmaEs.EvalEpisodes, threads, t.CmaEs.EvalEvery), "cma_es"),
        };
        var strategy = EvolutionStrategyFactory.Create(settings, initial, searchSeed);
        return new EvolutionTrainer(kind, strategy, loop, CreateEnvironment, CreateModel, seed);
    }

    private static int TruncationCount(GeneticSettings g) =>
        g.Truncation >= 1 ? (int)g.Truncation : Math.Max(1, (int)Math.Round(g.Truncation * g.Population));

    /// <summary>Greedy return of the trained agent on fresh episodes (seeds distinct from training and periodic evaluation).</summary>
    public double EvaluateFinal(int episodes)
    {
        using var model = CreateModel();
        model.SetFlat(Trainer.AgentParameters());
        var evaluator = new GreedyEvaluator(CreateEnvironment(), episodes, RandomStream.SeedFor(_spec.Experiment.Seed, "final-evaluation", 0));
        return evaluator.Evaluate(model, out _);
    }

    private static DeepQSettings MapDqn(DqnSettings d) => new()
    {
        ReplayCapacity = d.ReplayCapacity,
        WarmupSteps = d.WarmupSteps,
        UpdateEvery = d.UpdateEvery,
        BatchSize = d.BatchSize,
        TargetUpdateEvery = d.TargetUpdateEvery,
        PolyakTau = d.TargetUpdate == TargetUpdateKind.Polyak ? d.PolyakTau : 0,
        DoubleDqn = d.DoubleDqn,
        Loss = d.Loss == DqnLoss.Huber ? TdLoss.Huber : TdLoss.Squared,
        Gamma = d.Gamma,
        Exploration = new ExplorationSchedule(d.EpsilonStart, d.EpsilonEnd, d.EpsilonDecaySteps, d.EpsilonDecay == EpsilonDecay.Linear ? DecayShape.Linear : DecayShape.Exponential),
        Optimizer = d.Optimizer == Cfg.OptimizerKind.Adam ? Training.DeepQ.OptimizerKind.Adam : Training.DeepQ.OptimizerKind.RmsProp,
        LearningRate = new Training.DeepQ.LearningRateSchedule(d.LearningRate, d.LearningRateSchedule switch
        {
            Cfg.LearningRateSchedule.Constant => LearningRateShape.Constant,
            Cfg.LearningRateSchedule.Linear => LearningRateShape.Linear,
            _ => LearningRateShape.Cosine,
        }),
        GradientClipNorm = d.GradientClipNorm,
        EvalEvery = d.EvalEvery,
        EvalEpisodes = d.EvalEpisodes,
    };

    private static Mdl.ModelSettings MapModel(Cfg.ModelSettings m, TrainerKind trainer)
    {
        if (m.Kind == Cfg.ModelKind.Classical)
        {
            var cl = m.Classical!;
            return new Mdl.ModelSettings
            {
                Kind = Mdl.ModelKind.Classical,
                Classical = new ClassicalSettings { Hidden = cl.HiddenSizes.ToArray(), Activation = MapActivation(cl.Activation) },
            };
        }
        var comp = m.Compressor;
        var circ = m.Circuit!;
        var sim = m.Simulation!;
        return new Mdl.ModelSettings
        {
            Kind = Mdl.ModelKind.Hybrid,
            Compressor = comp is null || comp.Kind == Cfg.CompressorKind.None
                ? new Mdl.CompressorSettings { Kind = Mdl.CompressorKind.None }
                : new Mdl.CompressorSettings
                {
                    Kind = comp.Kind == Cfg.CompressorKind.Mps ? Mdl.CompressorKind.Mps : Mdl.CompressorKind.Dense,
                    OutputSize = comp.OutputSize,
                    BondDimension = comp.BondDimension,
                    FeatureMap = comp.FeatureMap == MpsFeatureMap.CosSin ? SiteFeatureMap.Trigonometric : SiteFeatureMap.Linear,
                    Hidden = comp.HiddenSizes.ToArray(),
                    Activation = MapActivation(comp.Activation),
                },
            Circuit = MapCircuit(circ),
            Simulation = new Mdl.SimulationSettings
            {
                Mode = sim.Mode switch
                {
                    Cfg.SimulationMode.Exact => Q.Simulation.SimulationMode.StateVector,
                    Cfg.SimulationMode.Shots => Q.Simulation.SimulationMode.Shots,
                    Cfg.SimulationMode.DensityMatrix => Q.Simulation.SimulationMode.DensityMatrix,
                    _ => Q.Simulation.SimulationMode.Trajectories,
                },
                Shots = sim.Shots,
                Trajectories = sim.Trajectories,
                // Evolution trainers never take gradients (model.simulation.gradient does not apply to them): pick the method
                // that is valid for the simulation mode, so shot or noisy simulation is not refused for a key the user cannot set.
                Gradient = trainer != TrainerKind.Dqn
                    ? (sim.Mode == Cfg.SimulationMode.Exact ? Q.Simulation.GradientMethod.Adjoint : Q.Simulation.GradientMethod.ParameterShift)
                    : sim.Gradient == Cfg.GradientMethod.Adjoint ? Q.Simulation.GradientMethod.Adjoint : Q.Simulation.GradientMethod.ParameterShift,
                Depolarizing = sim.Noise.Depolarizing,
                TwoQubitDepolarizing = sim.Noise.TwoQubitDepolarizing,
                AmplitudeDamping = sim.Noise.AmplitudeDamping,
                PhaseDamping = sim.Noise.PhaseDamping,
                Readout = sim.Noise.ReadoutError,
                BitFlip = sim.Noise.BitFlip,
                PhaseFlip = sim.Noise.PhaseFlip,
                Schedule = sim.Noise.Schedule switch
                {
                    NoiseSchedule.Linear => Q.Noise.ScheduleKind.LinearDrift,
                    NoiseSchedule.Step => Q.Noise.ScheduleKind.Step,
                    _ => Q.Noise.ScheduleKind.Constant,
                },
                EndScale = sim.Noise.EndScale,
                StepAt = sim.Noise.StepAt,
                Threads = Math.Max(1, sim.Threads),
            },
        };
    }

    private static Mdl.Activation MapActivation(ActivationKind a) => a == ActivationKind.Relu ? Mdl.Activation.Relu : Mdl.Activation.Tanh;

    private static Mdl.CircuitSettings MapCircuit(Cfg.CircuitSettings c) => new()
    {
        Qubits = c.Qubits,
        Layers = c.Layers,
        Encoding = c.Encoding switch
        {
            Cfg.EncodingKind.Angle or Cfg.EncodingKind.Reuploading => Mdl.EncodingKind.AngleX,
            Cfg.EncodingKind.Basis => Mdl.EncodingKind.Basis,
            Cfg.EncodingKind.Amplitude => Mdl.EncodingKind.Amplitude,
            _ => Mdl.EncodingKind.ProductZz,
        },
        Reupload = c.Encoding == Cfg.EncodingKind.Reuploading,
        Rotations = c.Rotations.Select(r => r switch { Cfg.RotationAxis.Rx => Mdl.RotationAxis.X, Cfg.RotationAxis.Ry => Mdl.RotationAxis.Y, _ => Mdl.RotationAxis.Z }).ToArray(),
        Entangler = c.Entangler switch
        {
            EntanglerLayout.Chain => EntanglerPattern.Linear,
            EntanglerLayout.Ring => EntanglerPattern.Ring,
            EntanglerLayout.AllToAll => EntanglerPattern.AllPairs,
            _ => EntanglerPattern.None,
        },
        EntanglingGate = c.EntanglingGate == Cfg.EntanglingGate.Cnot ? Mdl.EntanglingGate.CNOT : Mdl.EntanglingGate.CZ,
        InputSquash = c.InputSquash == Cfg.InputSquash.Arctan ? Q.Circuits.InputSquash.Arctan : Q.Circuits.InputSquash.None,
        TrainableInputScaling = c.TrainableInputScaling,
        TrainableReadout = c.TrainableOutputWeights,
        Readout = c.Readout == Cfg.ReadoutKind.PerAction ? Mdl.ReadoutKind.PerAction : Mdl.ReadoutKind.Linear,
    };

    public void Dispose()
    {
        for (int i = _owned.Count - 1; i >= 0; i--) _owned[i].Dispose();
        _owned.Clear();
    }
}
