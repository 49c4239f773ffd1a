using HybridRL.Models;

namespace HybridRL.Tests.Models;

public class ModelBenchmarkTests
{
    // Checks that every figure is produced and finite, never how fast (timings belong to hybridrl bench, not to tests).
    [Fact]
    public void QuickRunReportsAllKeys()
    {
        var r = ModelBenchmark.Run(quick: true);
        foreach (var kv in r) Console.WriteLine($"{kv.Key} = {kv.Value}");
        foreach (var key in new[] { "mps_forward_backward_ms", "population_forward_us_per_member", "population_engine_us_per_member",
                     "quantum_layer_overhead_ratio", "quantum_layer_ms", "engine_forward_backward_ms" })
            Assert.True(double.IsFinite(r[key]) && r[key] > 0, key);
    }
}
