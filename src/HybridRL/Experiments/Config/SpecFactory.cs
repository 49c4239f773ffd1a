namespace HybridRL.Experiments.Config;

/// <summary>Builds the immutable settings records from validated values.</summary>
internal static class SpecFactory
{
    public static ExperimentSpec Create(ResolvedValues v, string defaultName, IReadOnlyList<(string RelativeKey, string Value, ConfigOrigin? Origin)> parameters)
    {
        var name = v.Text("experiment.name");
        var hybrid = v.ChoiceText("model.kind") == "hybrid";
        var trainer = v.Choice<TrainerKind>("trainer.kind");
        var hardwarePresent = ConfigKeyTable.All.Any(k => k.Path.StartsWith("hardware.", StringComparison.Ordinal) && v.IsExplicit(k.Path));
        return new ExperimentSpec
        {
            Experiment = new ExperimentSettings
            {
                Name = name.Length == 0 ? defaultName : name,
                Description = v.Text("experiment.description"),
                Seed = (ulong)v.Int("experiment.seed"),
                Budget = new BudgetSettings
                {
                    EnvSteps = v.Int("experiment.budget.env_steps"),
                    Episodes = v.Int("experiment.budget.episodes"),
                    Generations = v.Int("experiment.budget.generations"),
                    CircuitExecutions = v.Int("experiment.budget.circuit_executions"),
                    WallSeconds = v.Num("experiment.budget.wall_seconds"),
                },
            },
            Environment = new EnvironmentSettings
            {
                Kind = v.ChoiceText("environment.kind"),
                Parameters = new EquatableStringMap(parameters.Select(p => KeyValuePair.Create(p.RelativeKey.ToLowerInvariant(), p.Value))),
            },
            Model = new ModelSettings
            {
                Kind = v.Choice<ModelKind>("model.kind"),
                Compressor = hybrid ? Compressor(v) : null,
                Circuit = hybrid ? Circuit(v) : null,
                Simulation = hybrid ? Simulation(v) : null,
                Classical = hybrid ? null : new ClassicalModelSettings
                {
                    HiddenSizes = v.Ints("model.classical.hidden_sizes"),
                    Activation = v.Choice<ActivationKind>("model.classical.activation"),
                },
            },
            Trainer = new TrainerSettings
            {
                Kind = trainer,
                Dqn = trainer == TrainerKind.Dqn ? Dqn(v) : null,
                Genetic = trainer == TrainerKind.Genetic ? Genetic(v) : null,
                EvolutionStrategies = trainer == TrainerKind.EvolutionStrategies ? Es(v) : null,
                CmaEs = trainer == TrainerKind.CmaEs ? CmaEs(v) : null,
            },
            Logging = new LoggingSettings
            {
                MetricsEverySteps = v.Int("logging.metrics_every_steps"),
                ProgressSeconds = v.Num("logging.progress_seconds"),
                CheckpointEverySteps = v.Int("logging.checkpoint_every_steps"),
                KeepCheckpoints = v.Int32("logging.keep_checkpoints"),
                FinalEvalEpisodes = v.Int32("logging.final_eval_episodes"),
            },
            Hardware = hardwarePresent ? new HardwareSettings
            {
                Name = v.Text("hardware.name"),
                Note = v.Text("hardware.note"),
                SecondsPerShot = v.Num("hardware.seconds_per_shot"),
                PerCircuitOverheadSeconds = v.Num("hardware.per_circuit_overhead_seconds"),
                CircuitsPerJob = v.Int32("hardware.circuits_per_job"),
                QueueLatencySeconds = v.Num("hardware.queue_latency_seconds"),
                PricePerShot = v.NumOrNull("hardware.price_per_shot"),
            } : null,
        };
    }

    private static CompressorSettings Compressor(ResolvedValues v)
    {
        var kind = v.Choice<CompressorKind>("model.compressor.kind");
        var outputSize = v.Int32("model.compressor.output_size");
        if (kind != CompressorKind.None && outputSize == 0)
        {
            // 0 = match the encoding: one feature per qubit, or 2^qubits for amplitude encoding (capped at the key's maximum).
            var qubits = v.Int32("model.circuit.qubits");
            outputSize = v.ChoiceText("model.circuit.encoding") == "amplitude" ? (int)Math.Min(1L << qubits, 4096) : qubits;
        }
        return new CompressorSettings
        {
            Kind = kind,
            BondDimension = v.Int32("model.compressor.bond_dimension"),
            OutputSize = kind == CompressorKind.None ? 0 : outputSize,
            FeatureMap = v.Choice<MpsFeatureMap>("model.compressor.feature_map"),
            HiddenSizes = v.Ints("model.compressor.hidden_sizes"),
            Activation = v.Choice<ActivationKind>("model.compressor.activation"),
        };
    }

    private static CircuitSettings Circuit(ResolvedValues v) => new()
    {
        Qubits = v.Int32("model.circuit.qubits"),
        Layers = v.Int32("model.circuit.layers"),
        Encoding = v.Choice<EncodingKind>("model.circuit.encoding"),
        Rotations = v.Choices<RotationAxis>("model.circuit.rotations"),
        Entangler = v.Choice<EntanglerLayout>("model.circuit.entangler"),
        EntanglingGate = v.Choice<EntanglingGate>("model.circuit.entangling_gate"),
        InputSquash = v.Choice<InputSquash>("model.circuit.input_squash"),
        TrainableInputScaling = v.Bool("model.circuit.trainable_input_scaling"),
        Readout = v.Choice<ReadoutKind>("model.circuit.readout"),
        TrainableOutputWeights = v.Bool("model.circuit.trainable_output_weights"),
    };

