using System.Text;

namespace HybridRL.Experiments.Config;

/// <summary>
/// The single table of every known configuration key: type, default, range, applicability and description.
/// Validation, "did you mean" suggestions, the resolved-config writer, <see cref="SpecDiff"/> and the
/// documentation (<see cref="ToMarkdown"/>) are all driven by it. Defaults are common practice unless a source is named.
/// The <c>environment</c> section is free-form apart from <c>environment.kind</c>; see <see cref="EnvironmentSettings"/>.
/// </summary>
public static class ConfigKeyTable
{
    /// <summary>Environment kinds HybridRL knows (the environment layer validates their parameters).</summary>
    public static IReadOnlyList<string> EnvironmentKinds { get; } =
        ["cart-pole", "slippery-warehouse", "survey-drone", "qubit-steering", "external"];

    private static readonly ConfigKeyCondition Hybrid = When("model.kind", "hybrid");
    private static readonly ConfigKeyCondition Classical = When("model.kind", "classical");
    private static readonly ConfigKeyCondition Dqn = When("trainer.kind", "dqn");
    private static readonly ConfigKeyCondition Genetic = When("trainer.kind", "genetic");
    private static readonly ConfigKeyCondition Es = When("trainer.kind", "evolution_strategies");
    private static readonly ConfigKeyCondition Cma = When("trainer.kind", "cma_es");

    private static ConfigKeyCondition When(string key, params string[] values) => new(key, values);

    public static IReadOnlyList<ConfigKey> All { get; } = Build();

    private static readonly Dictionary<string, ConfigKey> ByPath = All.ToDictionary(k => k.Path, StringComparer.Ordinal);

    /// <summary>Key by dotted path, or null.</summary>
    public static ConfigKey? Find(string dottedPath) => ByPath.GetValueOrDefault(dottedPath);

    /// <summary>Keys whose change does not alter what a resumed run computes.</summary>
    public static IReadOnlyList<string> SafeOnResumeKeys { get; } = All.Where(k => k.SafeOnResume).Select(k => k.Path).ToArray();

    private static ConfigKey Int(string path, long def, string desc, Func<ExperimentSpec, object?> read, double? min = null, double? max = null,
        bool safe = false, params ConfigKeyCondition[] when) =>
        new(path, ConfigValueKind.Integer, def, desc, read) { Minimum = min, Maximum = max, SafeOnResume = safe, AppliesWhen = when };

    private static ConfigKey Num(string path, double? def, string desc, Func<ExperimentSpec, object?> read, double? min = null, double? max = null,
        bool exclusiveMin = false, bool safe = false, params ConfigKeyCondition[] when) =>
        new(path, ConfigValueKind.Number, def, desc, read) { Minimum = min, Maximum = max, MinimumExclusive = exclusiveMin, SafeOnResume = safe, AppliesWhen = when };

    private static ConfigKey Bool(string path, bool def, string desc, Func<ExperimentSpec, object?> read, params ConfigKeyCondition[] when) =>
        new(path, ConfigValueKind.Boolean, def, desc, read) { AppliesWhen = when };

    private static ConfigKey Text(string path, string? def, string desc, Func<ExperimentSpec, object?> read, bool safe = false) =>
        new(path, ConfigValueKind.Text, def, desc, read) { SafeOnResume = safe };

    private static ConfigKey Choice<T>(string path, T def, string desc, Func<ExperimentSpec, T> read, params ConfigKeyCondition[] when)
        where T : struct, Enum =>
        new(path, ConfigValueKind.Choice, ChoiceNames.ToName(def), desc, s => ChoiceNames.ToName(read(s)))
        { Choices = ChoiceNames.All<T>(), AppliesWhen = when };

    private static EquatableList<long> Longs(IEnumerable<int> values) => new(values.Select(v => (long)v));

