using System.Globalization;
using System.Text;
using System.Text.Json;
using System.Text.Json.Serialization;
using HybridRL.Experiments.Config;
using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Circuits;
using GradientCost = HybridRL.Quantum.Simulation.GradientCost;
using HybridRL.Training.DeepQ;
using HybridRL.Training.Evolution;

namespace HybridRL.Experiments.Inspection;

/// <summary>
/// What an experiment would build and cost, without training (what <c>hybridrl inspect CONFIG</c> prints):
/// parameter counts per component, the circuit (drawing, gate counts, depth, two-qubit gates), circuit
/// executions per environment step and per update or generation, and the memory the run needs.
/// </summary>
public sealed record ExperimentInspection
{
    public required string Name { get; init; }
    public required string ConfigHash { get; init; }
    public required string Trainer { get; init; }
    public required string Environment { get; init; }
    public required int ObservationSize { get; init; }
    public required int Actions { get; init; }
    public required string Model { get; init; }
    public required long ParameterCount { get; init; }
    public required IReadOnlyDictionary<string, int> ParameterCounts { get; init; }
    /// <summary>Null for classical models.</summary>
    public CircuitInspection? Circuit { get; init; }
    /// <summary>Null for classical models (they execute no circuits).</summary>
    public ExecutionCosts? Executions { get; init; }
    public required MemoryEstimate Memory { get; init; }

    private static readonly JsonSerializerOptions Json = new()
    {
        WriteIndented = true,
        PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower,
        DefaultIgnoreCondition = JsonIgnoreCondition.WhenWritingNull,
    };

    public string ToJson() => JsonSerializer.Serialize(this, Json);

    /// <summary>Inspects <paramref name="spec"/>: builds its environment and one model (no trainer, no replay buffer).</summary>
    public static ExperimentInspection Of(ExperimentSpec spec, bool includeQasm = false)
    {
        ArgumentNullException.ThrowIfNull(spec);
        TorchRuntime.EnsureLoaded();
        using var components = ExperimentComponents.Describe(spec);
        return Of(spec, components, includeQasm);
    }

    /// <summary>
    /// Inspects <paramref name="spec"/> with components already built from it (a training session's): creates one
    /// model of the run's seed, and no further environment. The caller keeps ownership of <paramref name="components"/>.
    /// </summary>
    public static ExperimentInspection Of(ExperimentSpec spec, ExperimentComponents components, bool includeQasm = false)
    {
        ArgumentNullException.ThrowIfNull(spec);
        ArgumentNullException.ThrowIfNull(components);
        using var model = components.CreateModel();

        CircuitInspection? circuit = null;
        ExecutionCosts? costs = null;
        long simulatorBytes = 0;
        int models = ModelCopies(spec);
        if (model is HybridModel hybrid)
        {
            var c = hybrid.CircuitDesign.Circuit;
            var observables = hybrid.CircuitDesign.Observables;
            var r = c.Resources;
            int settings = GradientCost.MeasurementSettings(c, observables);
            int shift = GradientCost.ShiftEvaluationsPerRow(c);
            circuit = new CircuitInspection
            {
                Qubits = r.Qubits,
                Gates = r.TotalGates,
                GatesByKind = r.GatesByKind.ToDictionary(kv => kv.Key.ToString(), kv => kv.Value),
                Depth = r.Depth,
                TwoQubitGates = r.TwoQubitGates,
                CircuitParameters = r.ParameterCount,
                Inputs = r.InputCount,
                Observables = observables.Count,
                MeasurementSettings = settings,
                ShiftEvaluationsPerRow = shift,
                Drawing = CircuitDrawing.Draw(c),
                Qasm = includeQasm ? OpenQasmExporter.Export(c) : null,
            };
            costs = Costs(spec, components, settings, shift, hybrid.QuantumLayer.Evaluator.GradientMethod == HybridRL.Quantum.Simulation.GradientMethod.Adjoint);
            var sim = spec.Model.Simulation!;
            bool density = sim.Mode == Config.SimulationMode.DensityMatrix;
            long amplitudes = 1L << (density ? 2 * r.Qubits : r.Qubits);
            int workspaces = sim.Threads > 0 ? sim.Threads : System.Environment.ProcessorCount;
            simulatorBytes = models * (long)workspaces * 3 * amplitudes * 16;
        }

        long? perTransition = null, replay = null;
        int? capacity = null;
        if (spec.Trainer.Dqn is { } dqn)
        {
            perTransition = ReplayBuffer.BytesPerTransition(components.ObservationSize, components.ObservationIsBinary);
            capacity = dqn.ReplayCapacity;
            replay = perTransition * capacity;
        }
        long parameterBytes = models * (long)model.ParameterCount * sizeof(double);
        long total = (replay ?? 0) + simulatorBytes + parameterBytes;
        long available = GC.GetGCMemoryInfo().TotalAvailableMemoryBytes;

        return new ExperimentInspection
        {
            Name = spec.Experiment.Name,
            ConfigHash = spec.Hash(),
            Trainer = ChoiceNames.ToName(spec.Trainer.Kind),
            Environment = spec.Environment.Kind,
            ObservationSize = components.ObservationSize,
            Actions = components.ActionCount,
            Model = ChoiceNames.ToName(spec.Model.Kind),
            ParameterCount = model.ParameterCount,
            ParameterCounts = new Dictionary<string, int>(model.ParameterCounts),
            Circuit = circuit,
            Executions = costs,
            Memory = new MemoryEstimate
            {
                ReplayBytes = replay,
                ReplayBytesPerTransition = perTransition,
                ReplayCapacity = capacity,
                SimulatorBytes = simulatorBytes,
                ParameterBytes = parameterBytes,
                TotalBytes = total,
                AvailableBytes = available,
                Fits = total <= available,
            },
        };
    }

