using HybridRL.Quantum.Ansatz;
using HybridRL.Quantum.Encodings;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Simulation;

namespace HybridRL.Quantum.Tests;

public class AllocationTests
{
    [Fact]
    public void NoAllocationPerRowOnTheHotPath()
    {
        // Per-call buffers are reused; a 64-row call must not allocate more than a 1-row call (plus slack for
        // the per-call closure), i.e. nothing is allocated per row or per gate (single thread).
        var spec = new LayeredCircuitSpec { Qubits = 5, Layers = 3, Encoding = EncodingKind.ReUploading, Entangler = EntanglerPattern.Ring };
        var c = CircuitTemplate.Build(spec, 5);
        var ev = ExpectationEvaluatorFactory.Create(c, Observable.ZOnEach(5));
        long Measure(int batch)
        {
            var x = new double[batch * 5]; var w = new double[c.ParameterCount];
            for (int i = 0; i < x.Length; i++) x[i] = 0.1 * i;
            var o = new double[batch * 5]; var g = new double[batch * 5]; var gp = new double[w.Length]; var gi = new double[x.Length];
            Array.Fill(g, 1.0);
            ev.Forward(x, w, batch, false, o); ev.Backward(x, w, batch, false, g, gp, gi); // grow buffers
            long before = GC.GetAllocatedBytesForCurrentThread();
            ev.Forward(x, w, batch, false, o);
            ev.Backward(x, w, batch, false, g, gp, gi);
            return GC.GetAllocatedBytesForCurrentThread() - before;
        }
        for (int warm = 0; warm < 3; warm++) { Measure(1); Measure(64); } // let tiered compilation settle
        long one = Measure(1), many = Measure(64);
        Assert.True(many <= one + 512, $"1 row: {one} bytes, 64 rows: {many} bytes");
    }

    [Fact]
    public void TrajectoriesWithShotsCountEveryShot()
    {
        var c = new Circuits.CircuitBuilder(1).RY(0, 0.4).Build();
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0), Observable.Parse("X0")], new SimulationOptions
        {
            Mode = SimulationMode.Trajectories, Shots = 50, Noise = Noise.NoiseModel.Uniform(Noise.NoiseChannelKind.PhaseFlip, 0.1),
        });
        var o = new double[2];
        ev.Forward([], [], 1, false, o);
        Assert.Equal(2, ev.Counters.CircuitExecutions); // Z and X settings
        Assert.Equal(100, ev.Counters.Shots);
        Assert.InRange(o[0], -1, 1);
    }
}
