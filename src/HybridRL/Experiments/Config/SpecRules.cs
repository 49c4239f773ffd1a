using System.Text.RegularExpressions;

namespace HybridRL.Experiments.Config;

/// <summary>Checks between keys (incompatible combinations); each message says how to fix it.
/// A rule is skipped when one of its keys already failed to parse, so one typo gives one error.</summary>
internal static partial class SpecRules
{
    [GeneratedRegex("^[A-Za-z0-9][A-Za-z0-9._-]*$")]
    private static partial Regex NamePattern();

    public static void Check(ResolvedValues v)
    {
        CheckExperiment(v);
        if (v.ChoiceText("model.kind") == "hybrid") CheckHybrid(v);
        CheckTrainer(v);
        CheckHardware(v);
    }

    private static void CheckExperiment(ResolvedValues v)
    {
        var name = v.Text("experiment.name");
        if (name.Length > 0 && !NamePattern().IsMatch(name))
            v.Error("experiment.name", $"experiment.name '{name}' is used as a folder name: use letters, digits, '.', '_' or '-' (starting with a letter or digit)");

        string[] budget = ["experiment.budget.env_steps", "experiment.budget.episodes", "experiment.budget.generations",
            "experiment.budget.circuit_executions", "experiment.budget.wall_seconds"];
        if (!v.Failed(budget) && budget.All(k => Convert.ToDouble(v.Raw(k), System.Globalization.CultureInfo.InvariantCulture) == 0))
            v.Error("experiment.budget", "no budget set: give at least one of experiment.budget.env_steps, episodes, generations, circuit_executions or wall_seconds (the run stops at whichever limit is reached first)");

        if (v.Int("experiment.budget.generations") > 0 && v.ChoiceText("trainer.kind") == "dqn")
            v.Error("experiment.budget.generations", "trainer.kind dqn has no generations; limit it with experiment.budget.env_steps or episodes instead");
        if (v.Int("experiment.budget.circuit_executions") > 0 && v.ChoiceText("model.kind") == "classical")
            v.Error("experiment.budget.circuit_executions", "a classical model runs no circuits, so a circuit_executions budget never ends the run; use env_steps or episodes");
    }

    private static void CheckHybrid(ResolvedValues v)
    {
        var mode = v.ChoiceText("model.simulation.mode");
        var shots = v.Int("model.simulation.shots");
        string[] gateNoise = ["model.simulation.noise.depolarizing", "model.simulation.noise.two_qubit_depolarizing", "model.simulation.noise.amplitude_damping",
            "model.simulation.noise.phase_damping", "model.simulation.noise.bit_flip", "model.simulation.noise.phase_flip"];
        var noisyKey = gateNoise.FirstOrDefault(k => v.Num(k) > 0);
        var readout = v.Num("model.simulation.noise.readout_error");
        var qubits = v.Int("model.circuit.qubits");

        if (!v.Failed("model.simulation.mode", "model.simulation.shots"))
        {
            if (mode == "exact" && shots > 0)
                v.Error("model.simulation.shots", "mode exact computes expectation values exactly; set model.simulation.mode: shots to sample shots, or remove model.simulation.shots", "model.simulation.mode");
            if (mode == "shots" && shots == 0)
                v.Error("model.simulation.shots", "mode shots needs model.simulation.shots > 0 (e.g. 1000)", "model.simulation.mode");
        }
        if (noisyKey is not null && mode is "exact" or "shots")
            v.Error(noisyKey, $"noise channels need model.simulation.mode density_matrix or trajectories (mode {mode} simulates a pure state and cannot represent noise)", "model.simulation.mode");
        if (readout > 0 && mode == "exact")
            v.Error("model.simulation.noise.readout_error", "readout_error flips measured bits, but mode exact takes no measurements; use mode shots, density_matrix or trajectories", "model.simulation.mode");
        if (v.ChoiceText("model.simulation.noise.schedule") != "constant" && noisyKey is null && readout == 0 && !v.Failed(gateNoise))
            v.Error("model.simulation.noise.schedule", "a noise schedule scales noise, but every noise probability is 0; set a model.simulation.noise probability or use schedule: constant");
        if (mode == "density_matrix" && qubits > 12)
            v.Error("model.circuit.qubits", $"density-matrix simulation of {qubits} qubits holds 4^{qubits} amplitudes ({Math.Pow(4, qubits) * 16 / (1 << 30):0.#} GiB); use at most 12 qubits or model.simulation.mode: trajectories", "model.simulation.mode");

        if (v.Applies("model.simulation.gradient") && v.ChoiceText("model.simulation.gradient") == "adjoint")
        {
            if (mode is "shots" || shots > 0)
                v.Error("model.simulation.gradient", "the adjoint gradient needs exact state-vector expectations; with shots use model.simulation.gradient: parameter_shift", "model.simulation.mode");
            else if (noisyKey is not null || readout > 0 || mode is "density_matrix" or "trajectories")
                v.Error("model.simulation.gradient", "the adjoint gradient needs a noise-free pure-state simulation; with noise (density_matrix or trajectories) use model.simulation.gradient: parameter_shift", "model.simulation.mode");
        }

        var encoding = v.ChoiceText("model.circuit.encoding");
        var compressor = v.ChoiceText("model.compressor.kind");
        if (encoding == "basis" && compressor != "none")
            v.Error("model.compressor.kind", "basis encoding reads the environment's discrete state index directly; set model.compressor.kind: none", "model.circuit.encoding");
        if (compressor != "none" && encoding != "basis" && !v.Failed("model.circuit.qubits", "model.compressor.output_size"))
        {
            var outputSize = v.Int("model.compressor.output_size");
            if (encoding == "amplitude")
            {
                var capacity = 1L << (int)qubits;
                if (outputSize > capacity)
                {
                    var needed = (int)Math.Ceiling(Math.Log2(outputSize));
                    v.Error("model.compressor.output_size", $"amplitude encoding on {qubits} qubits holds 2^{qubits} = {capacity} features but model.compressor.output_size is {outputSize}; raise model.circuit.qubits to at least {needed} or lower output_size", "model.circuit.qubits");
                }
            }
            else if (outputSize > qubits)
            {
                v.Error("model.compressor.output_size", $"{encoding} encoding takes one feature per qubit ({qubits}) but model.compressor.output_size is {outputSize}; lower output_size to at most {qubits} (or 0 = match) or raise model.circuit.qubits", "model.circuit.qubits");
            }
        }
    }

