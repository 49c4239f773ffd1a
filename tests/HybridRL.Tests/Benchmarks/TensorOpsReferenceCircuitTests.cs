using HybridRL.Benchmarks;
using HybridRL.Native;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Randomness;
using HybridRL.Quantum.Simulation;

namespace HybridRL.Tests.Benchmarks;

/// <summary>
/// The TorchSharp tensor-ops circuit (complex tensors + autograd) and the managed engine (state vector +
/// adjoint) are written independently; their expectations and gradients must agree.
/// </summary>
public class TensorOpsReferenceCircuitTests
{
    private static void Compare(Circuit c, IReadOnlyList<Observable> obs, int batch, ulong seed)
    {
        TorchRuntime.EnsureLoaded();
        var rng = RandomStream.FromRoot(seed, "reference-check");
        var x = Enumerable.Range(0, batch * c.InputCount).Select(_ => 2 * rng.NextDouble() - 1).ToArray();
        var w = Enumerable.Range(0, c.ParameterCount).Select(_ => 3 * (2 * rng.NextDouble() - 1)).ToArray();
        var g = Enumerable.Range(0, batch * obs.Count).Select(_ => 2 * rng.NextDouble() - 1).ToArray();
        var ev = ExpectationEvaluatorFactory.Create(c, obs);
        var o = new double[batch * obs.Count];
        var gp = new double[w.Length]; var gi = new double[x.Length];
        ev.Forward(x, w, batch, false, o);
        ev.Backward(x, w, batch, false, g, gp, gi);
        var (ro, rgp, rgi) = new TensorOpsReferenceCircuit(c, obs).Run(x, w, batch, g);
        // Independent implementations (TorchSharp autograd vs adjoint method, Jones & Gacon 2020): agree to rounding.
        for (int i = 0; i < o.Length; i++) Assert.True(Math.Abs(o[i] - ro[i]) < 1e-12, $"output {i}: {o[i]} vs {ro[i]}");
        for (int i = 0; i < gp.Length; i++) Assert.True(Math.Abs(gp[i] - rgp[i]) < 1e-10, $"dparam {i}: {gp[i]} vs {rgp[i]}");
        for (int i = 0; i < gi.Length; i++) Assert.True(Math.Abs(gi[i] - rgi[i]) < 1e-10, $"dinput {i}: {gi[i]} vs {rgi[i]}");
    }

    [Fact]
    public void BenchmarkCircuitAgreesWithEngine() =>
        Compare(SimulatorBenchmark.BenchmarkCircuit(), Observable.ZOnEach(SimulatorBenchmark.Qubits), 5, 1);

    [Fact]
    public void MixedGateCircuitAgreesWithEngine()
    {
        // Invented test circuit covering every gate kind the reference supports and every angle kind but input maps.
        var c = new CircuitBuilder(4, inputCount: 3)
            .H(0).X(1).Y(2).Z(3).S(0).Sdg(1).T(2).Tdg(3)
            .RX(0, Angle.Input(0, 0.8)).RY(1, Angle.Input(1, 1.0, InputSquash.Arctan)).RZ(2, Angle.ScaledInput(2, 3))
            .Phase(3, Angle.Parameter(0)).Rot(0, Angle.Parameter(1), 0.4, Angle.Parameter(2))
            .CNOT(0, 1).CZ(1, 2).SWAP(2, 3).CNOT(3, 0)
            .RY(2, Angle.InputProduct(0, 2, 0.6)).RX(1, Angle.Parameter(4)).H(3)
            .Build();
        Compare(c, [Observable.ZOn(0), Observable.Parse("0.5*Z1Z2 - Z3 + 0.25"), Observable.ZProduct(0, 3)], 4, 2);
    }
}
