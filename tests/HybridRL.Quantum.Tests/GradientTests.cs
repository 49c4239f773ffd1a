using HybridRL.Quantum.Ansatz;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Encodings;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;

namespace HybridRL.Quantum.Tests;

public class GradientTests
{
    /// <summary>Central finite differences of L = Σ g·E over parameters and inputs (step h).</summary>
    private static (double[] gp, double[] gi) FiniteDifferences(IExpectationEvaluator ev, double[] x, double[] w, int batch, bool perRow, double[] g, double h = 1e-5)
    {
        double L(double[] xx, double[] ww)
        {
            var o = new double[batch * ev.OutputCount];
            ev.Forward(xx, ww, batch, perRow, o);
            double s = 0;
            for (int i = 0; i < o.Length; i++) s += g[i] * o[i];
            return s;
        }
        var gp = new double[w.Length];
        for (int i = 0; i < w.Length; i++)
        {
            var a = (double[])w.Clone(); var b = (double[])w.Clone();
            a[i] += h; b[i] -= h;
            gp[i] = (L(x, a) - L(x, b)) / (2 * h);
        }
        var gi = new double[x.Length];
        for (int i = 0; i < x.Length; i++)
        {
            var a = (double[])x.Clone(); var b = (double[])x.Clone();
            a[i] += h; b[i] -= h;
            gi[i] = (L(a, w) - L(b, w)) / (2 * h);
        }
        return (gp, gi);
    }

    private static void AssertClose(double[] expected, double[] actual, double tol, string what)
    {
        Assert.Equal(expected.Length, actual.Length);
        for (int i = 0; i < expected.Length; i++)
            Assert.True(Math.Abs(expected[i] - actual[i]) < tol, $"{what}[{i}]: {actual[i]} vs {expected[i]}");
    }

