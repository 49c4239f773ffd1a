using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Encodings;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;

namespace HybridRL.Quantum.Tests;

public class StateVectorTests
{
    [Fact]
    public void RandomCircuitsMatchDenseKroneckerReference()
    {
        var rng = RandomStream.FromRoot(11, "random-circuits");
        for (int trial = 0; trial < 24; trial++)
        {
            int n = 1 + trial % 6;
            var c = TestCircuits.Random(n, 30, rng, 3, 5);
            var x = TestCircuits.Uniform(rng, 3);
            var w = TestCircuits.Uniform(rng, 5, -3, 3);
            var expected = DenseReference.State(c, x, w);
            foreach (bool fuse in new[] { true, false })
            {
                var psi = StateVectorSimulator.Run(c, x, w, fuse);
                for (int j = 0; j < psi.Length; j++)
                    // Reference: MathNet.Numerics dense Kronecker products of N&C textbook matrices.
                    Assert.True((psi[j] - expected[j]).Magnitude < 1e-12, $"trial {trial} n={n} fuse={fuse} amplitude {j}: {psi[j]} vs {expected[j]}");
            }
        }
    }

    [Fact]
    public void PauliExpectationsMatchDenseReference()
    {
        var rng = RandomStream.FromRoot(12, "pauli");
        var c = TestCircuits.Random(4, 40, rng, 2, 4);
        var x = TestCircuits.Uniform(rng, 2);
        var w = TestCircuits.Uniform(rng, 4);
        var psi = DenseReference.State(c, x, w);
        string[] strings = ["ZIII", "IXIZ", "YYII", "XYZI", "ZZZZ", "IIIY"];
        var obs = strings.Select(s => Observable.PauliString(s)).Append(Observable.Parse("0.5*Z0Z1 - 0.25*X2 + 1.5")).ToArray();
        var ev = ExpectationEvaluatorFactory.Create(c, obs);
        var outp = new double[obs.Length];
        ev.Forward(x, w, 1, false, outp);
        for (int k = 0; k < strings.Length; k++)
        {
            double e = (psi.Conjugate() * (DenseReference.PauliMatrix(strings[k]) * psi)).Real;
            Assert.Equal(e, outp[k], 12); // MathNet dense ⟨ψ|P|ψ⟩
        }
        double mixed = 0.5 * (psi.Conjugate() * (DenseReference.PauliMatrix("ZZII") * psi)).Real - 0.25 * (psi.Conjugate() * (DenseReference.PauliMatrix("IIXI") * psi)).Real + 1.5;
        Assert.Equal(mixed, outp[^1], 12);
    }

    [Fact]
    public void BellAndGhzStates()
    {
        double r = 1 / Math.Sqrt(2);
        // N&C §1.3.6: H then CNOT on |00⟩ gives (|00⟩ + |11⟩)/√2.
        var bell = StateVectorSimulator.Run(new CircuitBuilder(2).H(0).CNOT(0, 1).Build(), [], []);
        Assert.Equal(r, bell[0].Real, 14); Assert.Equal(0, bell[1].Magnitude, 14);
        Assert.Equal(0, bell[2].Magnitude, 14); Assert.Equal(r, bell[3].Real, 14);
        // GHZ state (Greenberger, Horne & Zeilinger 1989): extending the §1.3.6 Bell circuit with a second CNOT gives
        // (|000⟩ + |111⟩)/√2; hand-worked: H|0⟩ = (|0⟩+|1⟩)/√2, and each CNOT copies the basis value of its control.
        var ghz = StateVectorSimulator.Run(new CircuitBuilder(3).H(0).CNOT(0, 1).CNOT(1, 2).Build(), [], []);
        for (int j = 0; j < 8; j++) Assert.Equal(j == 0 || j == 7 ? r : 0, ghz[j].Magnitude, 14);
        var ev = ExpectationEvaluatorFactory.Create(new CircuitBuilder(3).H(0).CNOT(0, 1).CNOT(1, 2).Build(),
            [Observable.ZProduct(0, 1, 2), Observable.Parse("X0X1X2"), Observable.ZOn(1)]);
        var o = new double[3];
        ev.Forward([], [], 1, false, o);
        Assert.Equal(0, o[0], 14);   // ⟨ZZZ⟩ = 0 on GHZ (hand-worked: (1 + (−1))/2)
        Assert.Equal(1, o[1], 14);   // ⟨XXX⟩ = 1: GHZ is a +1 eigenstate (hand-worked)
        Assert.Equal(0, o[2], 14);
    }

