using System.Diagnostics;
using HybridRL.Native;
using HybridRL.Quantum.Ansatz;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Encodings;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;
using TorchSharp;

namespace HybridRL.Benchmarks;

/// <summary>
/// Speed of the circuit engine as ratios measured in one run (absolute times on shared machines are noisy):
/// single-qubit gate memory throughput on a 22-qubit state against a copy of the same buffers; forward plus full
/// gradient of a 6-qubit, 4-layer re-uploading circuit (48 parameters) against the same circuit written with
/// TorchSharp complex tensor ops and autograd (<see cref="TensorOpsReferenceCircuit"/>), at batch 1 and 256;
/// the adjoint gradient's cost over a forward pass; gate applications per second. Everything runs on one
/// thread (TorchSharp intra-op threads set to 1 for the duration), and paired timings are interleaved.
/// </summary>
public static class SimulatorBenchmark
{
    public const int Qubits = 6, Layers = 4;

    /// <summary>The benchmark circuit: re-uploading angle encoding (RY) before each of 4 layers of RY·RZ plus a CNOT chain.</summary>
    public static Circuit BenchmarkCircuit() => CircuitTemplate.Build(new LayeredCircuitSpec
    {
        Qubits = Qubits, Layers = Layers, Encoding = EncodingKind.ReUploading,
        RotationAxes = [RotationAxis.Y, RotationAxis.Z], Entangler = EntanglerPattern.Chain,
    }, Qubits);

    public static IReadOnlyDictionary<string, double> Run(bool quick)
    {
        TorchRuntime.EnsureLoaded();
        int oldThreads = torch.get_num_threads();
        torch.set_num_threads(1);
        try { return Measure(quick); }
        finally { torch.set_num_threads(oldThreads); }
    }

    private static Dictionary<string, double> Measure(bool quick)
    {
        var f = new Dictionary<string, double>();

        var bw = KernelThroughput.MeasureSingleQubitSweep(22, quick ? 22 : 66, threads: 1, repeats: quick ? 2 : 5);
        f["bandwidth_ratio_22q"] = bw.Ratio;
        f["gate_bytes_per_second_22q"] = bw.GateBytesPerSecond;
        f["copy_bytes_per_second_22q"] = bw.CopyBytesPerSecond;

        var circuit = BenchmarkCircuit();
        var obs = Observable.ZOnEach(Qubits);
        var engine = ExpectationEvaluatorFactory.Create(circuit, obs, new SimulationOptions { Gradient = GradientMethod.Adjoint, Threads = 1 });
        var reference = new TensorOpsReferenceCircuit(circuit, obs);
        var rng = RandomStream.FromRoot(2024, "simulator-benchmark");
        double budget = quick ? 0.4 : 2.0;

        foreach (int batch in new[] { 1, 256 })
        {
            var x = Enumerable.Range(0, batch * circuit.InputCount).Select(_ => 2 * rng.NextDouble() - 1).ToArray();
            var w = Enumerable.Range(0, circuit.ParameterCount).Select(_ => Math.PI * (2 * rng.NextDouble() - 1)).ToArray();
            var g = Enumerable.Range(0, batch * obs.Count).Select(_ => rng.NextDouble()).ToArray();
            var o = new double[batch * obs.Count];
            var gp = new double[w.Length];
            var gi = new double[x.Length];
            void EngineForward() => engine.Forward(x, w, batch, false, o);
            void EngineBoth() { engine.Forward(x, w, batch, false, o); engine.Backward(x, w, batch, false, g, gp, gi); }
            void EngineBackward() => engine.Backward(x, w, batch, false, g, gp, gi);
            void TorchBoth() => reference.Run(x, w, batch, g);

            var (tEngine, tTorch) = Paired(EngineBoth, TorchBoth, budget);
            f[$"speedup_vs_tensor_ops_b{batch}"] = tTorch / tEngine;
            f[$"engine_forward_backward_seconds_b{batch}"] = tEngine;
            f[$"tensor_ops_forward_backward_seconds_b{batch}"] = tTorch;

            var (tFwd, tBwd) = Paired(EngineForward, EngineBackward, budget);
            string suffix = batch == 256 ? "" : $"_b{batch}";
            f["adjoint_over_forward" + suffix] = tBwd / tFwd;
            if (batch == 256) f["gates_per_second_6q_b256"] = circuit.Resources.TotalGates * (double)batch / tFwd;
        }
        f["parameter_count"] = circuit.ParameterCount;
        return f;
    }

    /// <summary>
    /// Median seconds per call of two actions, timed in alternating blocks so that machine load affects both alike.
    /// </summary>
    private static (double a, double b) Paired(Action a, Action b, double budgetSeconds)
    {
        // Warm-up: JIT tiers and buffers settle before timing.
        var warm = Stopwatch.StartNew();
        for (int i = 0; i < 20 || warm.Elapsed.TotalSeconds < 0.2 * budgetSeconds; i++) { a(); b(); if (warm.Elapsed.TotalSeconds > budgetSeconds) break; }
        int repsA = Calibrate(a), repsB = Calibrate(b);
        var ta = new List<double>(); var tb = new List<double>();
        var total = Stopwatch.StartNew();
        while (ta.Count < 5 || (total.Elapsed.TotalSeconds < budgetSeconds && ta.Count < 51))
        {
            ta.Add(Block(a, repsA));
            tb.Add(Block(b, repsB));
        }
        return (Median(ta), Median(tb));
    }

    private static int Calibrate(Action act)
    {
        var sw = Stopwatch.StartNew();
        int n = 0;
        while (sw.Elapsed.TotalSeconds < 0.01) { act(); n++; }
        return Math.Max(1, n);
    }

    private static double Block(Action act, int reps)
    {
        var sw = Stopwatch.StartNew();
        for (int i = 0; i < reps; i++) act();
        return sw.Elapsed.TotalSeconds / reps;
    }

    private static double Median(List<double> v)
    {
        var s = v.OrderBy(t => t).ToArray();
        return s.Length % 2 == 1 ? s[s.Length / 2] : 0.5 * (s[s.Length / 2 - 1] + s[s.Length / 2]);
    }
}
