using HybridRL.Environments;
using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Circuits;
using HybridRL.Training;
using HybridRL.Training.Evolution;
using static TorchSharp.torch;
using Parameter = TorchSharp.Modules.Parameter;

namespace HybridRL.Tests.Training.Evolution;

/// <summary>
/// On a tabular task with exact simulation the evolution trainer computes each member's greedy action once per state and
/// generation. The search must be unchanged: same fitness, same parameters, same steps as evaluating every step; only
/// fewer circuit executions. The reference hides the model's determinism, which switches the cache off.
/// </summary>
public sealed class GreedyActionCacheTests
{
    private static ModelSettings Model => new()
    {
        Circuit = new CircuitSettings { Qubits = 4, Layers = 2, Encoding = EncodingKind.AngleX, Reupload = false, InputSquash = InputSquash.None, Readout = ReadoutKind.PerAction },
    };

    private static (IReadOnlyList<double[]> Fitness, double[] Center, TrainingCounters Counters) Train(bool hideDeterminism, int workers)
    {
        TorchRuntime.EnsureLoaded();
        var envSettings = EnvironmentFactory.Parse("slippery-warehouse", new Dictionary<string, string>
        {
            ["map"] = "dock-3x4", ["observation"] = "binary", ["max_steps"] = "40", ["start"] = "random",
        });
        int obs, actions;
        using (var probe = envSettings.CreateEnvironment()) { obs = probe.ObservationSize; actions = probe.ActionCount; }
        IAgentModel NewModel()
        {
            var m = ModelFactory.Create(Model, obs, actions, 11);
            return hideDeterminism ? new NondeterministicView(m) : m;
        }
        double[] x0;
        using (var m = NewModel()) { x0 = new double[m.ParameterCount]; m.GetFlat(x0); }
        var strategy = new GeneticSearch(new GeneticSearchSettings(Population: 10, Truncation: 3, Elites: 1, MutationSigma: 0.5), x0, 3);
        using var trainer = new EvolutionTrainer("genetic", strategy, new EvolutionTrainerSettings(EpisodesPerMember: 6, EvalEpisodes: 0, Workers: workers, EvalEvery: 0),
            envSettings.CreateEnvironment, NewModel, 5);
        var fitness = new List<double[]>();
        var budget = new TrainingBudget(Generations: 4);
        for (int g = 0; g < 4; g++)
        {
            trainer.RunUnit(budget);
            var row = trainer.Metrics(new MetricsRow());
            fitness.Add([row.FitnessMean!.Value, row.FitnessBest!.Value, row.FitnessStd!.Value, row.TrainReturn!.Value]);
        }
        return (fitness, trainer.AgentParameters(), trainer.Counters);
    }

    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    public void Cached_actions_leave_the_search_unchanged_and_run_fewer_circuits(int workers)
    {
        var every = Train(hideDeterminism: true, workers);
        var cached = Train(hideDeterminism: false, workers);
        Assert.Equal(every.Fitness, cached.Fitness);
        Assert.Equal(every.Center, cached.Center);
        Assert.Equal(every.Counters.EnvSteps, cached.Counters.EnvSteps);
        Assert.Equal(every.Counters.Episodes, cached.Counters.Episodes);
        // Without the cache one execution per member step; with it at most one per member, state and generation:
        // 4 generations × (10 members + the carried elite's re-evaluation, itself a member) × 11 states.
        Assert.Equal(every.Counters.EnvSteps, every.Counters.CircuitExecutions);
        Assert.InRange(cached.Counters.CircuitExecutions, 1, 4 * 10 * 11);
        Assert.True(cached.Counters.CircuitExecutions < every.Counters.CircuitExecutions / 2,
            $"{cached.Counters.CircuitExecutions} cached against {every.Counters.CircuitExecutions} executions");
    }

    /// <summary>The same model, reporting non-deterministic outputs (as shot sampling would).</summary>
    private sealed class NondeterministicView(IAgentModel inner) : IAgentModel
    {
        public int ObservationSize => inner.ObservationSize;
        public int OutputCount => inner.OutputCount;
        public int ParameterCount => inner.ParameterCount;
        public IReadOnlyDictionary<string, int> ParameterCounts => inner.ParameterCounts;
        public bool DeterministicOutputs => false;
        public ExecutionCounters? Counters => inner.Counters;
        public long HardwareExecutionsPerGradientRow => inner.HardwareExecutionsPerGradientRow;
        public Tensor Forward(Tensor observations) => inner.Forward(observations);
        public IEnumerable<Parameter> Parameters() => inner.Parameters();
        public void GetFlat(Span<double> destination) => inner.GetFlat(destination);
        public void SetFlat(ReadOnlySpan<double> source) => inner.SetFlat(source);
        public void ForwardNoGrad(ReadOnlySpan<double> observations, int batch, Span<double> output) => inner.ForwardNoGrad(observations, batch, output);
        public void PopulationForward(ReadOnlySpan<double> flatParametersPerMember, ReadOnlySpan<double> observationsPerMember, int members, Span<double> outputs) =>
            inner.PopulationForward(flatParametersPerMember, observationsPerMember, members, outputs);
        public void Dispose() => inner.Dispose();
    }
}
