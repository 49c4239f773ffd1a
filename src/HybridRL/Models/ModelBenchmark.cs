using System.Diagnostics;
using HybridRL.Native;
using HybridRL.Quantum.Randomness;
using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Models;

/// <summary>
/// Speed figures of the models (for <c>hybridrl bench model</c>). Each time is the fastest of several
/// repeats after a JIT warm-up (the repeat least disturbed by other load on a shared machine; common
/// practice); a ratio is the median of per-pair ratios of its two sides timed alternately in one run.
/// </summary>
public static class ModelBenchmark
{
    /// <summary>
    /// Keys: mps_forward_backward_ms (100 inputs, χ = 16, d = 6, batch 32),
    /// population_forward_us_per_member (K = 64, 6 qubits, 4 layers, MPS 100→6),
    /// quantum_layer_overhead_ratio (layer forward+backward through TorchSharp ÷ engine forward+backward, batch 32; median of
    /// interleaved pair ratios),
    /// plus the raw times and parameter counts behind them.
    /// </summary>
    public static Dictionary<string, double> Run(bool quick)
    {
        TorchRuntime.EnsureLoaded();
        int repeats = quick ? 9 : 31;
        var result = new Dictionary<string, double>();
        var rng = new RandomStream(2024);

        // 1. MPS forward + backward.
        using (var scope = torch.NewDisposeScope())
        {
            var mps = new MpsCompressor(100, 16, 6, SiteFeatureMap.Trigonometric, new RandomStream(1));
            var x = torch.tensor(Draw(rng, 32 * 100), [32, 100], dtype: ScalarType.Float64);
            double ms = Fastest(repeats, () =>
            {
                using var inner = torch.NewDisposeScope();
                mps.zero_grad();
                var y = mps.Forward(x);
                y.sum().backward();
            });
            result["mps_forward_backward_ms"] = ms;
            result["mps_parameter_count"] = mps.ParameterCount;
            mps.Dispose();
        }

        // 2. Population forward of a hybrid model.
        var settings = new ModelSettings
        {
            Compressor = new CompressorSettings { Kind = CompressorKind.Mps, BondDimension = 16, OutputSize = 6 },
            Circuit = new CircuitSettings { Qubits = 6, Layers = 4, Readout = ReadoutKind.PerAction },
        };
        using (var model = (HybridModel)ModelFactory.Create(settings, 100, 2, 7))
        {
            const int k = 64;
            int p = model.ParameterCount;
            var flat = new double[p];
            model.GetFlat(flat);
            var members = new double[k * p];
            for (int m = 0; m < k; m++)
                for (int i = 0; i < p; i++) members[m * p + i] = flat[i] + 0.05 * rng.NextGaussian();
            var obs = Draw(rng, k * 100);
            var outputs = new double[k * 2];
            double ms = Fastest(repeats, () => model.PopulationForward(members, obs, k, outputs));
            result["population_forward_us_per_member"] = ms * 1000.0 / k;
            // Each member reads its own ~54k parameters (≈0.4 MB), so this path is bound by memory bandwidth.
            // Breakdown: the engine's share (same K rows, per-row parameters) and the managed compressor's.
            var ev0 = model.QuantumLayer.Evaluator;
            var feats = Draw(rng, k * ev0.InputCount);
            var thetaRows = new double[k * ev0.ParameterCount];
            for (int m = 0; m < k; m++) flat.AsSpan(model.ParameterCounts["compressor"], ev0.ParameterCount).CopyTo(thetaRows.AsSpan(m * ev0.ParameterCount));
            var expect = new double[k * ev0.OutputCount];
            double engineOnly = Fastest(repeats, () => ev0.Forward(feats, thetaRows, k, true, expect));
            result["population_engine_us_per_member"] = engineOnly * 1000.0 / k;
            result["population_model_parameter_count"] = p;

            // 3. Quantum layer overhead against the engine alone (batch 32, same circuit).
            var layer = model.QuantumLayer;
            var ev = layer.Evaluator;
            const int batch = 32;
            var inputs = Draw(rng, batch * ev.InputCount);
            var theta = TensorMemory.AsSpan(layer.Weights)[..ev.ParameterCount].ToArray();
            var engineOut = new double[batch * ev.OutputCount];
            var gOut = Enumerable.Repeat(1.0, batch * ev.OutputCount).ToArray();
            var gTheta = new double[ev.ParameterCount];
            var gIn = new double[batch * ev.InputCount];
            using var xt = torch.tensor(inputs, [batch, ev.InputCount], dtype: ScalarType.Float64).requires_grad_(true);
            void Engine()
            {
                ev.Forward(inputs, theta, batch, false, engineOut);
                ev.Backward(inputs, theta, batch, false, gOut, gTheta, gIn);
            }
            void Layer()
            {
                using var inner = torch.NewDisposeScope();
                layer.zero_grad();
                xt.grad?.zero_();
                var y = layer.Forward(xt);
                y.sum().backward();
            }
            // Interleaved so that load changes on a shared machine hit both sides alike.
            var (engineMs, layerMs, ratio) = TimedPairs(repeats * 4, Engine, Layer);
            result["quantum_layer_ms"] = layerMs;
            result["engine_forward_backward_ms"] = engineMs;
            result["quantum_layer_overhead_ratio"] = ratio;
        }
        return result;
    }

    private static double[] Draw(RandomStream rng, int n)
    {
        var v = new double[n];
        for (int i = 0; i < n; i++) v[i] = 2.0 * rng.NextDouble() - 1.0;
        return v;
    }

    /// <summary>
    /// Runs the code for a while so the JIT's tiered compilation reaches optimised code (tier 1 is compiled in
    /// the background after ~30 calls), then pauses briefly for that compilation to land.
    /// </summary>
    private static void WarmUp(Action action)
    {
        var sw = Stopwatch.StartNew();
        int calls = 0;
        while (calls < 60 && (calls < 3 || sw.Elapsed.TotalSeconds < 0.4))
        {
            action();
            calls++;
        }
        Thread.Sleep(150);
        action();
    }

    /// <summary>
    /// Times <paramref name="a"/> and <paramref name="b"/> alternately: the fastest time of each and the median of the
    /// per-pair ratios b/a. A ratio taken within one pair sees the same load and thread-wake latency on both sides,
    /// so its median is steadier than the ratio of two separate minima.
    /// </summary>
    private static (double FastestA, double FastestB, double MedianRatio) TimedPairs(int repeats, Action a, Action b)
    {
        WarmUp(a);
        WarmUp(b);
        var ta = new double[repeats];
        var tb = new double[repeats];
        var ratio = new double[repeats];
        for (int r = 0; r < repeats; r++)
        {
            long t0 = Stopwatch.GetTimestamp();
            a();
            ta[r] = Stopwatch.GetElapsedTime(t0).TotalMilliseconds;
            t0 = Stopwatch.GetTimestamp();
            b();
            tb[r] = Stopwatch.GetElapsedTime(t0).TotalMilliseconds;
            ratio[r] = tb[r] / ta[r];
        }
        Array.Sort(ratio);
        double median = repeats % 2 == 1 ? ratio[repeats / 2] : 0.5 * (ratio[repeats / 2 - 1] + ratio[repeats / 2]);
        return (ta.Min(), tb.Min(), median);
    }

    private static double Fastest(int repeats, Action action)
    {
        WarmUp(action);
        var times = new double[repeats];
        for (int r = 0; r < repeats; r++)
        {
            long t0 = Stopwatch.GetTimestamp();
            action();
            times[r] = Stopwatch.GetElapsedTime(t0).TotalMilliseconds;
        }
        return times.Min();
    }
}
