using HybridRL.Models;
using HybridRL.Native;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;
using TorchSharp;
using static TorchSharp.torch;

namespace HybridRL.Tests.Models;

public class HybridModelTests
{
    private static ModelSettings Settings(CompressorKind kind, ReadoutKind readout = ReadoutKind.PerAction, int qubits = 3, int layers = 2,
        GradientMethod gradient = GradientMethod.Auto, bool trainableReadout = true) => new()
    {
        Compressor = new CompressorSettings { Kind = kind, BondDimension = 3, Hidden = [5] },
        Circuit = new CircuitSettings { Qubits = qubits, Layers = layers, Readout = readout, InputSquash = HybridRL.Quantum.Circuits.InputSquash.Arctan, TrainableReadout = trainableReadout },
        Simulation = new SimulationSettings { Gradient = gradient },
    };

    private static double[] Uniform(int n, ulong seed, double lo = -1, double hi = 1)
    {
        var r = new RandomStream(seed);
        return Enumerable.Range(0, n).Select(_ => lo + (hi - lo) * r.NextDouble()).ToArray();
    }

    [Theory]
    [InlineData(CompressorKind.Mps, ReadoutKind.PerAction, true)]
    [InlineData(CompressorKind.Dense, ReadoutKind.Linear, true)]
    [InlineData(CompressorKind.None, ReadoutKind.Linear, true)]
    [InlineData(CompressorKind.Dense, ReadoutKind.Linear, false)]
    [InlineData(CompressorKind.None, ReadoutKind.PerAction, false)]
    public void WholeModelGradientMatchesCentralFiniteDifferences(CompressorKind kind, ReadoutKind readout, bool trainableReadout)
    {
        TorchRuntime.EnsureLoaded();
        int obs = kind == CompressorKind.None ? 3 : 7;
        using var model = (HybridModel)ModelFactory.Create(Settings(kind, readout, trainableReadout: trainableReadout), obs, 2, 17);
        const int batch = 3;
        var x = Uniform(batch * obs, 3);
        var g = Uniform(batch * 2, 4);
        using var input = tensor(x, [batch, obs], dtype: float64).requires_grad_(true);
        using var gt = tensor(g, [batch, 2], dtype: float64);
        using (var loss = (model.Forward(input) * gt).sum()) loss.backward();
        var grad = model.Parameters().SelectMany(p => HybridRLTestAccess.Flat(p.grad!)).ToArray();
        var gInput = HybridRLTestAccess.Flat(input.grad!);

        var flat = new double[model.ParameterCount];
        model.GetFlat(flat);
        var outBuf = new double[batch * 2];
        double Loss(double[] p, double[] xx)
        {
            model.SetFlat(p);
            model.ForwardNoGrad(xx, batch, outBuf);
            return outBuf.Zip(g, (a, b) => a * b).Sum();
        }
        const double h = 1e-6;
        // Central differences, truncation error O(h²) (Nocedal & Wright 2006, §8.1).
        var rng = new RandomStream(8);
        var indices = Enumerable.Range(0, 30).Select(_ => rng.NextInt(flat.Length)).Concat([flat.Length - 1, 0]).ToArray();
        foreach (int j in indices)
        {
            var plus = (double[])flat.Clone(); plus[j] += h;
            var minus = (double[])flat.Clone(); minus[j] -= h;
            double fd = (Loss(plus, x) - Loss(minus, x)) / (2 * h);
            Assert.True(Math.Abs(fd - grad[j]) <= 1e-6 * (1 + Math.Abs(fd)), $"parameter {j}: fd {fd}, autograd {grad[j]}");
        }
        model.SetFlat(flat);
        for (int j = 0; j < x.Length; j++)
        {
            var plus = (double[])x.Clone(); plus[j] += h;
            var minus = (double[])x.Clone(); minus[j] -= h;
            double fd = (Loss(flat, plus) - Loss(flat, minus)) / (2 * h);
            Assert.True(Math.Abs(fd - gInput[j]) <= 1e-6 * (1 + Math.Abs(fd)), $"input {j}: fd {fd}, autograd {gInput[j]}");
        }
    }

