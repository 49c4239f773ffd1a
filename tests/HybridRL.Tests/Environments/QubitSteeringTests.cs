using System.Numerics;
using HybridRL.Environments;

namespace HybridRL.Tests.Environments;

public class QubitSteeringTests
{
    [Fact]
    public void EvolutionMatchesTheRabiFormula()
    {
        // H(h) = −(σz + h σx)/2 from |0⟩: the closed-form two-level (Rabi) result, e.g. Sakurai, Modern Quantum
        // Mechanics §5.5: P(|1⟩, t) = h²/(1 + h²) · sin²(√(1 + h²) t / 2).
        foreach (double h in new[] { -4.0, 0.7, 4.0 })
            foreach (double t in new[] { 0.05, 0.3, 1.7 })
            {
                var u = QubitSteeringEnvironment.PropagatorFor(h, t);
                Complex a0 = 1, a1 = 0;
                u.Apply(ref a0, ref a1);
                double expected = h * h / (1 + h * h) * Math.Pow(Math.Sin(Math.Sqrt(1 + h * h) * t / 2), 2);
                Assert.Equal(expected, a1.Magnitude * a1.Magnitude, 12);
                Assert.Equal(1.0, a0.Magnitude * a0.Magnitude + a1.Magnitude * a1.Magnitude, 12);   // unitary
            }
    }

    [Fact]
    public void PropagatorMatchesFineStepIntegrationOfSchroedinger()
    {
        // Independent check: 4th-order Runge–Kutta integration of i dψ/dt = H ψ (written here, not in the library).
        double h = 2.5, total = 0.8;
        int n = 4000;
        double dt = total / n;
        Complex[,] H = { { -0.5, -h / 2 }, { -h / 2, 0.5 } };
        Complex[] f(Complex[] psi) => [-Complex.ImaginaryOne * (H[0, 0] * psi[0] + H[0, 1] * psi[1]), -Complex.ImaginaryOne * (H[1, 0] * psi[0] + H[1, 1] * psi[1])];
        Complex[] y = [new Complex(0.6, 0), new Complex(0, 0.8)];
        for (int i = 0; i < n; i++)
        {
            var k1 = f(y);
            var k2 = f([y[0] + dt / 2 * k1[0], y[1] + dt / 2 * k1[1]]);
            var k3 = f([y[0] + dt / 2 * k2[0], y[1] + dt / 2 * k2[1]]);
            var k4 = f([y[0] + dt * k3[0], y[1] + dt * k3[1]]);
            for (int j = 0; j < 2; j++) y[j] += dt / 6 * (k1[j] + 2 * k2[j] + 2 * k3[j] + k4[j]);
        }
        Complex a0 = new(0.6, 0), a1 = new(0, 0.8);
        QubitSteeringEnvironment.PropagatorFor(h, total).Apply(ref a0, ref a1);
        Assert.Equal(y[0].Real, a0.Real, 10);
        Assert.Equal(y[0].Imaginary, a0.Imaginary, 10);
        Assert.Equal(y[1].Real, a1.Real, 10);
        Assert.Equal(y[1].Imaginary, a1.Imaginary, 10);
    }

    [Fact]
    public void FidelityMatchesItsDefinitionAndTheBlochFormula()
    {
        // Definition F = |⟨t|ψ⟩|²; for pure states F = (1 + r_t · r_ψ)/2 (Nielsen & Chuang §8.3 / 9.2.2).
        var (t0, t1) = QubitPropagator.StateFromBloch(0.3, -0.4, Math.Sqrt(1 - 0.25));
        var (p0, p1) = QubitPropagator.StateFromBloch(-0.6, 0.0, 0.8);
        double f = QubitPropagator.Fidelity(t0, t1, p0, p1);
        var overlap = Complex.Conjugate(t0) * p0 + Complex.Conjugate(t1) * p1;
        Assert.Equal(overlap.Magnitude * overlap.Magnitude, f, 12);
        Assert.Equal((1 + (0.3 * -0.6 + 0 + Math.Sqrt(0.75) * 0.8)) / 2, f, 12);
        var (x, y, z) = QubitPropagator.Bloch(p0, p1);
        Assert.Equal(-0.6, x, 12); Assert.Equal(0.0, y, 12); Assert.Equal(0.8, z, 12);
        // Ground state of H(h) points along (h, 0, 1)/√(1 + h²): h = 0 gives |0⟩.
        var (g0, g1) = QubitSteeringEnvironment.GroundState(0);
        Assert.Equal(1.0, g0.Magnitude, 12);
        Assert.Equal(0.0, g1.Magnitude, 12);
    }

