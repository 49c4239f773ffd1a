using HybridRL.Models;

namespace HybridRL.Tests.Models;

public class ModelBenchmarkTests
{
    [Fact(Skip = "benchmark (~10 s, timing only): run by hand with dotnet test -c Release --filter ModelBenchmarkTests after removing Skip")]
    public void QuickRunReportsAllKeys()
    {
        var r = ModelBenchmark.Run(quick: true);
        foreach (var kv in r) Console.WriteLine($"{kv.Key} = {kv.Value}");
        foreach (var key in new[] { "mps_forward_backward_ms", "population_forward_us_per_member", "quantum_layer_overhead_ratio" })
            Assert.True(double.IsFinite(r[key]) && r[key] > 0, key);
    }
}