    [Fact]
    public void AdjointEqualsParameterShiftEqualsFiniteDifferences()
    {
        var rng = RandomStream.FromRoot(21, "grad");
        for (int trial = 0; trial < 6; trial++)
        {
            int n = 2 + trial % 3, batch = 3;
            var c = TestCircuits.Random(n, 25, rng, 3, 5);
            var obs = new[] { Observable.ZOn(0), Observable.Parse("0.7*X1 - 0.3*Y0Z1"), Observable.ZProduct(0, 1) };
            var x = TestCircuits.Uniform(rng, batch * 3);
            foreach (bool perRow in new[] { false, true })
            {
                var w = TestCircuits.Uniform(rng, (perRow ? batch : 1) * 5);
                var g = TestCircuits.Uniform(rng, batch * obs.Length);
                var adj = ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Gradient = GradientMethod.Adjoint });
                var ps = ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Gradient = GradientMethod.ParameterShift });
                var gpA = new double[w.Length]; var giA = new double[x.Length];
                var gpS = new double[w.Length]; var giS = new double[x.Length];
                adj.Backward(x, w, batch, perRow, g, gpA, giA);
                ps.Backward(x, w, batch, perRow, g, gpS, giS);
                var (gpF, giF) = FiniteDifferences(adj, x, w, batch, perRow, g);
                // Adjoint (Jones & Gacon 2020) vs parameter shift (Mitarai 2018 / Schuld 2019; four-term for controlled rotations) vs central differences.
                AssertClose(gpF, gpA, 1e-6, $"trial {trial} adjoint dparams");
                AssertClose(giF, giA, 1e-6, $"trial {trial} adjoint dinputs");
                AssertClose(gpA, gpS, 1e-10, $"trial {trial} shift dparams");
                AssertClose(giA, giS, 1e-10, $"trial {trial} shift dinputs");
            }
        }
    }

    [Fact]
    public void AnalyticDerivativesOfRyAndScaledArctanInput()
    {
        // ⟨Z⟩ = cos(θ + s·atan(x)) for RY(s·atan x) then RY(θ): d/dθ = −sin(·), d/dx = −sin(·)·s/(1+x²) (hand-worked).
        var c = new CircuitBuilder(1).RY(0, Angle.Input(0, 1.7, InputSquash.Arctan)).RY(0, Angle.Parameter(0)).Build();
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)]);
        double th = 0.4, x = -0.8, s = 1.7;
        var gp = new double[1]; var gi = new double[1];
        ev.Backward([x], [th], 1, false, [1.0], gp, gi);
        double a = th + s * Math.Atan(x);
        Assert.Equal(-Math.Sin(a), gp[0], 13);
        Assert.Equal(-Math.Sin(a) * s / (1 + x * x), gi[0], 13);

        // Trainable scale: angle = w1·x, ⟨Z⟩ = cos(w1·x): d/dw1 = −x sin(w1 x), d/dx = −w1 sin(w1 x).
        var c2 = new CircuitBuilder(1).RY(0, Angle.ScaledInput(0, 1)).Build();
        var ev2 = ExpectationEvaluatorFactory.Create(c2, [Observable.ZOn(0)]);
        var gp2 = new double[2]; var gi2 = new double[1];
        ev2.Backward([0.9], [0, 1.3], 1, false, [1.0], gp2, gi2);
        Assert.Equal(-0.9 * Math.Sin(1.3 * 0.9), gp2[1], 13);
        Assert.Equal(-1.3 * Math.Sin(1.3 * 0.9), gi2[0], 13);
        Assert.Equal(0, gp2[0]);
    }

    [Fact]
    public void FourTermRuleOnControlledRotations()
    {
        // Controlled rotations have generator eigenvalues {0, ±1/2}: the two-term rule is wrong, the four-term
        // rule (Wierichs et al. 2022) is exact; compared with central differences.
        foreach (var kind in new[] { GateKind.CRX, GateKind.CRY, GateKind.CRZ })
        {
            var b = new CircuitBuilder(2).RY(0, Angle.Parameter(1)).H(1).RX(1, 0.3);
            b.Add(kind, [0, 1], [Angle.Parameter(0)]);
            b.H(1);
            var c = b.Build();
            var obs = new[] { Observable.Parse("Z1 + 0.5*X1 + 0.2*Y1Z0") };
            var ps = ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Gradient = GradientMethod.ParameterShift });
            double[] w = [1.1, 0.7];
            var gp = new double[2];
            ps.Backward([], w, 1, false, [1.0], gp, []);
            var (gpF, _) = FiniteDifferences(ps, [], w, 1, false, [1.0]);
            AssertClose(gpF, gp, 1e-6, kind.ToString());
            // four shifted evaluations for the controlled rotation, two for RY (hand-counted)
            Assert.Equal(6, GradientCost.ShiftEvaluationsPerRow(c));
        }
    }

    [Fact]
    public void AmplitudeAndProductEncodingInputGradients()
    {
        var rng = RandomStream.FromRoot(22, "encgrad");
        foreach (var enc in new[] { EncodingKind.Amplitude, EncodingKind.ProductZZ, EncodingKind.ReUploading })
        {
            var spec = new LayeredCircuitSpec { Qubits = 3, Layers = 2, Encoding = enc, Entangler = EntanglerPattern.Ring, TrainableInputScale = enc == EncodingKind.ReUploading };
            int inputs = enc == EncodingKind.Amplitude ? 6 : 3;
            var c = CircuitTemplate.Build(spec, inputs);
            var obs = Observable.ZOnEach(3);
            var ev = ExpectationEvaluatorFactory.Create(c, obs);
            int batch = 2;
            var x = TestCircuits.Uniform(rng, batch * inputs, 0.1, 1.5);
            var w = TestCircuits.Uniform(rng, c.ParameterCount);
            var g = TestCircuits.Uniform(rng, batch * 3);
            var gp = new double[w.Length]; var gi = new double[x.Length];
            ev.Backward(x, w, batch, false, g, gp, gi);
            var (gpF, giF) = FiniteDifferences(ev, x, w, batch, false, g);
            AssertClose(gpF, gp, 1e-6, $"{enc} params");
            AssertClose(giF, gi, 1e-6, $"{enc} inputs");
        }
    }

    [Fact]
    public void ParameterShiftWithShotsIsUnbiased()
    {
        // dE/dθ for ⟨Z⟩ = cos θ is −sin θ; the shot estimate (E₊ − E₋)/2 has variance ((1−E₊²) + (1−E₋²)) / (4·shots·rows).
        var c = new CircuitBuilder(1).RY(0, Angle.Parameter(0)).Build();
        int shots = 500, rows = 40;
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)], new SimulationOptions { Mode = SimulationMode.Shots, Shots = shots, Seed = 3 });
        Assert.Equal(GradientMethod.ParameterShift, ev.GradientMethod);
        double th = 0.9;
        var w = Enumerable.Repeat(th, rows).ToArray();
        var gp = new double[rows];
        ev.Backward([], w, rows, true, Enumerable.Repeat(1.0, rows).ToArray(), gp, []);
        double mean = gp.Average();
        double ep = Math.Cos(th + Math.PI / 2), em = Math.Cos(th - Math.PI / 2);
        double se = Math.Sqrt(((1 - ep * ep) + (1 - em * em)) / (4.0 * shots * rows));
        Assert.True(Math.Abs(mean + Math.Sin(th)) < 4 * se, $"mean {mean} vs {-Math.Sin(th)} (se {se})");
        // each shifted evaluation is counted: 2 per row, 500 shots each
        Assert.Equal(2L * rows, ev.Counters.CircuitExecutions);
        Assert.Equal(2L * rows * shots, ev.Counters.Shots);
    }
}