    private static SimulationSettings Simulation(ResolvedValues v) => new()
    {
        Mode = v.Choice<SimulationMode>("model.simulation.mode"),
        Shots = v.Int32("model.simulation.shots"),
        Trajectories = v.Int32("model.simulation.trajectories"),
        Threads = v.Int32("model.simulation.threads"),
        Gradient = v.Choice<GradientMethod>("model.simulation.gradient"),
        Noise = new NoiseSettings
        {
            Depolarizing = v.Num("model.simulation.noise.depolarizing"),
            TwoQubitDepolarizing = v.Num("model.simulation.noise.two_qubit_depolarizing"),
            AmplitudeDamping = v.Num("model.simulation.noise.amplitude_damping"),
            PhaseDamping = v.Num("model.simulation.noise.phase_damping"),
            BitFlip = v.Num("model.simulation.noise.bit_flip"),
            PhaseFlip = v.Num("model.simulation.noise.phase_flip"),
            ReadoutError = v.Num("model.simulation.noise.readout_error"),
            Schedule = v.Choice<NoiseSchedule>("model.simulation.noise.schedule"),
            EndScale = v.Num("model.simulation.noise.end_scale"),
            StepAt = v.Num("model.simulation.noise.step_at"),
        },
    };

    private static DqnSettings Dqn(ResolvedValues v) => new()
    {
        ReplayCapacity = v.Int32("trainer.dqn.replay_capacity"),
        WarmupSteps = v.Int32("trainer.dqn.warmup_steps"),
        UpdateEvery = v.Int32("trainer.dqn.update_every"),
        BatchSize = v.Int32("trainer.dqn.batch_size"),
        TargetUpdate = v.Choice<TargetUpdateKind>("trainer.dqn.target_update"),
        TargetUpdateEvery = v.Int32("trainer.dqn.target_update_every"),
        PolyakTau = v.Num("trainer.dqn.polyak_tau"),
        DoubleDqn = v.Bool("trainer.dqn.double_dqn"),
        Loss = v.Choice<DqnLoss>("trainer.dqn.loss"),
        Gamma = v.Num("trainer.dqn.gamma"),
        EpsilonStart = v.Num("trainer.dqn.epsilon_start"),
        EpsilonEnd = v.Num("trainer.dqn.epsilon_end"),
        EpsilonDecaySteps = v.Int("trainer.dqn.epsilon_decay_steps"),
        EpsilonDecay = v.Choice<EpsilonDecay>("trainer.dqn.epsilon_decay"),
        Optimizer = v.Choice<OptimizerKind>("trainer.dqn.optimizer"),
        LearningRate = v.Num("trainer.dqn.learning_rate"),
        LearningRateSchedule = v.Choice<LearningRateSchedule>("trainer.dqn.learning_rate_schedule"),
        GradientClipNorm = v.Num("trainer.dqn.gradient_clip_norm"),
        EvalEvery = v.Int("trainer.dqn.eval_every"),
        EvalEpisodes = v.Int32("trainer.dqn.eval_episodes"),
    };

    private static GeneticSettings Genetic(ResolvedValues v) => new()
    {
        Population = v.Int32("trainer.genetic.population"),
        Truncation = v.Num("trainer.genetic.truncation"),
        MutationSigma = v.Num("trainer.genetic.mutation_sigma"),
        Elites = v.Int32("trainer.genetic.elites"),
        Crossover = v.Bool("trainer.genetic.crossover"),
        EpisodesPerMember = v.Int32("trainer.genetic.episodes_per_member"),
        EliteEpisodes = v.Int32("trainer.genetic.elite_episodes"),
        EvalEvery = v.Int32("trainer.genetic.eval_every"),
        EvalEpisodes = v.Int32("trainer.genetic.eval_episodes"),
    };

    private static EvolutionStrategiesSettings Es(ResolvedValues v) => new()
    {
        Population = v.Int32("trainer.evolution_strategies.population"),
        Sigma = v.Num("trainer.evolution_strategies.sigma"),
        LearningRate = v.Num("trainer.evolution_strategies.learning_rate"),
        WeightDecay = v.Num("trainer.evolution_strategies.weight_decay"),
        EpisodesPerMember = v.Int32("trainer.evolution_strategies.episodes_per_member"),
        EvalEvery = v.Int32("trainer.evolution_strategies.eval_every"),
        EvalEpisodes = v.Int32("trainer.evolution_strategies.eval_episodes"),
    };

    private static CmaEsSettings CmaEs(ResolvedValues v) => new()
    {
        Population = v.Int32("trainer.cma_es.population"),
        Sigma0 = v.Num("trainer.cma_es.sigma0"),
        EpisodesPerMember = v.Int32("trainer.cma_es.episodes_per_member"),
        EvalEvery = v.Int32("trainer.cma_es.eval_every"),
        EvalEpisodes = v.Int32("trainer.cma_es.eval_episodes"),
    };
}
