using HybridRL.Quantum.Ansatz;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Encodings;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Simulation;

namespace HybridRL.Quantum.Tests;

public class CircuitDescriptionTests
{
    [Fact]
    public void ResourceCountsOfASmallCircuit()
    {
        // Hand-counted: H0, CNOT01, RY1(w0), CZ12, Rot2(w1,w2,1.0), CRX(0,2; x0): each waits for the previous one, depth 6.
        var c = new CircuitBuilder(3).H(0).CNOT(0, 1).RY(1, Angle.Parameter(0)).CZ(1, 2)
            .Rot(2, Angle.Parameter(1), Angle.Parameter(2), 1.0).CRX(0, 2, Angle.Input(0)).Build();
        var r = c.Resources;
        Assert.Equal(6, r.TotalGates);
        Assert.Equal(3, r.TwoQubitGates);
        Assert.Equal(3, r.SingleQubitGates);
        Assert.Equal(6, r.Depth); // H | CNOT | RY | CZ | Rot | CRX (CRX waits for Rot on qubit 2)
        Assert.Equal(3, r.ParameterCount);
        Assert.Equal(1, r.InputCount);
        Assert.Equal(1, r.GatesByKind[GateKind.CRX]);
        Assert.Equal(4, r.VariableAngleCount);
        // Hardware shift evaluations: RY 2 + Rot's two trainable angles 2·2 + CRX 4 = 10 (rule: 2 per Pauli rotation, 4 per controlled).
        Assert.Equal(10, GradientCost.ShiftEvaluationsPerRow(c));
        Assert.Equal(10, GradientCost.HardwareExecutionsPerGradient(c, [Observable.ZOn(0), Observable.Parse("X1")])); // Z0 and X1 share one setting
        Assert.Equal(20, GradientCost.HardwareExecutionsPerGradient(c, [Observable.ZOn(0), Observable.Parse("X0")])); // Z0 and X0 need two
    }

    [Fact]
    public void TemplateParameterCounts()
    {
        var spec = new LayeredCircuitSpec { Qubits = 4, Layers = 3, RotationAxes = [RotationAxis.Y, RotationAxis.Z], Entangler = EntanglerPattern.Ring };
        var c = CircuitTemplate.Build(spec, 4);
        Assert.Equal(4 * 3 * 2, c.ParameterCount);          // qubits × layers × axes
        Assert.Equal(4 * 3, c.Resources.TwoQubitGates);     // ring of 4 has 4 pairs per layer
        var re = CircuitTemplate.BuildLayout(spec with { Encoding = EncodingKind.ReUploading, TrainableInputScale = true, Entangler = EntanglerPattern.AllToAll, EntanglingGate = EntanglingGate.CZ }, 4);
        Assert.Equal(24 + 12, re.ParameterCount);          // plus one scale per feature per layer
        Assert.Equal(12, re.InputScaleParameters.Count);
        Assert.Equal(6 * 3, re.Circuit.Resources.GatesByKind[GateKind.CZ]);
        var w = re.InitialParameters(Randomness.RandomStream.FromRoot(1, "init"));
        Assert.All(re.InputScaleParameters, p => Assert.Equal(1.0, w[p]));
        var basis = CircuitTemplate.Build(spec with { Encoding = EncodingKind.Basis }, 1);
        Assert.Equal(1, basis.InputCount);
        Assert.Throws<ArgumentException>(() => CircuitTemplate.Build(spec with { Encoding = EncodingKind.Basis }, 3));
        var amp = CircuitTemplate.Build(spec with { Encoding = EncodingKind.Amplitude }, 10);
        Assert.Equal(10, amp.InputCount);
        var zz = CircuitTemplate.Build(spec with { Encoding = EncodingKind.ProductZZ, Layers = 1 }, 3);
        Assert.Equal(6, zz.Resources.GatesByKind[GateKind.RZ] - 4); // 3 features + 3 pairs = 6 RZ from encoding, 4 from the layer
    }

    [Fact]
    public void OpenQasmExport()
    {
        var c = new CircuitBuilder(2).H(0).CNOT(0, 1).RY(1, Angle.Parameter(0)).RX(0, Angle.Input(0, 2, InputSquash.Arctan))
            .Rot(1, 0.1, Angle.Parameter(1), 0.3).CRZ(1, 0, Angle.InputProduct(0, 1, 0.5)).Sdg(0).Build();
        string named = OpenQasmExporter.Export(c, null, ["speed", "angle"]);
        // OpenQASM 3 (open standard): header, stdgates names, typed inputs.
        Assert.StartsWith("OPENQASM 3.0;\ninclude \"stdgates.inc\";\n", named);
        Assert.Contains("input float[64] speed;", named);
        Assert.Contains("input float[64] w_1;", named);
        Assert.Contains("qubit[2] q;", named);
        Assert.Contains("cx q[0], q[1];", named);
        Assert.Contains("ry(w_0) q[1];", named);
        Assert.Contains("rx(2 * arctan(speed)) q[0];", named);
        Assert.Contains("rz(0.1) q[1];\nry(w_1) q[1];\nrz(0.3) q[1];", named);
        Assert.Contains("crz(0.5 * speed * angle) q[1], q[0];", named);
        Assert.Contains("sdg q[0];", named);
        Assert.EndsWith("c = measure q;\n", named);
        string bound = OpenQasmExporter.Export(c, [0.25, -1.5]);
        Assert.Contains("ry(0.25) q[1];", bound);
        Assert.DoesNotContain("w_0", bound);
        Assert.Contains("input float[64] x_0;", bound);
        Assert.Throws<ArgumentException>(() => OpenQasmExporter.Export(c, [1.0]));
        Assert.Throws<ArgumentException>(() => OpenQasmExporter.Export(c, null, ["1bad", "ok"]));
    }

    [Fact]
    public void CountersAreSettableAndCountEveryEvaluation()
    {
        var c = new CircuitBuilder(2).RY(0, Angle.Parameter(0)).CRY(0, 1, Angle.Parameter(1)).Build();
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(1)], new SimulationOptions { Gradient = GradientMethod.ParameterShift });
        ev.Backward([], [0.1, 0.2], 3, false, [1, 1, 1], new double[2], []);
        Assert.Equal(3L * (2 + 4), ev.Counters.CircuitExecutions); // every shifted evaluation counted
        Assert.Equal(3L * 6, ev.Counters.HardwareExecutions);
        ev.Counters.Set(5, 6, 7);
        Assert.Equal(5, ev.Counters.CircuitExecutions);
        var adj = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(1)]);
        adj.Backward([], [0.1, 0.2], 3, false, [1, 1, 1], new double[2], []);
        Assert.Equal(3L, adj.Counters.CircuitExecutions);           // one adjoint sweep per row
        Assert.Equal(3L * 6, adj.Counters.HardwareExecutions);      // priced as parameter shift for the ledger
        adj.Counters.Reset();
        Assert.Equal(0, adj.Counters.HardwareExecutions);
    }
}
