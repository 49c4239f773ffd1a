using System.Globalization;
using System.Text;

namespace HybridRL.Quantum.Circuits;

/// <summary>
/// A plain-text picture of a circuit: one line per qubit (qubit 0 on top), gates left to right in
/// the order they are applied. Each gate goes into the first column after the last gate on every
/// qubit it touches or crosses (a two-qubit gate also blocks the wires between its two qubits, where
/// a '|' marks the crossing), so gates that share a column act at the same time step.
/// Symbols: '*' control, '(+)' the target of a CNOT, 'x' both ends of a SWAP, CZ as '*' on both qubits;
/// rotations show their angle: w3 = trainable parameter 3, x0 = input feature 0 (times its scale),
/// enc0_1 = angle 1 of input map 0, numbers are constants.
/// </summary>
public static class CircuitDrawing
{
    /// <summary>Draws <paramref name="circuit"/>; lines end with '\n'.</summary>
    public static string Draw(Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        int n = circuit.Qubits;
        // Column of every operation (first free column on every wire the gate touches or crosses).
        var next = new int[n];
        var columnOf = new int[circuit.Operations.Count];
        int columns = 0;
        for (int i = 0; i < circuit.Operations.Count; i++)
        {
            var op = circuit.Operations[i];
            (int lo, int hi) = Span(op);
            int col = 0;
            for (int q = lo; q <= hi; q++) col = Math.Max(col, next[q]);
            for (int q = lo; q <= hi; q++) next[q] = col + 1;
            columnOf[i] = col;
            columns = Math.Max(columns, col + 1);
        }

        var cells = new string?[n, columns];
        for (int i = 0; i < circuit.Operations.Count; i++)
        {
            var op = circuit.Operations[i];
            int col = columnOf[i];
            (int lo, int hi) = Span(op);
            if (op.Qubits.Count == 1)
            {
                cells[op.Qubit0, col] = Label(op);
                continue;
            }
            for (int q = lo + 1; q < hi; q++) cells[q, col] = "|";
            switch (op.Kind)
            {
                case GateKind.CNOT:
                    cells[op.Qubit0, col] = "*";
                    cells[op.Qubit1, col] = "(+)";
                    break;
                case GateKind.CZ:
                    cells[op.Qubit0, col] = "*";
                    cells[op.Qubit1, col] = "*";
                    break;
                case GateKind.SWAP:
                    cells[op.Qubit0, col] = "x";
                    cells[op.Qubit1, col] = "x";
                    break;
                default: // controlled rotations: control first
                    cells[op.Qubit0, col] = "*";
                    cells[op.Qubit1, col] = Label(op);
                    break;
            }
        }

        var width = new int[columns];
        for (int c = 0; c < columns; c++)
        {
            width[c] = 1;
            for (int q = 0; q < n; q++) width[c] = Math.Max(width[c], cells[q, c]?.Length ?? 0);
        }
        int nameWidth = ("q" + (n - 1).ToString(CultureInfo.InvariantCulture)).Length;
        var sb = new StringBuilder();
        for (int q = 0; q < n; q++)
        {
            sb.Append(("q" + q.ToString(CultureInfo.InvariantCulture)).PadRight(nameWidth)).Append(": -");
            for (int c = 0; c < columns; c++)
            {
                string cell = cells[q, c] ?? "";
                int pad = width[c] - cell.Length;
                sb.Append('-', pad / 2).Append(cell).Append('-', pad - pad / 2).Append("--");
            }
            sb.Append('\n');
        }
        return sb.ToString();
    }

    private static (int Lo, int Hi) Span(Operation op) =>
        op.Qubits.Count == 1 ? (op.Qubit0, op.Qubit0) : (Math.Min(op.Qubit0, op.Qubit1), Math.Max(op.Qubit0, op.Qubit1));

    /// <summary>Gate name with its angles, e.g. RY(w3), RX(w0*x1), Rot(w0,w1,w2).</summary>
    public static string Label(Operation op)
    {
        ArgumentNullException.ThrowIfNull(op);
        string name = op.Kind switch
        {
            GateKind.CRX => "RX",
            GateKind.CRY => "RY",
            GateKind.CRZ => "RZ",
            GateKind.Phase => "P",
            _ => op.Kind.ToString(),
        };
        if (op.Angles.Count == 0) return name;
        return name + "(" + string.Join(",", op.Angles.Select(AngleText)) + ")";
    }

    /// <summary>Short text of an angle: w3, x0, 0.5*x0, w4*atan(x1), x0*x1, enc0_1, or a constant.</summary>
    public static string AngleText(Angle a)
    {
        string Num(double v) => v.ToString("0.###", CultureInfo.InvariantCulture);
        switch (a.Kind)
        {
            case AngleKind.Constant: return Num(a.Value);
            case AngleKind.Parameter: return $"w{a.Index}";
            case AngleKind.Input:
            {
                string x = a.Squash == InputSquash.Arctan ? $"atan(x{a.Index})" : $"x{a.Index}";
                if (a.ScaleParameter >= 0) return $"w{a.ScaleParameter}*{x}";
                return a.Value == 1.0 ? x : $"{Num(a.Value)}*{x}";
            }
            case AngleKind.InputProduct: return a.Value == 1.0 ? $"x{a.Index}*x{a.Index2}" : $"{Num(a.Value)}*x{a.Index}*x{a.Index2}";
            case AngleKind.Mapped: return $"enc{a.Index}_{a.Index2}";
            default: return "?";
        }
    }
}
