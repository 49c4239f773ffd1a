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
        GradientMethod gradient = GradientMethod.Auto) => new()
    {
        Compressor = new CompressorSettings { Kind = kind, BondDimension = 3, Hidden = [5] },
        Circuit = new CircuitSettings { Qubits = qubits, Layers = layers, Readout = readout, InputSquash = HybridRL.Quantum.Circuits.InputSquash.Arctan },
        Simulation = new SimulationSettings { Gradient = gradient },
    };

    private static double[] Uniform(int n, ulong seed, double lo = -1, double hi = 1)
    {
        var r = new RandomStream(seed);
        return Enumerable.Range(0, n).Select(_ => lo + (hi - lo) * r.NextDouble()).ToArray();
    }

    [Theory]
    [InlineData(CompressorKind.Mps, ReadoutKind.PerAction)]
    [InlineData(CompressorKind.Dense, ReadoutKind.Linear)]
    [InlineData(CompressorKind.None, ReadoutKind.Linear)]
    public void WholeModelGradientMatchesCentralFiniteDifferences(CompressorKind kind, ReadoutKind readout)
    {
        TorchRuntime.EnsureLoaded();
        int obs = kind == CompressorKind.None ? 3 : 7;
        using var model = (HybridModel)ModelFactory.Create(Settings(kind, readout), obs, 2, 17);
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
