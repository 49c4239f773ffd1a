using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Noise;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;
using MathNet.Numerics.LinearAlgebra;
using Complex = System.Numerics.Complex;

namespace HybridRL.Quantum.Tests;

public class NoiseTests
{
    private static Complex[,] RhoAfterRy(double theta, NoiseChannelKind kind, double p)
    {
        var c = new CircuitBuilder(1).RY(0, Angle.Parameter(0)).Build();
        var noise = new NoiseModel([new NoiseRule(kind, p, [GateKind.RY])]);
        return StateVectorSimulator.RunDensity(c, noise, [], [theta]);
    }

    [Fact]
    public void SingleQubitChannelsMatchNielsenChuangFormulas()
    {
        double th = 1.1, p = 0.23;
        // Noise-free ρ after RY(θ)|0⟩: a = cos²(θ/2), c = sin²(θ/2), b = cos(θ/2)sin(θ/2) (real).
        double a = Math.Pow(Math.Cos(th / 2), 2), cc = Math.Pow(Math.Sin(th / 2), 2), b = Math.Cos(th / 2) * Math.Sin(th / 2);

        var dep = RhoAfterRy(th, NoiseChannelKind.Depolarizing, p);     // N&C eq. 8.100: (1−p)ρ + p I/2
        Assert.Equal((1 - p) * a + p / 2, dep[0, 0].Real, 14);
        Assert.Equal((1 - p) * cc + p / 2, dep[1, 1].Real, 14);
        Assert.Equal((1 - p) * b, dep[0, 1].Real, 14);

        var ad = RhoAfterRy(th, NoiseChannelKind.AmplitudeDamping, p); // N&C eq. 8.108: [[a + γc, √(1−γ) b], [·, (1−γ)c]]
        Assert.Equal(a + p * cc, ad[0, 0].Real, 14);
        Assert.Equal((1 - p) * cc, ad[1, 1].Real, 14);
        Assert.Equal(Math.Sqrt(1 - p) * b, ad[0, 1].Real, 14);

        var pd = RhoAfterRy(th, NoiseChannelKind.PhaseDamping, p);     // N&C eq. 8.129: off-diagonals × √(1−λ)
        Assert.Equal(a, pd[0, 0].Real, 14);
        Assert.Equal(cc, pd[1, 1].Real, 14);
        Assert.Equal(Math.Sqrt(1 - p) * b, pd[0, 1].Real, 14);
        Assert.Equal(Math.Sqrt(1 - p) * b, pd[1, 0].Real, 14);

        var bf = RhoAfterRy(th, NoiseChannelKind.BitFlip, p);          // N&C §8.3.3: (1−p)ρ + p XρX
        Assert.Equal((1 - p) * a + p * cc, bf[0, 0].Real, 14);
        Assert.Equal(b, bf[0, 1].Real, 14);

        var pf = RhoAfterRy(th, NoiseChannelKind.PhaseFlip, p);        // N&C §8.3.3: (1−p)ρ + p ZρZ
        Assert.Equal(a, pf[0, 0].Real, 14);
        Assert.Equal((1 - 2 * p) * b, pf[0, 1].Real, 14);
    }

    [Fact]
    public void TwoQubitDepolarisingOnBellState()
    {
        // (1−p)ρ + p I/4 (two-qubit eq. 8.100) applied after the CNOT of the Bell circuit.
        double p = 0.3;
        var c = new CircuitBuilder(2).H(0).CNOT(0, 1).Build();
        var rho = StateVectorSimulator.RunDensity(c, new NoiseModel([new NoiseRule(NoiseChannelKind.Depolarizing2, p)]), [], []);
        Assert.Equal((1 - p) * 0.5 + p / 4, rho[0, 0].Real, 14);
        Assert.Equal(p / 4, rho[1, 1].Real, 14);
        Assert.Equal((1 - p) * 0.5, rho[0, 3].Real, 14);
        Assert.Equal(0, rho[0, 1].Magnitude, 14);
    }

    [Fact]
    public void NoisyDensityMatricesStayPhysical()
    {
        var rng = RandomStream.FromRoot(31, "physical");
        var model = new NoiseModel([
            new NoiseRule(NoiseChannelKind.Depolarizing, 0.05, NoiseRule.SingleQubitGates),
            new NoiseRule(NoiseChannelKind.Depolarizing2, 0.08),
            new NoiseRule(NoiseChannelKind.AmplitudeDamping, 0.1),
            new NoiseRule(NoiseChannelKind.PhaseDamping, 0.07, [GateKind.RX, GateKind.CNOT]),
            new NoiseRule(NoiseChannelKind.BitFlip, 0.02),
            new NoiseRule(NoiseChannelKind.PhaseFlip, 0.03),
        ]);
        for (int trial = 0; trial < 6; trial++)
        {
            int n = 1 + trial % 4;
            var c = TestCircuits.Random(n, 20, rng, 2, 3);
            var rho = StateVectorSimulator.RunDensity(c, model, TestCircuits.Uniform(rng, 2), TestCircuits.Uniform(rng, 3));
            var m = Matrix<Complex>.Build.DenseOfArray(rho);
            Assert.True((m - m.ConjugateTranspose()).FrobeniusNorm() < 1e-13, "Hermitian");
            Assert.Equal(1.0, m.Trace().Real, 12);
            // Positive semidefinite: eigenvalues of the Hermitian matrix (MathNet.Numerics EVD) ≥ −1e−12.
            var eig = m.Evd(Symmetricity.Hermitian).EigenValues;
            Assert.True(eig.All(e => e.Real > -1e-12), $"min eigenvalue {eig.Min(e => e.Real)}");
        }
    }

