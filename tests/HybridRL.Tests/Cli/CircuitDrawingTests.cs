using HybridRL.Quantum.Circuits;

namespace HybridRL.Tests.Cli;

/// <summary>The text layout of <see cref="CircuitDrawing"/>, checked against a hand-drawn picture.</summary>
public sealed class CircuitDrawingTests
{
    [Fact]
    public void Gates_go_into_time_columns_and_two_qubit_gates_block_the_wires_they_cross()
    {
        var c = new CircuitBuilder(3, 0, 1).H(0).CNOT(0, 2).RY(1, Angle.Parameter(0)).Build();
        // Hand-drawn: H in column 0; the CNOT crosses q1, so it takes column 1 on all three wires; RY on q1 must
        // then wait for column 2. Column widths 1, 3, 6; cells centred, two '-' between columns.
        string expected =
            "q0: -H---*-----------\n" +
            "q1: -----|---RY(w0)--\n" +
            "q2: ----(+)----------\n";
        Assert.Equal(expected, CircuitDrawing.Draw(c));
    }

    [Fact]
    public void Labels_name_parameters_inputs_and_constants()
    {
        Assert.Equal("RX(w3*atan(x1))", CircuitDrawing.Label(new Operation(GateKind.RX, [0], [Angle.ScaledInput(1, 3, InputSquash.Arctan)])));
        Assert.Equal("RZ(0.5*x0)", CircuitDrawing.Label(new Operation(GateKind.RZ, [0], [Angle.Input(0, 0.5)])));
        Assert.Equal("RY(x2*x3)", CircuitDrawing.Label(new Operation(GateKind.CRY, [0, 1], [Angle.InputProduct(2, 3)])));
        Assert.Equal("P(0.25)", CircuitDrawing.Label(new Operation(GateKind.Phase, [0], [Angle.Constant(0.25)])));
    }
}