    private static IReadOnlyList<ConfigKey> Build() =>
    [
        // ---- experiment
        Text("experiment.name", "", "Run name, used as the folder runs/<name>/; empty = file name of the last experiment file (letters, digits, . _ -).",
            s => s.Experiment.Name),
        Text("experiment.description", "", "Free-text description kept with the run.", s => s.Experiment.Description),
        Int("experiment.seed", 0, "Root seed; every random stream (environments, replay, exploration, initialisation, mutation, shots) is derived from it.",
            s => (long)s.Experiment.Seed, min: 0),
        Int("experiment.budget.env_steps", 0, "Stop after this many environment steps (0 = unlimited).", s => s.Experiment.Budget.EnvSteps, min: 0, safe: true),
        Int("experiment.budget.episodes", 0, "Stop after this many training episodes (0 = unlimited).", s => s.Experiment.Budget.Episodes, min: 0, safe: true),
        Int("experiment.budget.generations", 0, "Stop after this many generations of an evolutionary trainer (0 = unlimited).",
            s => s.Experiment.Budget.Generations, min: 0, safe: true),
        Int("experiment.budget.circuit_executions", 0, "Stop after this many circuit executions (0 = unlimited).",
            s => s.Experiment.Budget.CircuitExecutions, min: 0, safe: true),
        Num("experiment.budget.wall_seconds", 0, "Stop after this much wall-clock time in seconds (0 = unlimited).",
            s => s.Experiment.Budget.WallSeconds, min: 0, safe: true),

        // ---- environment (kind only; the other keys are free-form parameters)
        new ConfigKey("environment.kind", ConfigValueKind.Choice, null, "Environment to train on; its parameters are the other keys of the environment section.",
            s => s.Environment.Kind) { Choices = EnvironmentKinds, Required = true },

        // ---- model
        Choice("model.kind", ModelKind.Hybrid, "hybrid = compressor → variational circuit → read-out; classical = plain neural-network baseline.", s => s.Model.Kind),
        Choice("model.compressor.kind", CompressorKind.None, "Classical compressor in front of the circuit: none, mps (matrix product state) or dense (small neural network).",
            s => s.Model.Compressor!.Kind, Hybrid),
        Int("model.compressor.bond_dimension", 4, "MPS bond dimension (Stoudenmire & Schwab 2016); larger = more expressive, cost grows with its square.",
            s => (long)s.Model.Compressor!.BondDimension, min: 1, max: 256, when: [Hybrid, When("model.compressor.kind", "mps")]),
        Int("model.compressor.output_size", 0, "Features handed to the encoding; 0 = as many as the encoding takes (qubits, or 2^qubits for amplitude).",
            s => (long)s.Model.Compressor!.OutputSize, min: 0, max: 4096, when: [Hybrid, When("model.compressor.kind", "mps", "dense")]),
        Choice("model.compressor.feature_map", MpsFeatureMap.CosSin, "MPS local feature map: cos_sin = (cos πx/2, sin πx/2) (Stoudenmire & Schwab 2016), linear = (1, x).",
            s => s.Model.Compressor!.FeatureMap, Hybrid, When("model.compressor.kind", "mps")),
        new ConfigKey("model.compressor.hidden_sizes", ConfigValueKind.IntegerList, Longs([32]), "Hidden layer sizes of the dense compressor.",
            s => Longs(s.Model.Compressor!.HiddenSizes)) { Minimum = 1, Maximum = 4096, AppliesWhen = [Hybrid, When("model.compressor.kind", "dense")] },
        Choice("model.compressor.activation", ActivationKind.Tanh, "Activation of the dense compressor (tanh keeps features bounded, suited to angle encodings).",
            s => s.Model.Compressor!.Activation, Hybrid, When("model.compressor.kind", "dense")),

        Int("model.circuit.qubits", 4, "Number of qubits.", s => (long)s.Model.Circuit!.Qubits, min: 1, max: 24, when: Hybrid),
        Int("model.circuit.layers", 2, "Number of variational layers (rotations + entangler).", s => (long)s.Model.Circuit!.Layers, min: 1, max: 100, when: Hybrid),
        Choice("model.circuit.encoding", EncodingKind.Angle, "Feature encoding: basis (discrete state index as bits), angle (one feature per qubit), amplitude (2^qubits features), reuploading (angle encoding before every layer), product_zz (angles plus ZZ feature products).",
            s => s.Model.Circuit!.Encoding, Hybrid),
        new ConfigKey("model.circuit.rotations", ConfigValueKind.ChoiceList, new EquatableList<string>(["ry", "rz"]), "Trainable single-qubit rotations applied to every qubit in each layer, in order.",
            s => new EquatableList<string>(s.Model.Circuit!.Rotations.Select(ChoiceNames.ToName))) { Choices = ChoiceNames.All<RotationAxis>(), NonEmpty = true, AppliesWhen = [Hybrid] },
        Choice("model.circuit.entangler", EntanglerLayout.Chain, "Qubit pairs entangled in each layer: chain (i,i+1), ring (chain plus last–first), all_to_all, none.",
            s => s.Model.Circuit!.Entangler, Hybrid),
        Choice("model.circuit.entangling_gate", EntanglingGate.Cz, "Two-qubit gate of the entangler.",
            s => s.Model.Circuit!.EntanglingGate, Hybrid, When("model.circuit.entangler", "chain", "ring", "all_to_all")),
        Choice("model.circuit.input_squash", InputSquash.Arctan, "Squash features before encoding: arctan maps unbounded observations into (−π/2, π/2); none passes them through.",
            s => s.Model.Circuit!.InputSquash, Hybrid, When("model.circuit.encoding", "angle", "reuploading", "product_zz", "amplitude")),
        Bool("model.circuit.trainable_input_scaling", true, "Learn one scale per encoded feature (common practice for re-uploading circuits).",
            s => s.Model.Circuit!.TrainableInputScaling, Hybrid, When("model.circuit.encoding", "angle", "reuploading", "product_zz")),
        Choice("model.circuit.readout", ReadoutKind.PerAction, "per_action = ⟨Z⟩ of qubit a is the value of action a; linear = trainable linear map from all ⟨Z⟩ to action values.",
            s => s.Model.Circuit!.Readout, Hybrid),
        Bool("model.circuit.trainable_output_weights", true, "Learn the read-out (per_action: a scale and a bias per action; linear: W and b). false keeps it at its initial values (per_action: value of action a = ⟨Z_a⟩) with no parameters, so no per-action bias can favour some actions everywhere.",
            s => s.Model.Circuit!.TrainableOutputWeights, Hybrid),

        Choice("model.simulation.mode", SimulationMode.Exact, "exact = state vector with exact expectations; shots = state vector sampled with shots; density_matrix = noisy mixed-state simulation; trajectories = noisy Monte-Carlo state vectors.",
            s => s.Model.Simulation!.Mode, Hybrid),
        Int("model.simulation.shots", 0, "Measurement shots per circuit execution; 0 = exact expectation values (mode shots needs > 0).",
            s => (long)s.Model.Simulation!.Shots, min: 0, max: 10_000_000, when: Hybrid),
        Int("model.simulation.trajectories", 100, "Monte-Carlo trajectories per circuit execution (mode trajectories).",
            s => (long)s.Model.Simulation!.Trajectories, min: 1, max: 1_000_000, when: [Hybrid, When("model.simulation.mode", "trajectories")]),
        Int("model.simulation.threads", 1, "Simulator threads per run; 0 = all cores. Results do not depend on it (default 1: sweeps parallelise over runs).",
            s => (long)s.Model.Simulation!.Threads, min: 0, max: 1024, safe: true, when: Hybrid),
        Choice("model.simulation.gradient", GradientMethod.Adjoint, "Circuit gradient for DQN: adjoint (Jones & Gacon 2020; exact noise-free only) or parameter_shift (Mitarai et al. 2018; works with shots and noise).",
            s => s.Model.Simulation!.Gradient, Hybrid, Dqn),
        Num("model.simulation.noise.depolarizing", 0, "Single-qubit depolarizing probability after each one-qubit gate (Nielsen & Chuang §8.3.4).",
            s => s.Model.Simulation!.Noise.Depolarizing, min: 0, max: 1, when: Hybrid),
        Num("model.simulation.noise.two_qubit_depolarizing", 0, "Two-qubit depolarizing probability after each two-qubit gate.",
            s => s.Model.Simulation!.Noise.TwoQubitDepolarizing, min: 0, max: 1, when: Hybrid),
        Num("model.simulation.noise.amplitude_damping", 0, "Amplitude-damping probability γ after each gate (Nielsen & Chuang §8.3.5).",
            s => s.Model.Simulation!.Noise.AmplitudeDamping, min: 0, max: 1, when: Hybrid),
        Num("model.simulation.noise.phase_damping", 0, "Phase-damping probability after each gate (Nielsen & Chuang §8.3.6).",
            s => s.Model.Simulation!.Noise.PhaseDamping, min: 0, max: 1, when: Hybrid),
        Num("model.simulation.noise.bit_flip", 0, "Bit-flip probability after each gate (Nielsen & Chuang §8.3.3).",
            s => s.Model.Simulation!.Noise.BitFlip, min: 0, max: 1, when: Hybrid),
        Num("model.simulation.noise.phase_flip", 0, "Phase-flip probability after each gate (Nielsen & Chuang §8.3.3).",
            s => s.Model.Simulation!.Noise.PhaseFlip, min: 0, max: 1, when: Hybrid),
        Num("model.simulation.noise.readout_error", 0, "Probability that a measured bit is reported flipped.",
            s => s.Model.Simulation!.Noise.ReadoutError, min: 0, max: 0.5, when: Hybrid),
        Choice("model.simulation.noise.schedule", NoiseSchedule.Constant, "How noise strengths change over the budget: constant, linear (from ×1 to ×end_scale), step (×end_scale from step_at on).",
            s => s.Model.Simulation!.Noise.Schedule, Hybrid),
        Num("model.simulation.noise.end_scale", 1, "Multiplier on every noise probability at the end (linear) or after step_at (step).",
            s => s.Model.Simulation!.Noise.EndScale, min: 0, max: 1000, when: [Hybrid, When("model.simulation.noise.schedule", "linear", "step")]),
        Num("model.simulation.noise.step_at", 0.5, "Fraction of the budget at which a step schedule switches to end_scale.",
            s => s.Model.Simulation!.Noise.StepAt, min: 0, max: 1, when: [Hybrid, When("model.simulation.noise.schedule", "step")]),

        new ConfigKey("model.classical.hidden_sizes", ConfigValueKind.IntegerList, Longs([64, 64]), "Hidden layer sizes of the classical baseline network (common practice for small control tasks).",
            s => Longs(s.Model.Classical!.HiddenSizes)) { Minimum = 1, Maximum = 65536, NonEmpty = true, AppliesWhen = [Classical] },
        Choice("model.classical.activation", ActivationKind.Relu, "Activation of the classical baseline.", s => s.Model.Classical!.Activation, Classical),

        // ---- trainer
        Choice("trainer.kind", TrainerKind.Dqn, "Training algorithm: dqn (Mnih et al. 2015), genetic, evolution_strategies (Salimans et al. 2017), cma_es (Hansen 2016).",
            s => s.Trainer.Kind),
        Int("trainer.dqn.replay_capacity", 50_000, "Replay buffer capacity in transitions.", s => (long)s.Trainer.Dqn!.ReplayCapacity, min: 1, max: 100_000_000, when: Dqn),
        Int("trainer.dqn.warmup_steps", 1_000, "Environment steps collected before the first update (must be ≥ batch_size).", s => (long)s.Trainer.Dqn!.WarmupSteps, min: 0, max: int.MaxValue, when: Dqn),
        Int("trainer.dqn.update_every", 1, "Environment steps between gradient updates.", s => (long)s.Trainer.Dqn!.UpdateEvery, min: 1, max: 1_000_000, when: Dqn),
        Int("trainer.dqn.batch_size", 32, "Transitions per gradient update (32 as in Mnih et al. 2015).", s => (long)s.Trainer.Dqn!.BatchSize, min: 1, max: 65_536, when: Dqn),
        Choice("trainer.dqn.target_update", TargetUpdateKind.Hard, "Target network update: hard (copy every target_update_every steps) or polyak (soft average with polyak_tau each update).",
            s => s.Trainer.Dqn!.TargetUpdate, Dqn),
        Int("trainer.dqn.target_update_every", 500, "Environment steps between hard target copies.", s => (long)s.Trainer.Dqn!.TargetUpdateEvery, min: 1, max: int.MaxValue,
            when: [Dqn, When("trainer.dqn.target_update", "hard")]),
        Num("trainer.dqn.polyak_tau", 0.005, "Soft target update factor τ: target ← τ·online + (1−τ)·target.", s => s.Trainer.Dqn!.PolyakTau, min: 0, max: 1,
            exclusiveMin: true, when: [Dqn, When("trainer.dqn.target_update", "polyak")]),
        Bool("trainer.dqn.double_dqn", true, "Double DQN targets (van Hasselt et al. 2016).", s => s.Trainer.Dqn!.DoubleDqn, Dqn),
        Choice("trainer.dqn.loss", DqnLoss.Huber, "TD loss: huber (robust to large errors) or squared.", s => s.Trainer.Dqn!.Loss, Dqn),
        Num("trainer.dqn.gamma", 0.99, "Discount factor.", s => s.Trainer.Dqn!.Gamma, min: 0, max: 1, when: Dqn),
        Num("trainer.dqn.epsilon_start", 1.0, "Exploration rate at the start.", s => s.Trainer.Dqn!.EpsilonStart, min: 0, max: 1, when: Dqn),
        Num("trainer.dqn.epsilon_end", 0.05, "Exploration rate after epsilon_decay_steps.", s => s.Trainer.Dqn!.EpsilonEnd, min: 0, max: 1, when: Dqn),
        Int("trainer.dqn.epsilon_decay_steps", 10_000, "Environment steps over which epsilon decays from start to end.", s => s.Trainer.Dqn!.EpsilonDecaySteps, min: 0, when: Dqn),
        Choice("trainer.dqn.epsilon_decay", EpsilonDecay.Linear, "Shape of the epsilon decay.", s => s.Trainer.Dqn!.EpsilonDecay, Dqn),
        Choice("trainer.dqn.optimizer", OptimizerKind.Adam, "Gradient optimiser.", s => s.Trainer.Dqn!.Optimizer, Dqn),
        Num("trainer.dqn.learning_rate", 0.001, "Optimiser learning rate (0.001 is Adam's usual default, Kingma & Ba 2015, from memory).", s => s.Trainer.Dqn!.LearningRate,
            min: 0, max: 10, exclusiveMin: true, when: Dqn),
        Choice("trainer.dqn.learning_rate_schedule", LearningRateSchedule.Constant, "Learning-rate schedule over the budget.", s => s.Trainer.Dqn!.LearningRateSchedule, Dqn),
        Num("trainer.dqn.gradient_clip_norm", 10, "Clip the global gradient norm to this value (0 = no clipping).", s => s.Trainer.Dqn!.GradientClipNorm, min: 0, when: Dqn),
        Int("trainer.dqn.eval_every", 5_000, "Environment steps between greedy evaluations (0 = none).", s => s.Trainer.Dqn!.EvalEvery, min: 0, when: Dqn),
        Int("trainer.dqn.eval_episodes", 5, "Episodes per greedy evaluation.", s => (long)s.Trainer.Dqn!.EvalEpisodes, min: 1, max: 100_000, when: Dqn),

        Int("trainer.genetic.population", 50, "Members per generation.", s => (long)s.Trainer.Genetic!.Population, min: 2, max: 100_000, when: Genetic),
        Num("trainer.genetic.truncation", 0.2, "Fraction of the population, best first, that may become parents (truncation selection).", s => s.Trainer.Genetic!.Truncation,
            min: 0, max: 1, exclusiveMin: true, when: Genetic),
        Num("trainer.genetic.mutation_sigma", 0.05, "Standard deviation of the Gaussian mutation added to every parameter.", s => s.Trainer.Genetic!.MutationSigma,
            min: 0, exclusiveMin: true, when: Genetic),
        Int("trainer.genetic.elites", 1, "Best members copied unchanged into the next generation.", s => (long)s.Trainer.Genetic!.Elites, min: 0, max: int.MaxValue, when: Genetic),
        Bool("trainer.genetic.crossover", false, "Uniform crossover between two parents before mutation.", s => s.Trainer.Genetic!.Crossover, Genetic),
        Int("trainer.genetic.episodes_per_member", 1, "Episodes averaged into each member's fitness.", s => (long)s.Trainer.Genetic!.EpisodesPerMember, min: 1, max: 10_000, when: Genetic),
        Int("trainer.genetic.elite_episodes", 0, "Extra episodes for each carried-over elite; its fitness is the mean over all its episodes (0 = none).",
            s => (long)s.Trainer.Genetic!.EliteEpisodes, min: 0, max: 10_000, when: Genetic),
        Int("trainer.genetic.eval_every", 10, "Generations between evaluations of the best member (0 = none).", s => (long)s.Trainer.Genetic!.EvalEvery, min: 0, max: int.MaxValue, when: Genetic),
        Int("trainer.genetic.eval_episodes", 5, "Episodes per evaluation.", s => (long)s.Trainer.Genetic!.EvalEpisodes, min: 1, max: 100_000, when: Genetic),

        Int("trainer.evolution_strategies.population", 50, "Members per generation; even, as antithetic pairs (+ε, −ε).", s => (long)s.Trainer.EvolutionStrategies!.Population,
            min: 2, max: 100_000, when: Es),
        Num("trainer.evolution_strategies.sigma", 0.05, "Standard deviation of the parameter perturbations.", s => s.Trainer.EvolutionStrategies!.Sigma, min: 0, exclusiveMin: true, when: Es),
        Num("trainer.evolution_strategies.learning_rate", 0.01, "Adam step size for the ascent along the gradient estimate.", s => s.Trainer.EvolutionStrategies!.LearningRate,
            min: 0, max: 10, exclusiveMin: true, when: Es),
        Num("trainer.evolution_strategies.weight_decay", 0.005, "L2 weight decay per generation (Salimans et al. 2017 used 0.005, from memory).", s => s.Trainer.EvolutionStrategies!.WeightDecay,
            min: 0, max: 1, when: Es),
        Int("trainer.evolution_strategies.episodes_per_member", 1, "Episodes averaged into each member's fitness.", s => (long)s.Trainer.EvolutionStrategies!.EpisodesPerMember,
            min: 1, max: 10_000, when: Es),
        Int("trainer.evolution_strategies.eval_every", 10, "Generations between evaluations of the mean parameters (0 = none).", s => (long)s.Trainer.EvolutionStrategies!.EvalEvery, min: 0, max: int.MaxValue, when: Es),
        Int("trainer.evolution_strategies.eval_episodes", 5, "Episodes per evaluation.", s => (long)s.Trainer.EvolutionStrategies!.EvalEpisodes, min: 1, max: 100_000, when: Es),

        Int("trainer.cma_es.population", 0, "Members per generation; 0 = 4 + floor(3 ln n) for n parameters (Hansen 2016).", s => (long)s.Trainer.CmaEs!.Population,
            min: 0, max: 100_000, when: Cma),
        Num("trainer.cma_es.sigma0", 0.5, "Initial step size σ₀ (about a quarter to a half of the parameter range is common practice).", s => s.Trainer.CmaEs!.Sigma0,
            min: 0, exclusiveMin: true, when: Cma),
        Int("trainer.cma_es.episodes_per_member", 1, "Episodes averaged into each member's fitness.", s => (long)s.Trainer.CmaEs!.EpisodesPerMember, min: 1, max: 10_000, when: Cma),
        Int("trainer.cma_es.eval_every", 10, "Generations between evaluations of the mean (0 = none).", s => (long)s.Trainer.CmaEs!.EvalEvery, min: 0, max: int.MaxValue, when: Cma),
        Int("trainer.cma_es.eval_episodes", 5, "Episodes per evaluation.", s => (long)s.Trainer.CmaEs!.EvalEpisodes, min: 1, max: 100_000, when: Cma),

        // ---- logging
        Int("logging.metrics_every_steps", 1_000, "Environment steps between metrics.csv rows (evolution: first generation end past each interval).",
            s => s.Logging.MetricsEverySteps, min: 1, safe: true),
        Num("logging.progress_seconds", 10, "Seconds between progress lines (0 = none).", s => s.Logging.ProgressSeconds, min: 0, safe: true),
        Int("logging.checkpoint_every_steps", 10_000, "Environment steps between checkpoints (0 = only on exit/signal).", s => s.Logging.CheckpointEverySteps, min: 0, safe: true),
        Int("logging.keep_checkpoints", 3, "Most recent checkpoints kept on disk.", s => (long)s.Logging.KeepCheckpoints, min: 1, max: 1_000, safe: true),
        Int("logging.final_eval_episodes", 20, "Greedy evaluation episodes at the end of the run, written to eval-final.json (0 = skip).",
            s => (long)s.Logging.FinalEvalEpisodes, min: 0, max: 1_000_000, safe: true),

        // ---- hardware (optional section: present when the profile or any key is given)
        Text("hardware.profile", null, "Hardware-profile YAML (keys as below, relative to the file naming it); keys given here override the profile's.",
            _ => null, safe: true),
        Text("hardware.name", "unnamed device", "Name of the (invented or measured) device profile.", s => s.Hardware?.Name, safe: true),
        Text("hardware.note", "", "Free text, e.g. where the numbers come from; outputs are estimates, not vendor quotes.", s => s.Hardware?.Note, safe: true),
        Num("hardware.seconds_per_shot", null, "Device time per shot in seconds (required when a hardware section is given).", s => s.Hardware?.SecondsPerShot,
            min: 0, exclusiveMin: true, safe: true),
        Num("hardware.per_circuit_overhead_seconds", 0, "Extra device time per circuit execution in seconds.", s => s.Hardware?.PerCircuitOverheadSeconds, min: 0, safe: true),
        Int("hardware.circuits_per_job", 1, "Circuits batched into one submitted job.", s => s.Hardware is null ? null : (long)s.Hardware.CircuitsPerJob, min: 1, max: int.MaxValue, safe: true),
        Num("hardware.queue_latency_seconds", 0, "Waiting time per job in seconds.", s => s.Hardware?.QueueLatencySeconds, min: 0, safe: true),
        Num("hardware.price_per_shot", null, "Price per shot (optional; omitted = no price estimate).", s => s.Hardware?.PricePerShot, min: 0, safe: true),
    ];

    /// <summary>The key table as a Markdown table (for documentation and a "config keys" command).</summary>
    public static string ToMarkdown()
    {
        var sb = new StringBuilder();
        sb.AppendLine("| key | type | default | range | applies when | safe on resume | description |");
        sb.AppendLine("|---|---|---|---|---|---|---|");
        foreach (var key in All)
        {
            var when = string.Join(", ", key.AppliesWhen.Select(c => $"{c.Key} = {string.Join("|", c.Values)}"));
            sb.Append("| `").Append(key.Path).Append("` | ").Append(key.TypeText.Replace("|", "\\|", StringComparison.Ordinal))
              .Append(" | ").Append(key.DefaultText.Replace("|", "\\|", StringComparison.Ordinal)).Append(" | ").Append(key.RangeText)
              .Append(" | ").Append(when.Replace("|", "\\|", StringComparison.Ordinal)).Append(" | ").Append(key.SafeOnResume ? "yes" : "")
              .Append(" | ").Append(key.Description.Replace("|", "\\|", StringComparison.Ordinal)).AppendLine(" |");
        }
        sb.AppendLine("| `environment.<parameter>` | text | | | | | Environment parameters, passed through to the environment layer. |");
        return sb.ToString();
    }
}