    [Theory]
    [InlineData(GradientMethod.Adjoint)]
    [InlineData(GradientMethod.ParameterShift)]
    public void CircuitFunctionGradientsEqualTheEnginesVectorJacobianProduct(GradientMethod method)
    {
        TorchRuntime.EnsureLoaded();
        using var model = (HybridModel)ModelFactory.Create(Settings(CompressorKind.None, gradient: method), 3, 2, 5);
        var ev = model.QuantumLayer.Evaluator;
        Assert.Equal(method, ev.GradientMethod);
        const int batch = 4;
        var x = Uniform(batch * 3, 1);
        var theta = Uniform(ev.ParameterCount, 2, -3, 3);
        var g = Uniform(batch * ev.OutputCount, 3);
        using var xt = tensor(x, [batch, 3], dtype: float64).requires_grad_(true);
        using var tt = tensor(theta, [ev.ParameterCount], dtype: float64).requires_grad_(true);
        using var y = CircuitFunction.apply(xt, tt, ev);
        var yv = HybridRLTestAccess.Flat(y);
        using (var loss = (y * tensor(g, [batch, ev.OutputCount], dtype: float64)).sum()) loss.backward();
        var expectedOut = new double[batch * ev.OutputCount];
        ev.Forward(x, theta, batch, false, expectedOut);
        var gp = new double[ev.ParameterCount];
        var gi = new double[batch * 3];
        ev.Backward(x, theta, batch, false, g, gp, gi);
        // The layer must hand the engine's own results through unchanged (reference: the engine's adjoint / shift VJP).
        Assert.Equal(expectedOut, yv);
        Assert.Equal(gp, HybridRLTestAccess.Flat(tt.grad!));
        Assert.Equal(gi, HybridRLTestAccess.Flat(xt.grad!));
    }

    [Fact]
    public void QuantumLayerGradientsEqualTheEnginesAdjointChainedWithTheReadout()
    {
        TorchRuntime.EnsureLoaded();
        using var model = (HybridModel)ModelFactory.Create(Settings(CompressorKind.None, ReadoutKind.PerAction, gradient: GradientMethod.Adjoint), 3, 2, 21);
        var layer = model.QuantumLayer;
        var ev = layer.Evaluator;
        const int batch = 5;
        var x = Uniform(batch * 3, 31);
        var g = Uniform(batch * 2, 32);
        using var xt = tensor(x, [batch, 3], dtype: float64).requires_grad_(true);
        using (var loss = (layer.Forward(xt) * tensor(g, [batch, 2], dtype: float64)).sum()) loss.backward();
        var gotWeights = HybridRLTestAccess.Flat(layer.Weights.grad!);
        var gotInputs = HybridRLTestAccess.Flat(xt.grad!);

        var w = HybridRLTestAccess.Flat(layer.Weights);
        int pc = ev.ParameterCount;
        var e = new double[batch * 2];
        ev.Forward(x, w.AsSpan(0, pc), batch, false, e);
        // Chain rule by hand for out_a = w_a·E_a + b_a: ∂L/∂E_a = g_a·w_a, ∂L/∂w_a = Σ_b g_a·E_a, ∂L/∂b_a = Σ_b g_a.
        var gE = new double[batch * 2];
        double[] gw = new double[2], gb = new double[2];
        for (int b = 0; b < batch; b++)
            for (int a = 0; a < 2; a++)
            {
                gE[b * 2 + a] = g[b * 2 + a] * w[pc + a];
                gw[a] += g[b * 2 + a] * e[b * 2 + a];
                gb[a] += g[b * 2 + a];
            }
        var gTheta = new double[pc];
        var gIn = new double[batch * 3];
        ev.Backward(x, w.AsSpan(0, pc), batch, false, gE, gTheta, gIn); // adjoint method (Jones & Gacon 2020), the engine's own
        for (int i = 0; i < pc; i++) Assert.Equal(gTheta[i], gotWeights[i], 14);
        for (int a = 0; a < 2; a++)
        {
            Assert.Equal(gw[a], gotWeights[pc + a], 14);
            Assert.Equal(gb[a], gotWeights[pc + 2 + a], 14);
        }
        for (int i = 0; i < gIn.Length; i++) Assert.Equal(gIn[i], gotInputs[i], 14);
    }

