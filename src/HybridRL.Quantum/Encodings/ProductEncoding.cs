using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Encodings;

/// <summary>
/// Second-order product encoding: H on every qubit, RZ(s·x_i) on qubit i, then for every feature pair
/// i &lt; j the two-qubit rotation exp(−i·s²·x_i·x_j·Z_iZ_j/2), written as CNOT(i,j)·RZ_j(s²·x_i·x_j)·CNOT(i,j).
/// </summary>
public static class ProductEncoding
{
    public static void Append(CircuitBuilder b, int inputCount, double scale = 1.0)
    {
        ArgumentNullException.ThrowIfNull(b);
        if (inputCount < 1) throw new ArgumentOutOfRangeException(nameof(inputCount), inputCount, "product encoding needs at least one input feature");
        if (inputCount > b.Qubits)
            throw new ArgumentException($"product encoding puts feature i on qubit i: {inputCount} features need at least {inputCount} qubits, the circuit has {b.Qubits}", nameof(inputCount));
        for (int q = 0; q < b.Qubits; q++) b.H(q);
        for (int i = 0; i < inputCount; i++) b.RZ(i, Angle.Input(i, scale));
        for (int i = 0; i < inputCount; i++)
            for (int j = i + 1; j < inputCount; j++)
            {
                b.CNOT(i, j);
                b.RZ(j, Angle.InputProduct(i, j, scale * scale));
                b.CNOT(i, j);
            }
        b.ReserveInputs(inputCount);
    }
}