    /// <summary>Model copies a run holds: DQN online + target; evolution one per population slice + the evaluation model.</summary>
    private static int ModelCopies(ExperimentSpec spec)
    {
        if (spec.Trainer.Kind == TrainerKind.Dqn) return 2;
        int population = spec.Trainer.Genetic?.Population ?? spec.Trainer.EvolutionStrategies?.Population ?? spec.Trainer.CmaEs?.Population ?? 0;
        // population 0: CMA-ES picks λ from the dimension (≥ 4 + 3 ln n ≥ SliceCount for the models here); count the full split
        return (population > 0 ? Math.Min(population, EvolutionTrainer.SliceCount) : EvolutionTrainer.SliceCount) + 1;
    }

    private static ExecutionCosts Costs(ExperimentSpec spec, ExperimentComponents components, int settings, int shift, bool adjoint)
    {
        int shots = spec.Model.Simulation is { Shots: > 0 } s ? s.Shots : 0;
        var t = spec.Trainer;
        if (t.Dqn is { } d)
        {
            long b = d.BatchSize;
            long forwardRows = b + (d.DoubleDqn ? b : 0) + b;
            long gradientRows = b;
            return new ExecutionCosts
            {
                ShotsPerExecution = shots,
                ActingForwardRowsPerStep = 1,
                ActingExecutionsPerStep = settings,
                UpdateEvery = d.UpdateEvery,
                ForwardRowsPerUpdate = forwardRows,
                GradientRowsPerUpdate = gradientRows,
                // Adjoint: one backward sweep per row, counted as one execution per setting; parameter shift: every shifted evaluation.
                ExecutionsPerUpdate = forwardRows * settings + gradientRows * (adjoint ? 1 : shift) * settings,
                HardwareExecutionsPerUpdate = forwardRows * settings + gradientRows * shift * settings,
            };
        }
        (int population, int episodes, int evalEpisodes) = t.Kind switch
        {
            TrainerKind.Genetic => (t.Genetic!.Population, t.Genetic.EpisodesPerMember, t.Genetic.EvalEpisodes),
            TrainerKind.EvolutionStrategies => (t.EvolutionStrategies!.Population, t.EvolutionStrategies.EpisodesPerMember, t.EvolutionStrategies.EvalEpisodes),
            _ => (t.CmaEs!.Population, t.CmaEs.EpisodesPerMember, t.CmaEs.EvalEpisodes),
        };
        int? maxSteps = MaxEpisodeSteps(components.EnvironmentSettings.Values);
        long? rows = maxSteps is int m ? (long)population * Math.Max(1, episodes) * m : null;
        long? evalRows = maxSteps is int m2 ? (long)evalEpisodes * m2 : null;
        return new ExecutionCosts
        {
            ShotsPerExecution = shots,
            ActingForwardRowsPerStep = 1,
            ActingExecutionsPerStep = settings,
            Population = population,
            EpisodesPerMember = episodes,
            MaxStepsPerEpisode = maxSteps,
            ForwardRowsPerGeneration = rows,
            ExecutionsPerGeneration = rows * settings,
            EvaluationRowsPerGeneration = evalRows,
            HardwareExecutionsPerGeneration = rows * settings,
        };
    }

    private static int? MaxEpisodeSteps(IReadOnlyDictionary<string, string> values)
    {
        foreach (var key in new[] { "max_steps", "slices" })
            if (values.TryGetValue(key, out var v) && int.TryParse(v, NumberStyles.Integer, CultureInfo.InvariantCulture, out int n) && n > 0)
                return n;
        return null;
    }