    [Fact]
    public void FixedReadoutHasNoParametersAndPassesTheExpectationsThrough()
    {
        TorchRuntime.EnsureLoaded();
        using var model = (HybridModel)ModelFactory.Create(Settings(CompressorKind.None, ReadoutKind.PerAction, gradient: GradientMethod.Adjoint, trainableReadout: false), 3, 2, 21);
        using var trained = (HybridModel)ModelFactory.Create(Settings(CompressorKind.None, ReadoutKind.PerAction, gradient: GradientMethod.Adjoint), 3, 2, 21);
        var layer = model.QuantumLayer;
        var ev = layer.Evaluator;
        // Same seed, same circuit: the fixed model is the trainable one without its 2 weights and 2 biases.
        Assert.Equal(0, model.ParameterCounts["readout"]);
        Assert.Equal(trained.ParameterCount - 4, model.ParameterCount);
        Assert.Equal(ev.ParameterCount, layer.ParameterCount);
        const int batch = 4;
        var x = Uniform(batch * 3, 41);
        var g = Uniform(batch * 2, 42);
        using var xt = tensor(x, [batch, 3], dtype: float64).requires_grad_(true);
        using var y = layer.Forward(xt);
        using (var loss = (y * tensor(g, [batch, 2], dtype: float64)).sum()) loss.backward();
        // per_action with w = 1, b = 0: out_a = ⟨Z_a⟩ exactly, and ∂L/∂E = g, so the layer's gradient is the engine's VJP of g.
        var theta = HybridRLTestAccess.Flat(layer.Weights);
        var e = new double[batch * 2];
        ev.Forward(x, theta, batch, false, e);
        Assert.Equal(e, HybridRLTestAccess.Flat(y));
        var gTheta = new double[ev.ParameterCount];
        var gIn = new double[batch * 3];
        ev.Backward(x, theta, batch, false, g, gTheta, gIn);
        Assert.Equal(gTheta, HybridRLTestAccess.Flat(layer.Weights.grad!));
        Assert.Equal(gIn, HybridRLTestAccess.Flat(xt.grad!));
        // the population path agrees with the single-row path without read-out parameters
        var single = new double[2];
        var population = new double[2];
        model.ForwardNoGrad(x.AsSpan(0, 3), 1, single);
        model.PopulationForward(theta, x.AsSpan(0, 3), 1, population);
        Assert.Equal(single, population);
        Assert.Equal(e.AsSpan(0, 2).ToArray(), single);
    }

    [Fact]
    public void AdjointAndParameterShiftAgreeThroughTheLayer()
    {
        TorchRuntime.EnsureLoaded();
        var grads = new List<double[]>();
        foreach (var method in new[] { GradientMethod.Adjoint, GradientMethod.ParameterShift })
        {
            using var model = ModelFactory.Create(Settings(CompressorKind.Mps, gradient: method), 6, 2, 9);
            using var input = tensor(Uniform(12, 6), [2, 6], dtype: float64);
            using (var loss = model.Forward(input).square().sum()) loss.backward();
            grads.Add(model.Parameters().SelectMany(p => HybridRLTestAccess.Flat(p.grad!)).ToArray());
        }
        // Parameter-shift rule is exact for Pauli rotations (Mitarai et al. 2018; Schuld et al. 2019).
        for (int i = 0; i < grads[0].Length; i++) Assert.Equal(grads[0][i], grads[1][i], 10);
    }