    private static void CheckTrainer(ResolvedValues v)
    {
        switch (v.ChoiceText("trainer.kind"))
        {
            case "dqn":
            {
                var batch = v.Int("trainer.dqn.batch_size");
                var capacity = v.Int("trainer.dqn.replay_capacity");
                var warmup = v.Int("trainer.dqn.warmup_steps");
                if (!v.Failed("trainer.dqn.batch_size", "trainer.dqn.replay_capacity") && batch > capacity)
                    v.Error("trainer.dqn.batch_size", $"trainer.dqn.batch_size ({batch}) exceeds trainer.dqn.replay_capacity ({capacity}); lower batch_size or raise replay_capacity", "trainer.dqn.replay_capacity");
                else if (!v.Failed("trainer.dqn.batch_size", "trainer.dqn.warmup_steps") && warmup < batch)
                    v.Error("trainer.dqn.warmup_steps", $"trainer.dqn.warmup_steps ({warmup}) is below batch_size ({batch}): the first update would sample more transitions than are stored; set warmup_steps to at least {batch}", "trainer.dqn.batch_size");
                if (!v.Failed("trainer.dqn.epsilon_start", "trainer.dqn.epsilon_end") && v.Num("trainer.dqn.epsilon_end") > v.Num("trainer.dqn.epsilon_start"))
                    v.Error("trainer.dqn.epsilon_end", $"trainer.dqn.epsilon_end ({v.Num("trainer.dqn.epsilon_end")}) must not exceed epsilon_start ({v.Num("trainer.dqn.epsilon_start")}): exploration decays", "trainer.dqn.epsilon_start");
                break;
            }
            case "genetic":
            {
                var population = v.Int("trainer.genetic.population");
                if (!v.Failed("trainer.genetic.population", "trainer.genetic.elites") && v.Int("trainer.genetic.elites") >= population)
                    v.Error("trainer.genetic.elites", $"trainer.genetic.elites ({v.Int("trainer.genetic.elites")}) must be below population ({population}), or no new members are ever tried", "trainer.genetic.population");
                if (!v.Failed("trainer.genetic.population", "trainer.genetic.truncation") && Math.Floor(population * v.Num("trainer.genetic.truncation")) < 1)
                    v.Error("trainer.genetic.truncation", $"truncation {v.Num("trainer.genetic.truncation")} of population {population} selects no parents; raise truncation to at least {1.0 / population:0.###}", "trainer.genetic.population");
                break;
            }
            case "evolution_strategies":
            {
                var population = v.Int("trainer.evolution_strategies.population");
                if (!v.Failed("trainer.evolution_strategies.population") && population % 2 != 0)
                    v.Error("trainer.evolution_strategies.population", $"trainer.evolution_strategies.population ({population}) must be even: members come in antithetic pairs (+ε, −ε); use {population + 1}");
                break;
            }
            case "cma_es":
                if (!v.Failed("trainer.cma_es.population") && v.Int("trainer.cma_es.population") == 1)
                    v.Error("trainer.cma_es.population", "trainer.cma_es.population must be 0 (default 4 + floor(3 ln n)) or at least 2");
                break;
        }
    }

    private static void CheckHardware(ResolvedValues v)
    {
        var present = ConfigKeyTable.All.Any(k => k.Path.StartsWith("hardware.", StringComparison.Ordinal) && v.IsExplicit(k.Path));
        if (present && v.NumOrNull("hardware.seconds_per_shot") is null && !v.Failed("hardware.seconds_per_shot"))
            v.Error("hardware.seconds_per_shot", "hardware.seconds_per_shot is required when a hardware profile or hardware keys are given",
                ConfigKeyTable.All.First(k => k.Path.StartsWith("hardware.", StringComparison.Ordinal) && v.IsExplicit(k.Path)).Path);
    }
}