    [Fact]
    public void RyExpectationIsCosine()
    {
        var c = new CircuitBuilder(1).RY(0, Angle.Parameter(0)).Build();
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)]);
        foreach (double th in new[] { -2.0, 0.0, 0.3, 1.2, Math.PI })
        {
            var o = new double[1];
            ev.Forward([], [th], 1, false, o);
            Assert.Equal(Math.Cos(th), o[0], 14); // ⟨Z⟩ = cos θ after RY(θ)|0⟩ (N&C §4.2 rotation matrices)
        }
    }

    [Fact]
    public void MottonenPreparationReproducesNormalisedVector()
    {
        var rng = RandomStream.FromRoot(13, "mottonen");
        foreach (int features in new[] { 1, 2, 3, 5, 8, 13, 16, 32 })
        {
            int n = Math.Max(1, AmplitudeEncoding.QubitsFor(features));
            var b = new CircuitBuilder(n);
            AmplitudeEncoding.Append(b, features);
            var c = b.Build();
            var v = TestCircuits.Uniform(rng, features, -1, 1);
            if (features > 3) v[1] = 0; // a zero entry
            double norm = Math.Sqrt(v.Sum(a => a * a));
            var psi = StateVectorSimulator.Run(c, v, []);
            for (int j = 0; j < psi.Length; j++)
            {
                double target = j < features ? v[j] / norm : 0; // padded with zeros, normalised (Möttönen et al. 2004)
                Assert.True(Math.Abs(psi[j].Real - target) < 1e-12 && Math.Abs(psi[j].Imaginary) < 1e-12, $"features={features} j={j}: {psi[j]} vs {target}");
            }
            // Gate counts: 2^n − 1 RY and 2^n − 2 CNOT (uniformly controlled rotations, Möttönen et al. 2004).
            Assert.Equal((1 << n) - 1, c.Resources.GatesByKind[GateKind.RY]);
            Assert.Equal((1 << n) - 2, c.Resources.GatesByKind.GetValueOrDefault(GateKind.CNOT));
        }
    }

    [Fact]
    public void AmplitudeEncodingWarnsAndRejectsZeroRows()
    {
        var warnings = new List<string>();
        var b = new CircuitBuilder(3);
        var map = AmplitudeEncoding.Append(b, 8, warnings.Add);
        var c = b.Build();
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)]);
        var o = new double[1];
        ev.Forward([1e-12, 0, 0, 0, 0, 0, 0, 1e-12], [], 1, false, o);
        Assert.Equal(1, map.TinyNormRows);
        Assert.Equal(1, map.MostlyZeroRows);
        Assert.Equal(2, warnings.Count);
        var ex = Assert.Throws<ArgumentException>(() => ev.Forward(new double[8], [], 1, false, o));
        Assert.Contains("all-zero", ex.Message);
        Assert.NotEmpty(AmplitudeEncoding.Inspect([0, 0, 0, 1e-20]));
    }

    [Fact]
    public void BasisEncodingWritesBitString()
    {
        var b = new CircuitBuilder(3);
        BasisEncoding.Append(b);
        var c = b.Build();
        var psi = StateVectorSimulator.Run(c, [5], []);
        Assert.Equal(1, psi[5].Magnitude, 14); // |101⟩, qubit 0 = least significant bit (hand-worked)
        Assert.Throws<ArgumentException>(() => StateVectorSimulator.Run(c, [8], []));
        Assert.Throws<ArgumentException>(() => StateVectorSimulator.Run(c, [1.5], []));
    }

    [Fact]
    public void ResultsIdenticalForOneAndTwoThreads()
    {
        var rng = RandomStream.FromRoot(14, "threads");
        var c = TestCircuits.Random(5, 40, rng, 3, 6);
        var obs = Observable.ZOnEach(5).Append(Observable.Parse("X0Y1")).ToArray();
        int batch = 7;
        var x = TestCircuits.Uniform(rng, batch * 3);
        var w = TestCircuits.Uniform(rng, batch * 6);
        var g = TestCircuits.Uniform(rng, batch * obs.Length);
        foreach (var mode in new[] { SimulationMode.StateVector, SimulationMode.Shots, SimulationMode.Trajectories, SimulationMode.DensityMatrix })
        {
            double[] Run(int threads, out double[] gp, out double[] gi)
            {
                var opt = new SimulationOptions
                {
                    Mode = mode, Threads = threads, Seed = 5,
                    Shots = mode == SimulationMode.Shots ? 200 : 0, Trajectories = 20,
                    Noise = mode is SimulationMode.Trajectories or SimulationMode.DensityMatrix ? Noise.NoiseModel.Uniform(Noise.NoiseChannelKind.AmplitudeDamping, 0.05) : null,
                };
                var ev = ExpectationEvaluatorFactory.Create(c, obs, opt);
                var o = new double[batch * obs.Length];
                ev.Forward(x, w, batch, true, o);
                gp = new double[batch * 6]; gi = new double[batch * 3];
                if (mode is SimulationMode.StateVector or SimulationMode.Shots) ev.Backward(x, w, batch, true, g, gp, gi);
                return o;
            }
            var o1 = Run(1, out var gp1, out var gi1);
            var o2 = Run(2, out var gp2, out var gi2);
            Assert.Equal(o1, o2); // bitwise identical: fixed partitioning, per-row streams
            Assert.Equal(gp1, gp2);
            Assert.Equal(gi1, gi2);
        }
    }

    [Fact]
    public void LargeRegisterThreadedKernelsMatchSingleThread()
    {
        // 15 qubits crosses the threaded-kernel threshold; compare against the 1-thread run bit for bit.
        var rng = RandomStream.FromRoot(15, "large");
        var c = TestCircuits.Random(15, 60, rng, 2, 4);
        var x = TestCircuits.Uniform(rng, 2);
        var w = TestCircuits.Uniform(rng, 4);
        var obs = new[] { Observable.ZOn(3), Observable.Parse("X0Z14"), Observable.ZProduct(1, 7) };
        var o1 = new double[3]; var o2 = new double[3];
        ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Threads = 1 }).Forward(x, w, 1, false, o1);
        ExpectationEvaluatorFactory.Create(c, obs, new SimulationOptions { Threads = 2 }).Forward(x, w, 1, false, o2);
        Assert.Equal(o1, o2);
    }
}
