using System.Diagnostics;
using HybridRL.Environments;
using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Randomness;
using HybridRL.Training.DeepQ;
using HybridRL.Training.Evolution;

namespace HybridRL.Training;

/// <summary>
/// Trainer throughput on this machine (for <c>hybridrl bench training</c>). All figures come from one run, and the
/// parallel efficiency is a ratio of two timings taken back to back, because shared machines are noisy
/// (DESIGN.md, Performance). Workloads: deep Q on cart-pole with a 6-qubit, 4-layer re-uploading circuit and
/// batch 32; evolution (CMA-ES, population 64, one episode per member) with the same model.
/// </summary>
public static class TrainingBenchmark
{
    public const int Qubits = 6, Layers = 4, BatchSize = 32, Population = 64;

    /// <summary>
    /// Keys: dqn_updates_per_second, env_steps_per_second_acting, evolution_member_episodes_per_second,
    /// parallel_efficiency_2_cores (time with 1 worker / (2 × time with 2 workers); 1 is perfect scaling).
    /// <paramref name="quick"/> shrinks every workload to a smoke-test size.
    /// </summary>
    public static IReadOnlyDictionary<string, double> Run(bool quick)
    {
        TorchRuntime.EnsureLoaded();
        var result = new Dictionary<string, double>(StringComparer.Ordinal);
        var envSettings = EnvironmentFactory.Parse("cart-pole", new Dictionary<string, string>());
        var model = ModelFor(threads: 1);

        // Deep Q updates: warm-up equals the batch, so (after it) every unit is one env step plus one update.
        int updates = quick ? 20 : 300;
        var dqn = new DeepQSettings
        {
            ReplayCapacity = 10_000,
            WarmupSteps = BatchSize,
            BatchSize = BatchSize,
            UpdateEvery = 1,
            EvalEvery = 0,
            Exploration = new ExplorationSchedule(0.2, 0.2, 0, DecayShape.Linear),
        };
        using (var env = envSettings.CreateEnvironment())
        using (var evalEnv = envSettings.CreateEnvironment())
        using (var trainer = new DeepQTrainer(dqn, env, evalEnv, () => ModelFactory.Create(model, env.ObservationSize, env.ActionCount, 1), 1))
        {
            var budget = new TrainingBudget(EnvSteps: BatchSize + updates + 1);
            while (trainer.Counters.Updates == 0) trainer.RunUnit(budget);
            long before = trainer.Counters.Updates;
            var sw = Stopwatch.StartNew();
            while (trainer.Counters.Updates < before + updates) trainer.RunUnit(budget);
            result["dqn_updates_per_second"] = (trainer.Counters.Updates - before) / sw.Elapsed.TotalSeconds;
        }

        // Acting: greedy forward of one observation, argmax, environment step.
        using (var env = envSettings.CreateEnvironment())
        using (var agent = ModelFactory.Create(model, env.ObservationSize, env.ActionCount, 2))
        {
            var obs = new double[env.ObservationSize];
            var q = new double[env.ActionCount];
            int steps = quick ? 200 : 5_000;
            var seeds = RandomStream.FromRoot(3, "benchmark-episodes");
            env.Reset(seeds.NextUInt64(), obs);
            var sw = Stopwatch.StartNew();
            for (int i = 0; i < steps; i++)
            {
                agent.ForwardNoGrad(obs, 1, q);
                var r = env.Step(BellmanTargets.ArgMax(q), obs);
                if (r.Terminal || r.Truncated) env.Reset(seeds.NextUInt64(), obs);
            }
            result["env_steps_per_second_acting"] = steps / sw.Elapsed.TotalSeconds;
        }

        // Evolution: the same generations (same seed, so the same work) with 1 and with 2 workers.
        int generations = quick ? 1 : 20;
        double t1 = TimeEvolution(envSettings, 1, generations, out long episodes1);
        double t2 = TimeEvolution(envSettings, 2, generations, out long episodes2);
        if (episodes1 != episodes2) throw new InvalidOperationException($"evolution did different work with 1 and 2 workers ({episodes1} vs {episodes2} episodes)");
        result["evolution_member_episodes_per_second"] = episodes2 / t2;
        result["evolution_member_episodes_per_second_1_worker"] = episodes1 / t1;
        result["parallel_efficiency_2_cores"] = t1 / (2 * t2);
        return result;
    }

    private static ModelSettings ModelFor(int threads) => new()
    {
        Kind = ModelKind.Hybrid,
        Circuit = new CircuitSettings { Qubits = Qubits, Layers = Layers, Encoding = EncodingKind.AngleX, Reupload = true, Readout = ReadoutKind.Linear },
        Simulation = new SimulationSettings { Threads = threads },
    };

    private static double TimeEvolution(HybridRL.Environments.EnvironmentSettings envSettings, int workers, int generations, out long episodes)
    {
        int obsSize, actions;
        using (var probe = envSettings.CreateEnvironment())
        {
            obsSize = probe.ObservationSize;
            actions = probe.ActionCount;
        }
        var model = ModelFor(threads: 1);
        double[] initial;
        using (var m = ModelFactory.Create(model, obsSize, actions, 5))
        {
            initial = new double[m.ParameterCount];
            m.GetFlat(initial);
        }
        var envs = new List<IEnvironment>();
        var strategy = EvolutionStrategyFactory.Create(new CmaEsSettings(Population, 0.5), initial, 6);
        using var trainer = new EvolutionTrainer("cma_es", strategy, new EvolutionTrainerSettings(1, 0, workers, 0),
            () => { var e = envSettings.CreateEnvironment(); envs.Add(e); return e; },
            () => ModelFactory.Create(model, obsSize, actions, 5), 7);
        var budget = new TrainingBudget(Generations: generations + 1);
        trainer.RunUnit(budget); // warm-up generation (JIT, buffers)
        long before = trainer.Counters.Episodes;
        var sw = Stopwatch.StartNew();
        for (int g = 0; g < generations; g++) trainer.RunUnit(budget);
        double seconds = sw.Elapsed.TotalSeconds;
        episodes = trainer.Counters.Episodes - before;
        foreach (var e in envs) e.Dispose();
        return seconds;
    }
}