    /// <summary>Human-readable report.</summary>
    public string ToText()
    {
        var inv = CultureInfo.InvariantCulture;
        var sb = new StringBuilder();
        void Line(string label, object? value) => sb.Append(label).Append(": ").Append(Convert.ToString(value, inv)).Append('\n');
        Line("experiment", $"{Name} (config hash {ConfigHash})");
        Line("trainer", Trainer);
        Line("environment", $"{Environment}: {ObservationSize} observation values, {Actions} actions");
        Line("model", Model);
        sb.Append("parameters: ").Append(ParameterCount.ToString(inv)).Append('\n');
        foreach (var (k, v) in ParameterCounts) sb.Append("  ").Append(k).Append(": ").Append(v.ToString(inv)).Append('\n');

        if (Circuit is { } c)
        {
            sb.Append("circuit: ").Append(c.Qubits).Append(" qubits, ").Append(c.Gates).Append(" gates, depth ").Append(c.Depth)
              .Append(", ").Append(c.TwoQubitGates).Append(" two-qubit gates, ").Append(c.CircuitParameters).Append(" circuit parameters, ")
              .Append(c.Inputs).Append(" inputs\n");
            sb.Append("  gates by kind: ").Append(string.Join(", ", c.GatesByKind.Select(kv => $"{kv.Key} {kv.Value}"))).Append('\n');
            sb.Append("  read-out: ").Append(c.Observables).Append(" observables in ").Append(c.MeasurementSettings)
              .Append(" measurement setting(s); parameter-shift gradient: ").Append(c.ShiftEvaluationsPerRow).Append(" shifted evaluations per row\n");
            sb.Append('\n').Append(c.Drawing).Append('\n');
        }
        else sb.Append("circuit: none (classical model)\n");

        if (Executions is { } e)
        {
            string shots = e.ShotsPerExecution > 0 ? $"{e.ShotsPerExecution} shots each" : "exact expectations";
            sb.Append("circuit executions (").Append(shots).Append("):\n");
            sb.Append("  acting: ").Append(e.ActingForwardRowsPerStep).Append(" forward row per environment step = ")
              .Append(e.ActingExecutionsPerStep).Append(" execution(s)").Append(Trainer == "dqn" ? " (greedy steps only)\n" : "\n");
            if (e.ForwardRowsPerUpdate is long fr)
            {
                sb.Append("  per update (every ").Append(e.UpdateEvery).Append(" step(s)): ").Append(fr).Append(" forward rows + ")
                  .Append(e.GradientRowsPerUpdate).Append(" gradient rows = ").Append(e.ExecutionsPerUpdate).Append(" simulated executions\n");
                sb.Append("  hardware-equivalent per update (parameter shift): ").Append(e.HardwareExecutionsPerUpdate).Append(" executions\n");
            }
            if (e.Population is int pop)
            {
                string steps = e.MaxStepsPerEpisode is int m ? m.ToString(inv) : "steps";
                sb.Append("  per generation: population ").Append(pop).Append(" × ").Append(e.EpisodesPerMember).Append(" episode(s) × ≤ ")
                  .Append(steps).Append(" steps");
                if (e.ForwardRowsPerGeneration is long rows) sb.Append(" = at most ").Append(rows).Append(" forward rows = ").Append(e.ExecutionsPerGeneration).Append(" executions");
                sb.Append('\n');
                if (e.EvaluationRowsPerGeneration is long er) sb.Append("  evaluation of the centre after each generation: at most ").Append(er).Append(" forward rows\n");
                sb.Append("  hardware-equivalent per generation: the same (no gradients)\n");
            }
        }

        var mem = Memory;
        sb.Append("memory:\n");
        if (mem.ReplayBytes is long rb)
            sb.Append("  replay: ").Append(mem.ReplayBytesPerTransition).Append(" bytes per transition × ").Append(mem.ReplayCapacity)
              .Append(" = ").Append(Bytes(rb)).Append('\n');
        sb.Append("  simulator states (upper estimate): ").Append(Bytes(mem.SimulatorBytes)).Append('\n');
        sb.Append("  parameters: ").Append(Bytes(mem.ParameterBytes)).Append('\n');
        sb.Append("  total ").Append(Bytes(mem.TotalBytes)).Append(" of ").Append(Bytes(mem.AvailableBytes)).Append(" available: ")
          .Append(mem.Fits ? "fits" : "DOES NOT FIT").Append('\n');
        if (Circuit?.Qasm is { } q) sb.Append('\n').Append(q);
        return sb.ToString();
    }

    private static string Bytes(long b)
    {
        var inv = CultureInfo.InvariantCulture;
        if (b < 1024) return $"{b} B";
        if (b < 1024L * 1024) return (b / 1024.0).ToString("0.0", inv) + " KiB";
        if (b < 1024L * 1024 * 1024) return (b / (1024.0 * 1024)).ToString("0.0", inv) + " MiB";
        return (b / (1024.0 * 1024 * 1024)).ToString("0.00", inv) + " GiB";
    }
}