    [Theory]
    [InlineData(CompressorKind.Mps)]
    [InlineData(CompressorKind.Dense)]
    [InlineData(CompressorKind.None)]
    public void PopulationForwardEqualsSeparateForwardsBitForBit(CompressorKind kind)
    {
        TorchRuntime.EnsureLoaded();
        int obs = kind == CompressorKind.None ? 3 : 9;
        using var model = ModelFactory.Create(Settings(kind, ReadoutKind.Linear), obs, 3, 2);
        const int k = 5;
        int p = model.ParameterCount;
        var baseFlat = new double[p];
        model.GetFlat(baseFlat);
        var rng = new RandomStream(12);
        var members = new double[k * p];
        for (int m = 0; m < k; m++)
            for (int i = 0; i < p; i++) members[m * p + i] = baseFlat[i] + 0.3 * rng.NextGaussian();
        var observations = Uniform(k * obs, 13);
        var population = new double[k * 3];
        model.PopulationForward(members, observations, k, population);
        var single = new double[3];
        for (int m = 0; m < k; m++)
        {
            model.SetFlat(members.AsSpan(m * p, p));
            model.ForwardNoGrad(observations.AsSpan(m * obs, obs), 1, single);
            for (int a = 0; a < 3; a++) Assert.Equal(BitConverter.DoubleToInt64Bits(single[a]), BitConverter.DoubleToInt64Bits(population[m * 3 + a]));
            // Autograd path: same function, different summation order (torch BLAS vs managed loops).
            using var t = tensor(observations.AsSpan(m * obs, obs).ToArray(), [1, obs], dtype: float64);
            using var y = model.Forward(t);
            var yv = HybridRLTestAccess.Flat(y);
            for (int a = 0; a < 3; a++) Assert.Equal(single[a], yv[a], 12);
        }
    }

    [Fact]
    public void FlatParametersRoundTripExactlyAndAreDeterministicInTheSeed()
    {
        TorchRuntime.EnsureLoaded();
        using var a = ModelFactory.Create(Settings(CompressorKind.Mps), 8, 2, 77);
        using var b = ModelFactory.Create(Settings(CompressorKind.Mps), 8, 2, 77);
        using var c = ModelFactory.Create(Settings(CompressorKind.Mps), 8, 2, 78);
        var fa = new double[a.ParameterCount]; a.GetFlat(fa);
        var fb = new double[b.ParameterCount]; b.GetFlat(fb);
        var fc = new double[c.ParameterCount]; c.GetFlat(fc);
        Assert.Equal(fa, fb);
        Assert.NotEqual(fa, fc);
        var values = Uniform(fa.Length, 5, -1e3, 1e3);
        values[0] = double.Epsilon; values[1] = -0.0; values[2] = 1.0 / 3.0;
        a.SetFlat(values);
        var back = new double[values.Length];
        a.GetFlat(back);
        Assert.Equal(values.Select(BitConverter.DoubleToInt64Bits), back.Select(BitConverter.DoubleToInt64Bits));
        Assert.Equal(a.ParameterCount, a.ParameterCounts.Values.Sum());
        Assert.Equal(a.ParameterCount, a.Parameters().Sum(p => (int)p.numel()));
    }

    [Fact]
    public void ParameterCountsFollowTheCircuitLayout()
    {
        TorchRuntime.EnsureLoaded();
        using var model = ModelFactory.Create(Settings(CompressorKind.Mps, qubits: 3, layers: 2), 10, 2, 1);
        // Hand count: 3 qubits × 2 layers × 2 rotations = 12 angles; re-uploaded angle encoding of 3 features
        // in 2 layers = 6 scales; per-action read-out 2 weights + 2 biases; MPS (10-1)·2·3² + 2·3·3².
        Assert.Equal(12, model.ParameterCounts["circuit"]);
        Assert.Equal(6, model.ParameterCounts["input_scaling"]);
        Assert.Equal(4, model.ParameterCounts["readout"]);
        Assert.Equal(9 * 2 * 9 + 2 * 3 * 9, model.ParameterCounts["compressor"]);
    }

    [Fact]
    public void ConfigThatCannotFitNamesTheKeysToChange()
    {
        TorchRuntime.EnsureLoaded();
        var settings = new ModelSettings { Circuit = new CircuitSettings { Qubits = 4, Encoding = EncodingKind.AngleX } };
        var ex = Assert.Throws<ModelConfigurationException>(() => ModelFactory.Create(settings, 100, 2, 1));
        Assert.Contains("model.compressor.kind", ex.Message);
        Assert.Contains("model.circuit.qubits", ex.Message);
        Assert.Contains("model.circuit.encoding", ex.Message);
        Assert.Contains("100", ex.Message);
        var tooManyActions = settings with { Compressor = new CompressorSettings { Kind = CompressorKind.Mps } };
        var ex2 = Assert.Throws<ModelConfigurationException>(() => ModelFactory.Create(tooManyActions, 100, 6, 1));
        Assert.Contains("model.circuit.readout", ex2.Message);
    }

