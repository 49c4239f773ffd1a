using HybridRL.Checkpoints;
using HybridRL.Native;

namespace HybridRL.Benchmarks;

/// <summary>
/// The groups `hybridrl bench` runs. Each returns named figures, mostly ratios taken in one run
/// (these machines are noisy, so absolute times are for the record only). Quick mode shortens
/// every measurement for smoke tests.
/// </summary>
public static class BenchmarkSuite
{
    public static IReadOnlyList<string> Groups { get; } = ["simulator", "model", "training"];

    public static IReadOnlyDictionary<string, double> Run(string group, bool quick)
    {
        TorchRuntime.EnsureLoaded();
        return group switch
        {
            "simulator" => new SortedDictionary<string, double>(SimulatorBenchmark.Run(quick).ToDictionary(), StringComparer.Ordinal),
            "model" => new SortedDictionary<string, double>(Models.ModelBenchmark.Run(quick), StringComparer.Ordinal),
            "training" => Training(quick),
            _ => throw new ArgumentException($"unknown benchmark group '{group}'; one of: {string.Join(", ", Groups)}", nameof(group)),
        };
    }

    private static IReadOnlyDictionary<string, double> Training(bool quick)
    {
        var result = new SortedDictionary<string, double>(HybridRL.Training.TrainingBenchmark.Run(quick).ToDictionary(), StringComparer.Ordinal);
        foreach (var (k, v) in CheckpointBenchmark.Run(quick ? 1 : 5).ToMetrics()) result[k] = v;
        return result;
    }
}
