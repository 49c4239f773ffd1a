using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;
using HybridRL.Quantum.Simulation;

namespace HybridRL.Quantum.Tests;

public class ValidationTests
{
    [Fact]
    public void QubitIndexOutOfRangeNamesTheIndex()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new CircuitBuilder(3).CNOT(0, 5));
        Assert.Contains("qubit index 5 out of range", ex.Message);
        Assert.Throws<ArgumentException>(() => new CircuitBuilder(3).CNOT(1, 1));
    }

    [Fact]
    public void NaNAnglesAreRejected()
    {
        Assert.Throws<ArgumentException>(() => new CircuitBuilder(1).RX(0, double.NaN));
        var c = new CircuitBuilder(1).RX(0, Angle.Parameter(0)).RY(0, Angle.Input(0)).Build();
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)]);
        var o = new double[1];
        var ex = Assert.Throws<ArgumentException>(() => ev.Forward([0.1], [double.NaN], 1, false, o));
        Assert.Contains("parameter 0", ex.Message);
        ex = Assert.Throws<ArgumentException>(() => ev.Forward([double.PositiveInfinity], [0.1], 1, false, o));
        Assert.Contains("input feature 0 of batch row 0", ex.Message);
    }

    [Fact]
    public void ThirtyQubitsIsAClearError()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new CircuitBuilder(30));
        Assert.Contains("between 1 and 24", ex.Message);
        var big = new CircuitBuilder(13).H(0).Build();
        var ex2 = Assert.Throws<ArgumentException>(() => ExpectationEvaluatorFactory.Create(big, [Observable.ZOn(0)],
            new SimulationOptions { Mode = SimulationMode.DensityMatrix }));
        Assert.Contains("at most 12 qubits", ex2.Message);
    }

    [Fact]
    public void MismatchedBatchSizesNameTheBuffer()
    {
        var c = new CircuitBuilder(2).RX(0, Angle.Input(1)).RY(1, Angle.Parameter(2)).Build();
        Assert.Equal(2, c.InputCount);
        Assert.Equal(3, c.ParameterCount);
        var ev = ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0), Observable.ZOn(1)]);
        var ex = Assert.Throws<ArgumentException>(() => ev.Forward(new double[5], new double[3], 3, false, new double[6]));
        Assert.Contains("inputs has 5 values but batch 3", ex.Message);
        ex = Assert.Throws<ArgumentException>(() => ev.Forward(new double[6], new double[3], 3, true, new double[6]));
        Assert.Contains("parameters has 3 values", ex.Message);
        ex = Assert.Throws<ArgumentException>(() => ev.Forward(new double[6], new double[3], 3, false, new double[4]));
        Assert.Contains("outputs has 4 slots", ex.Message);
        ex = Assert.Throws<ArgumentException>(() => ev.Backward(new double[6], new double[3], 3, false, new double[6], new double[9], new double[6]));
        Assert.Contains("gradParameters", ex.Message);
        ex = Assert.Throws<ArgumentException>(() => ev.Backward(new double[6], new double[3], 3, false, new double[5], new double[3], new double[6]));
        Assert.Contains("gradOutputs", ex.Message);
    }

    [Fact]
    public void ObservableOnMissingQubitAndBadTextAreErrors()
    {
        var c = new CircuitBuilder(2).H(0).Build();
        var ex = Assert.Throws<ArgumentException>(() => ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(3)]));
        Assert.Contains("qubit 3", ex.Message);
        Assert.Throws<FormatException>(() => Observable.Parse("0.5*Q0"));
        Assert.Throws<FormatException>(() => Observable.Parse("Z0Z0"));
        Assert.Throws<FormatException>(() => Observable.Parse("X"));
    }

    [Fact]
    public void ObservableParsing()
    {
        var o = Observable.Parse("0.5*Z0Z1 + X2 - 0.25 * Y0 + 2e-1*Z0*Z1 + 3");
        Assert.Equal(4, o.Terms.Count); // equal strings merged (0.5 + 0.2 on Z0Z1)
        Assert.Equal(0.7, o.Terms[0].Weight, 15);
        Assert.Equal(0b11UL, o.Terms[0].ZMask);
        Assert.Equal(0b100UL, o.Terms[1].XMask);
        Assert.Equal(-0.25, o.Terms[2].Weight);
        Assert.Equal('Y', o.Terms[2].On(0));
        Assert.Equal(0UL, o.Terms[3].Support);
        Assert.Equal(3, o.Terms[3].Weight);
    }

    [Fact]
    public void ModeOptionMismatchesAreErrors()
    {
        var c = new CircuitBuilder(1).H(0).Build();
        Assert.Throws<ArgumentException>(() => ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)], new SimulationOptions { Mode = SimulationMode.Shots }));
        Assert.Throws<ArgumentException>(() => ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)], new SimulationOptions { Shots = 5 }));
        Assert.Throws<ArgumentException>(() => ExpectationEvaluatorFactory.Create(c, [Observable.ZOn(0)],
            new SimulationOptions { Noise = Noise.NoiseModel.Uniform(Noise.NoiseChannelKind.BitFlip, 0.1) }));
        Assert.Throws<ArgumentOutOfRangeException>(() => Noise.StrengthSchedule.Constant(1.5));
    }
}