    [Fact]
    public void CountersRecordExecutionsAndTheLayerTrainsWithAdam()
    {
        TorchRuntime.EnsureLoaded();
        using var model = ModelFactory.Create(Settings(CompressorKind.None), 3, 2, 3);
        var opt = optim.Adam(model.Parameters(), lr: 0.05);
        using var x = tensor(Uniform(12, 1), [4, 3], dtype: float64);
        using var target = tensor(new[] { 0.5, -0.5, 0.2, 0.1, -0.3, 0.4, 0.0, 0.6 }, [4, 2], dtype: float64);
        double first = 0, last = 0;
        for (int step = 0; step < 40; step++)
        {
            opt.zero_grad();
            using var loss = (model.Forward(x) - target).square().mean();
            loss.backward();
            opt.step();
            if (step == 0) first = loss.item<double>();
            last = loss.item<double>();
        }
        Assert.True(last < 0.5 * first, $"loss {first} → {last}");
        Assert.True(model.Counters!.CircuitExecutions >= 40 * 4);
        Assert.True(model.HardwareExecutionsPerGradientRow > 0);
    }
}

public class HybridModelModesTests
{
    [Fact]
    public void ActingPathAddsNoAllocationToTheEngines()
    {
        TorchRuntime.EnsureLoaded();
        // Compressor rows allocate nothing.
        var mps = new MpsCompressor(12, 4, 3, SiteFeatureMap.Trigonometric, new RandomStream(1));
        var w = HybridRLTestAccess.Flat(mps.Weights);
        var row = new double[3];
        var scratch = new double[mps.ScratchSize];
        var x = Enumerable.Range(0, 12).Select(i => 0.1 * i).ToArray();
        mps.ForwardRow(w, x, row, scratch);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 10; i++) mps.ForwardRow(w, x, row, scratch);
        Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);

        // The whole acting path allocates exactly what the engine itself does for the same call (the engine's
        // own allocation depends on the angles, so compare like with like).
        var settings = new ModelSettings { Circuit = new CircuitSettings { Qubits = 3 } };
        using var model = (HybridModel)ModelFactory.Create(settings, 3, 2, 1);
        var ev = model.QuantumLayer.Evaluator;
        var obs = new[] { 0.1, -0.2, 0.3, 0.4, 0.5, -0.6, 0.0, 0.2, 0.9, -1.0, 0.3, 0.7 };
        var output = new double[8];
        var expectations = new double[4 * ev.OutputCount];
        var theta = HybridRLTestAccess.Flat(model.QuantumLayer.Weights)[..ev.ParameterCount];
        for (int i = 0; i < 2; i++)
        {
            model.ForwardNoGrad(obs, 4, output);
            ev.Forward(obs, theta, 4, false, expectations);
        }
        before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 10; i++) ev.Forward(obs, theta, 4, false, expectations);
        long engine = GC.GetAllocatedBytesForCurrentThread() - before;
        before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 10; i++) model.ForwardNoGrad(obs, 4, output);
        long total = GC.GetAllocatedBytesForCurrentThread() - before;
        Assert.True(total <= engine, $"model path allocated {total} bytes over 10 calls, the engine alone {engine}");
    }

    [Fact]
    public void ShotModeTrainsThroughParameterShiftAndCountsShots()
    {
        TorchRuntime.EnsureLoaded();
        var settings = new ModelSettings
        {
            Circuit = new CircuitSettings { Qubits = 2, Layers = 1 },
            Simulation = new SimulationSettings { Mode = SimulationMode.Shots, Shots = 200 },
        };
        using var model = ModelFactory.Create(settings, 2, 2, 3);
        using var x = tensor(new[] { 0.1, 0.2, -0.3, 0.4 }, [2, 2], dtype: float64);
        using (var loss = model.Forward(x).sum()) loss.backward();
        var grad = model.Parameters().SelectMany(p => HybridRLTestAccess.Flat(p.grad!)).ToArray();
        Assert.All(grad, g => Assert.True(double.IsFinite(g)));
        Assert.Contains(grad, g => g != 0);
        Assert.True(model.Counters!.Shots > 0);
        // Per-action read-out bias gradient of sum(out) is exactly 1 per row (by definition), whatever the shot noise.
        Assert.Equal(2.0, grad[^1], 12);
        Assert.Equal(2.0, grad[^2], 12);
    }

    [Fact]
    public void ShotNoiseReplaysExactlyAfterRestoringTheSimulationState()
    {
        TorchRuntime.EnsureLoaded();
        var settings = new ModelSettings
        {
            Circuit = new CircuitSettings { Qubits = 2, Layers = 1 },
            Simulation = new SimulationSettings { Mode = SimulationMode.Shots, Shots = 50 },
        };
        using var model = ModelFactory.Create(settings, 2, 2, 3);
        var sim = (ISimulatedModel)model;
        var obs = new[] { 0.3, -0.1 };
        var a = new double[2];
        var b = new double[2];
        var c = new double[2];
        var state = sim.GetSimulationState();
        model.ForwardNoGrad(obs, 1, a);
        model.ForwardNoGrad(obs, 1, c);
        sim.SetSimulationState(state);
        model.ForwardNoGrad(obs, 1, b);
        Assert.Equal(a, b);          // same stream position → same shots (checkpoint/resume contract)
        Assert.NotEqual(a, c);       // 50 shots: successive estimates differ (probability of a tie is tiny)
    }

    [Fact]
    public void NoiseInExactModeIsRejectedWithTheKeys()
    {
        TorchRuntime.EnsureLoaded();
        var settings = new ModelSettings { Simulation = new SimulationSettings { Depolarizing = 0.01 } };
        var ex = Assert.Throws<ModelConfigurationException>(() => ModelFactory.Create(settings, 2, 2, 3));
        Assert.Contains("model.simulation.mode", ex.Message);
    }
}