    [Fact]
    public void EpisodeEndsAfterSlicesWithFinalFidelityReward()
    {
        var env = (QubitSteeringEnvironment)EnvironmentFactory.Create("qubit-steering", new Dictionary<string, string> { ["slices"] = "4" });
        var obs = new double[3];
        env.Reset(1, obs);
        var (x0, _, z0) = (obs[0], obs[1], obs[2]);
        Assert.Equal(-2 / Math.Sqrt(5), x0, 12);   // ground state of H(−2): Bloch vector (−2, 0, 1)/√5
        Assert.Equal(1 / Math.Sqrt(5), z0, 12);
        double total = 0;
        for (int t = 0; t < 4; t++)
        {
            var r = env.Step(1, obs);
            total += r.Reward;
            Assert.Equal(t == 3, r.Terminal);
            Assert.False(r.Truncated);
        }
        Assert.Equal(env.Fidelity, total, 15);
        Assert.Throws<InvalidOperationException>(() => env.Step(0, obs));
    }

    [Fact]
    public void ShapedRewardsSumToFidelityGain()
    {
        var env = (QubitSteeringEnvironment)EnvironmentFactory.Create("qubit-steering", new Dictionary<string, string> { ["slices"] = "6", ["reward"] = "shaped" });
        var obs = new double[3];
        env.Reset(1, obs);
        double f0 = env.Fidelity, total = 0;
        for (int t = 0; t < 6; t++) total += env.Step(t % 2, obs).Reward;
        Assert.Equal(env.Fidelity - f0, total, 12);
    }

    [Fact]
    public void ExhaustiveOracleBeatsEveryConstantProtocol()
    {
        var p = new Dictionary<string, string> { ["slices"] = "10" };
        var env = (QubitSteeringEnvironment)EnvironmentFactory.Create("qubit-steering", p);
        var (best, protocol) = env.BestProtocol();
        var obs = new double[3];
        env.Reset(0, obs);
        double reward = 0;
        foreach (int a in protocol) reward += env.Step(a, obs).Reward;
        Assert.Equal(best, reward, 12);   // replaying the oracle's protocol reaches its fidelity
        for (int a = 0; a < 2; a++)
        {
            env.Reset(0, obs);
            double f = 0;
            for (int t = 0; t < 10; t++) f += env.Step(a, obs).Reward;
            Assert.True(f <= best + 1e-12);
        }
    }

    [Fact]
    public void ShotNoiseEstimatesAreUnbiasedAndRestorable()
    {
        var p = new Dictionary<string, string> { ["shots"] = "400", ["observe_time"] = "true" };
        var env = EnvironmentFactory.Create("qubit-steering", p);
        Assert.Equal(4, env.ObservationSize);
        var obs = new double[4];
        double sum = 0;
        int n = 200;
        for (int i = 0; i < n; i++) { env.Reset((ulong)i, obs); sum += obs[0]; }
        // Mean of n·400 ±1 outcomes: standard error ≤ 1/√(80000) ≈ 0.0035; allow 5 standard errors (common practice).
        Assert.InRange(sum / n, -2 / Math.Sqrt(5) - 0.018, -2 / Math.Sqrt(5) + 0.018);
        Assert.All(obs[..3], v => Assert.InRange(v, -1, 1));
        TrajectoryAssert.RestoreReproduces(env, 3, t => t % 2, 5, 30, () => EnvironmentFactory.Create("qubit-steering", p));
    }
}