    [Fact]
    public void DensityMatrixWithoutNoiseEqualsPureState()
    {
        var rng = RandomStream.FromRoot(32, "pure");
        var c = TestCircuits.Random(3, 25, rng, 2, 3);
        var x = TestCircuits.Uniform(rng, 2); var w = TestCircuits.Uniform(rng, 3);
        var psi = DenseReference.State(c, x, w);
        var rho = StateVectorSimulator.RunDensity(c, NoiseModel.None, x, w);
        for (int r = 0; r < 8; r++)
            for (int col = 0; col < 8; col++)
                Assert.True((rho[r, col] - psi[r] * Complex.Conjugate(psi[col])).Magnitude < 1e-12); // ρ = |ψ⟩⟨ψ| (MathNet reference)
        var obs = new[] { Observable.Parse("X0Y1 + 0.3*Z2"), Observable.ZOn(1) };
        var e1 = new double[2]; var e2 = new double[2];
        ExpectationEvaluatorFactory.Create(c, obs).Forward(x, w, 1, false, e1);
        ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Mode = SimulationMode.DensityMatrix, Gradient = GradientMethod.ParameterShift }).Forward(x, w, 1, false, e2);
        Assert.Equal(e1[0], e2[0], 12);
        Assert.Equal(e1[1], e2[1], 12);
    }

    [Fact]
    public void ReadoutErrorFollowsConfusionFormula()
    {
        // ⟨Z⟩_read = P0(1 − 2·p01) − P1(1 − 2·p10) (hand-worked from the confusion matrix).
        double th = 0.8, p01 = 0.05, p10 = 0.12;
        var c = new CircuitBuilder(1).RY(0, Angle.Parameter(0)).Build();
        var noise = new NoiseModel([], ReadoutError.Uniform(1, p01, p10));
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)], new SimulationOptions { Mode = SimulationMode.DensityMatrix, Noise = noise });
        var o = new double[1];
        ev.Forward([], [th], 1, false, o);
        double p0 = Math.Pow(Math.Cos(th / 2), 2), p1 = 1 - p0;
        Assert.Equal(p0 * (1 - 2 * p01) - p1 * (1 - 2 * p10), o[0], 13);
    }

    [Fact]
    public void ShotEstimatesAreUnbiased()
    {
        var c = new CircuitBuilder(2).RY(0, Angle.Parameter(0)).RX(1, Angle.Parameter(1)).CNOT(0, 1).Build();
        var obs = new[] { Observable.ZOn(0), Observable.Parse("X0X1"), Observable.Parse("Y1") };
        double[] w = [0.7, -1.2];
        var exact = new double[3];
        ExpectationEvaluatorFactory.Create(c, obs).Forward([], w, 1, false, exact);
        int shots = 300, rows = 50;
        var ev = ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Mode = SimulationMode.Shots, Shots = shots, Seed = 17 });
        var o = new double[rows * 3];
        ev.Forward([], w, rows, false, o);
        for (int k = 0; k < 3; k++)
        {
            double mean = Enumerable.Range(0, rows).Average(r => o[r * 3 + k]);
            double se = Math.Sqrt((1 - exact[k] * exact[k]) / (shots * rows)); // binomial standard error of a ±1 mean
            Assert.True(Math.Abs(mean - exact[k]) < 4 * se + 1e-12, $"output {k}: {mean} vs {exact[k]} (se {se})");
        }
        // Z0 and Y1 share one setting, X0X1 needs another: 2 executions per row.
        Assert.Equal(2L * rows, ev.Counters.CircuitExecutions);
        Assert.Equal(2L * rows * shots, ev.Counters.Shots);
    }

    [Fact]
    public void ShotsAreSeededAndCheckpointable()
    {
        var c = new CircuitBuilder(1).RY(0, 0.9).Build();
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)], new SimulationOptions { Mode = SimulationMode.Shots, Shots = 100, Seed = 9 });
        var a = new double[1]; var b = new double[1]; var d = new double[1];
        var state = ev.GetState();
        ev.Forward([], [], 1, false, a);
        ev.Forward([], [], 1, false, b);
        Assert.NotEqual(a[0], b[0]);          // a fresh stream per call
        ev.SetState(state);
        ev.Forward([], [], 1, false, d);
        Assert.Equal(a[0], d[0]);             // restored state replays exactly
    }

    [Fact]
    public void TrajectoriesConvergeToDensityMatrix()
    {
        var c = new CircuitBuilder(2).H(0).RY(1, Angle.Parameter(0)).CNOT(0, 1).RX(0, Angle.Parameter(1)).CZ(0, 1).Build();
        var model = new NoiseModel([
            new NoiseRule(NoiseChannelKind.AmplitudeDamping, 0.15),
            new NoiseRule(NoiseChannelKind.Depolarizing2, 0.2),
            new NoiseRule(NoiseChannelKind.PhaseDamping, 0.1, [GateKind.H]),
        ], ReadoutError.Uniform(2, 0.02, 0.04));
        var obs = new[] { Observable.ZOn(0), Observable.Parse("Z0Z1"), Observable.Parse("X0") };
        double[] w = [0.6, 1.3];
        var dm = new double[3];
        ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Mode = SimulationMode.DensityMatrix, Noise = model }).Forward([], w, 1, false, dm);
        int rows = 60;
        var ev = ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Mode = SimulationMode.Trajectories, Noise = model, Trajectories = 40, Seed = 4 });
        var o = new double[rows * 3];
        ev.Forward([], w, rows, false, o);
        for (int k = 0; k < 3; k++)
        {
            var vals = Enumerable.Range(0, rows).Select(r => o[r * 3 + k]).ToArray();
            double mean = vals.Average();
            double sd = Math.Sqrt(vals.Sum(v => (v - mean) * (v - mean)) / (rows - 1));
            double se = sd / Math.Sqrt(rows); // standard error of the mean over independent rows
            Assert.True(Math.Abs(mean - dm[k]) < 4 * se + 1e-9, $"output {k}: {mean} vs {dm[k]} (se {se})");
        }
    }

    [Fact]
    public void NoiseScheduleFollowsProgress()
    {
        var sched = StrengthSchedule.LinearDrift(0.0, 0.4);
        Assert.Equal(0.2, sched.ValueAt(0.5), 15);
        var step = StrengthSchedule.Step(0.1, 0.3, 0.5);
        Assert.Equal(0.1, step.ValueAt(0.49));
        Assert.Equal(0.3, step.ValueAt(0.5));
        var model = new NoiseModel([new NoiseRule(NoiseChannelKind.Depolarizing, sched)]);
        Assert.Equal(0.2, model.At(0.5).Rules[0].Strength.ValueAt(0), 15);
        var c = new CircuitBuilder(1).RY(0, 0.7).Build();
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)], new SimulationOptions { Mode = SimulationMode.DensityMatrix, Noise = model });
        var o = new double[1];
        ev.NoiseProgress = 0.5;
        ev.Forward([], [], 1, false, o);
        Assert.Equal((1 - 0.2) * Math.Cos(0.7), o[0], 13); // depolarising scales ⟨Z⟩ by (1−p) (N&C eq. 8.100)
        Assert.Throws<ArgumentOutOfRangeException>(() => ev.NoiseProgress = 1.5);
    }

    [Fact]
    public void AdjointWithShotsOrNoiseIsRejected()
    {
        var c = new CircuitBuilder(1).RY(0, Angle.Parameter(0)).Build();
        var ex = Assert.Throws<ArgumentException>(() => ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)],
            new SimulationOptions { Mode = SimulationMode.Shots, Shots = 10, Gradient = GradientMethod.Adjoint }));
        Assert.Contains("ParameterShift", ex.Message);
        ex = Assert.Throws<ArgumentException>(() => ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)],
            new SimulationOptions { Mode = SimulationMode.DensityMatrix, Noise = NoiseModel.Uniform(NoiseChannelKind.BitFlip, 0.1), Gradient = GradientMethod.Adjoint }));
        Assert.Contains("ParameterShift", ex.Message);
    }

    [Fact]
    public void ParameterShiftUnderNoiseMatchesFiniteDifferences()
    {
        var c = new CircuitBuilder(2).RY(0, Angle.Parameter(0)).CRX(0, 1, Angle.Parameter(1)).RZ(1, Angle.Input(0, 0.8)).H(1).Build();
        var model = new NoiseModel([new NoiseRule(NoiseChannelKind.AmplitudeDamping, 0.1), new NoiseRule(NoiseChannelKind.Depolarizing2, 0.05)]);
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.Parse("Z1 + X1")], new SimulationOptions { Mode = SimulationMode.DensityMatrix, Noise = model });
        double[] w = [0.5, 1.2], x = [0.3];
        var gp = new double[2]; var gi = new double[1];
        ev.Backward(x, w, 1, false, [1.0], gp, gi);
        double L(double[] xx, double[] ww) { var o = new double[1]; ev.Forward(xx, ww, 1, false, o); return o[0]; }
        double h = 1e-5;
        // Channels here do not depend on θ, so the shift rule stays exact under noise (Schuld et al. 2019); checked by central differences.
        Assert.Equal((L(x, [w[0] + h, w[1]]) - L(x, [w[0] - h, w[1]])) / (2 * h), gp[0], 6);
        Assert.Equal((L(x, [w[0], w[1] + h]) - L(x, [w[0], w[1] - h])) / (2 * h), gp[1], 6);
        Assert.Equal((L([x[0] + h], w) - L([x[0] - h], w)) / (2 * h), gi[0], 6);
    }
}