public class HybridModelEncodingTests
{
    [Fact]
    public void BasisEncodingGivesTheZExpectationsOfTheComputationalState()
    {
        TorchRuntime.EnsureLoaded();
        // One layer with all rotation angles set to 0 and no entangler leaves |s⟩ unchanged, so
        // ⟨Z_q⟩ = (−1)^{bit_q(s)} (Z eigenstates, Nielsen & Chuang §2.1.3); read-out weights start at 1, biases at 0.
        var settings = new ModelSettings
        {
            Circuit = new CircuitSettings { Qubits = 3, Layers = 1, Encoding = EncodingKind.Basis, Entangler = EntanglerPattern.None, Readout = ReadoutKind.PerAction },
        };
        using var model = ModelFactory.Create(settings, 1, 3, 1);
        var flat = new double[model.ParameterCount];
        model.GetFlat(flat);
        var circuitCount = model.ParameterCounts["circuit"];
        for (int i = 0; i < circuitCount; i++) flat[i] = 0.0;
        model.SetFlat(flat);
        var output = new double[3];
        model.ForwardNoGrad([5.0], 1, output); // 5 = 0b101: qubits 0 and 2 are |1⟩
        Assert.Equal(-1.0, output[0], 12);
        Assert.Equal(1.0, output[1], 12);
        Assert.Equal(-1.0, output[2], 12);
    }

    [Theory]
    [InlineData(EncodingKind.Amplitude, 8, 3)]
    [InlineData(EncodingKind.ProductZz, 3, 3)]
    [InlineData(EncodingKind.DenseAngle, 6, 3)]
    public void OtherEncodingsBuildAndDifferentiate(EncodingKind encoding, int features, int qubits)
    {
        TorchRuntime.EnsureLoaded();
        var settings = new ModelSettings { Circuit = new CircuitSettings { Qubits = qubits, Layers = 1, Encoding = encoding, Readout = ReadoutKind.Linear } };
        using var model = ModelFactory.Create(settings, features, 2, 1);
        var x = Enumerable.Range(0, features).Select(i => 0.2 + 0.1 * i).ToArray();
        using var input = tensor(x, [1, features], dtype: float64).requires_grad_(true);
        using (var loss = model.Forward(input).sum()) loss.backward();
        var g = HybridRLTestAccess.Flat(input.grad!);
        Assert.Contains(g, v => v != 0);
        var tooMany = ModelCircuit.Capacity(encoding, qubits) + 1;
        var ex = Assert.Throws<ModelConfigurationException>(() => ModelFactory.Create(settings, tooMany, 2, 1));
        Assert.Contains("model.circuit.encoding", ex.Message);
    }
}
