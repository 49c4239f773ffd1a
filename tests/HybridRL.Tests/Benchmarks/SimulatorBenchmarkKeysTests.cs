using HybridRL.Benchmarks;

namespace HybridRL.Tests.Benchmarks;

/// <summary>The quick simulator bench produces every figure the engine issue lists; values are checked for being finite, never for speed.</summary>
public sealed class SimulatorBenchmarkKeysTests
{
    [Fact]
    public void Quick_run_reports_every_required_figure()
    {
        var r = SimulatorBenchmark.Run(quick: true);
        foreach (var key in new[] { "bandwidth_ratio_22q", "speedup_vs_tensor_ops_b1", "speedup_vs_tensor_ops_b256", "adjoint_over_forward", "gates_per_second_6q_b256" })
        {
            Assert.True(r.ContainsKey(key), $"missing {key}");
            Assert.True(double.IsFinite(r[key]) && r[key] > 0, $"{key} = {r[key]}");
        }
    }
}
