using HybridRL.Environments;
using HybridRL.Experiments;
using HybridRL.Experiments.Config;
using HybridRL.Native;
using HybridRL.Training;

namespace HybridRL.Tests.Training.Grid;

/// <summary>
/// Trains a spec in memory through <see cref="ExperimentComponents"/> and <see cref="TrainingLoop"/> (the same path a
/// run folder uses, without files) and scores the result exactly: the greedy policy read off the trained model,
/// evaluated by <see cref="PolicyEvaluation"/> on the environment's <see cref="TabularModel"/>, against
/// <see cref="ValueIteration"/> (Sutton &amp; Barto 2018, ch. 4.1 and 4.4).
/// </summary>
internal static class GridTraining
{
    /// <summary>Loads YAML text plus --set overrides into a validated spec.</summary>
    public static ExperimentSpec Spec(string yaml, params string[] sets)
    {
        string path = Path.Combine(Path.GetTempPath(), "hybridrl-grid-" + Guid.NewGuid().ToString("N")[..12] + ".yaml");
        File.WriteAllText(path, yaml);
        try
        {
            return ExperimentSpecLoader.Load([path], sets, new Dictionary<string, string>());
        }
        finally
        {
            File.Delete(path);
        }
    }

    public static TrainedGrid Train(ExperimentSpec spec, double gamma)
    {
        TorchRuntime.EnsureLoaded();
        using var c = ExperimentComponents.Build(spec);
        var sink = new RecordingSink();
        var loop = new TrainingLoop(c.Trainer, c.Budget, new TrainingSchedule(spec.Logging.MetricsEverySteps, long.MaxValue / 4), sink);
        loop.Run(CancellationToken.None);
        var env = (SlipperyWarehouseEnvironment)c.CreateEnvironment();
        // Scored on the task as the map defines it (episodes start on the map's start cell), also when training used
        // exploring starts (environment start: random): same map, moves and rewards, only the start distribution differs.
        var parameters = new Dictionary<string, string>(spec.Environment.Parameters) { ["start"] = "map" };
        var tabular = SlipperyWarehouseSettings.Parse(parameters).ToTabularModel();
        using var model = c.CreateModel();
        model.SetFlat(c.Trainer.AgentParameters());
        int[] policy = GreedyPolicyTable.Extract(model, env);
        double exact = PolicyEvaluation.Evaluate(tabular, policy, gamma);
        double optimal = ValueIteration.Solve(tabular, gamma).OptimalStartReturn;
        return new TrainedGrid(exact, optimal, policy, sink.Rows);
    }

    /// <summary>Rows with the wall-clock column blanked (the only column allowed to differ between identical runs).</summary>
    public static IReadOnlyList<MetricsRow> WithoutWallClock(IReadOnlyList<MetricsRow> rows) => rows.Select(r => r with { WallSeconds = null }).ToList();

    private sealed class RecordingSink : ITrainingSink
    {
        public List<MetricsRow> Rows { get; } = [];
        public void OnMetrics(MetricsRow row, long rowIndex) => Rows.Add(row);
        public void OnCheckpoint(ITrainer trainer, Action<BinaryWriter> loop, double? score) { }
        public void OnProgress(ITrainer trainer, double progress) { }
    }
}

/// <summary>Exact expected return of a trained agent's greedy policy, the optimum, the policy table and the metrics rows.</summary>
internal sealed record TrainedGrid(double ExactReturn, double OptimalReturn, int[] Policy, IReadOnlyList<MetricsRow> Rows)
{
    /// <summary>Within <paramref name="fraction"/> of the optimum (the optimum is positive on these maps).</summary>
    public bool WithinOf(double fraction) => ExactReturn >= OptimalReturn - fraction * Math.Abs(OptimalReturn);

    public override string ToString() => $"exact {ExactReturn:F4} / optimal {OptimalReturn:F4}, policy {string.Join("", Policy)}";
}
