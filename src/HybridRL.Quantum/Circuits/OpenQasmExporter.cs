using System.Globalization;
using System.Text;

namespace HybridRL.Quantum.Circuits;

/// <summary>
/// Writes a circuit as an OpenQASM 3 program (stdgates.inc names). Parameters are written as bound numbers
/// when given, otherwise as named inputs w_0, w_1, …; input features are named inputs (names given or x_0, …);
/// angles of input maps (amplitude or basis encoding) become named inputs computed classically beforehand.
/// Rot is written as rz·ry·rz. Qubit q of the circuit is q[q]; measurement into c[q] ends the program.
/// </summary>
public static class OpenQasmExporter
{
    public static string Export(Circuit circuit, IReadOnlyList<double>? boundParameters = null, IReadOnlyList<string>? inputNames = null)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        if (boundParameters != null && boundParameters.Count != circuit.ParameterCount)
            throw new ArgumentException($"bound parameters has {boundParameters.Count} values, the circuit has {circuit.ParameterCount} parameters", nameof(boundParameters));
        if (boundParameters != null)
            for (int i = 0; i < boundParameters.Count; i++)
                if (!double.IsFinite(boundParameters[i])) throw new ArgumentException($"bound parameter {i} is {boundParameters[i]}", nameof(boundParameters));
        if (inputNames != null && inputNames.Count != circuit.InputCount)
            throw new ArgumentException($"input names has {inputNames.Count} entries, the circuit has {circuit.InputCount} inputs", nameof(inputNames));
        var names = inputNames?.ToArray() ?? Enumerable.Range(0, circuit.InputCount).Select(i => $"x_{i}").ToArray();
        foreach (var nm in names)
            if (string.IsNullOrEmpty(nm) || !(char.IsLetter(nm[0]) || nm[0] == '_') || !nm.All(ch => char.IsLetterOrDigit(ch) || ch == '_'))
                throw new ArgumentException($"input name '{nm}' is not a valid OpenQASM identifier", nameof(inputNames));
        if (names.Distinct().Count() != names.Length) throw new ArgumentException("input names must be distinct", nameof(inputNames));

        var sb = new StringBuilder();
        sb.Append("OPENQASM 3.0;\n");
        sb.Append("include \"stdgates.inc\";\n");
        foreach (var nm in names) sb.Append("input float[64] ").Append(nm).Append(";\n");
        if (boundParameters == null)
            for (int p = 0; p < circuit.ParameterCount; p++) sb.Append("input float[64] w_").Append(p.ToString(CultureInfo.InvariantCulture)).Append(";\n");
        for (int m = 0; m < circuit.InputMaps.Count; m++)
        {
            var map = circuit.InputMaps[m];
            sb.Append("// ").Append(map.Name).Append(" encoding: angles computed classically from the input row\n");
            for (int k = 0; k < map.AngleCount; k++) sb.Append("input float[64] ").Append(MapName(m, k)).Append(";\n");
        }
        sb.Append("qubit[").Append(circuit.Qubits.ToString(CultureInfo.InvariantCulture)).Append("] q;\n");
        sb.Append("bit[").Append(circuit.Qubits.ToString(CultureInfo.InvariantCulture)).Append("] c;\n");
        foreach (var op in circuit.Operations)
        {
            string qs = string.Join(", ", op.Qubits.Select(q => $"q[{q}]"));
            if (op.Kind == GateKind.Rot)
            {
                sb.Append("rz(").Append(Expr(op.Angles[0], boundParameters, names)).Append(") ").Append(qs).Append(";\n");
                sb.Append("ry(").Append(Expr(op.Angles[1], boundParameters, names)).Append(") ").Append(qs).Append(";\n");
                sb.Append("rz(").Append(Expr(op.Angles[2], boundParameters, names)).Append(") ").Append(qs).Append(";\n");
                continue;
            }
            sb.Append(GateInfo.QasmName(op.Kind));
            if (op.Angles.Count > 0) sb.Append('(').Append(Expr(op.Angles[0], boundParameters, names)).Append(')');
            sb.Append(' ').Append(qs).Append(";\n");
        }
        sb.Append("c = measure q;\n");
        return sb.ToString();
    }

    private static string MapName(int map, int k) => $"enc{map}_{k}";

    private static string Num(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    private static string Expr(Angle a, IReadOnlyList<double>? w, string[] names)
    {
        string P(int i) => w != null ? Num(w[i]) : $"w_{i}";
        switch (a.Kind)
        {
            case AngleKind.Constant: return Num(a.Value);
            case AngleKind.Parameter: return P(a.Index);
            case AngleKind.Input:
            {
                string x = a.Squash == InputSquash.Arctan ? $"arctan({names[a.Index]})" : names[a.Index];
                string s = a.ScaleParameter >= 0 ? P(a.ScaleParameter) : Num(a.Value);
                return $"{s} * {x}";
            }
            case AngleKind.InputProduct: return $"{Num(a.Value)} * {names[a.Index]} * {names[a.Index2]}";
            case AngleKind.Mapped: return MapName(a.Index, a.Index2);
            default: throw new ArgumentException($"unknown angle kind {a.Kind}");
        }
    }
}
