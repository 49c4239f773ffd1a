using System.Runtime.CompilerServices;
using HybridRL.Quantum.Circuits;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// A circuit lowered to primitives, with one angle slot per gate angle. Binding turns an input row and
/// a parameter vector into slot angles; back-propagation turns slot-angle gradients into parameter and
/// input gradients (chain rule through scales, squashing, products and input maps).
/// </summary>
internal sealed class CompiledCircuit
{
    public CompiledCircuit(Circuit circuit)
    {
        Circuit = circuit;
        Qubits = circuit.Qubits;
        var prims = new List<Primitive>();
        var slots = new List<Angle>();
        var ops = circuit.Operations;
        for (int o = 0; o < ops.Count; o++)
        {
            var op = ops[o];
            int start = prims.Count;
            void Fixed(Mat2 m) => prims.Add(new Primitive { Kind = PrimitiveKind.Fixed1, Q0 = op.Qubit0, Q1 = -1, Slot = -1, SourceOp = o, Fixed = m });
            void Rot(PrimitiveKind k, int q0, int q1, Angle a)
            {
                slots.Add(a);
                prims.Add(new Primitive { Kind = k, Q0 = q0, Q1 = q1, Slot = slots.Count - 1, SourceOp = o });
            }
            void Two(PrimitiveKind k) => prims.Add(new Primitive { Kind = k, Q0 = op.Qubit0, Q1 = op.Qubit1, Slot = -1, SourceOp = o });
            switch (op.Kind)
            {
                case GateKind.X: Fixed(Mat2.X); break;
                case GateKind.Y: Fixed(Mat2.Y); break;
                case GateKind.Z: Fixed(Mat2.Z); break;
                case GateKind.H: Fixed(Mat2.H); break;
                case GateKind.S: Fixed(Mat2.S); break;
                case GateKind.Sdg: Fixed(Mat2.Sdg); break;
                case GateKind.T: Fixed(Mat2.T); break;
                case GateKind.Tdg: Fixed(Mat2.Tdg); break;
                case GateKind.RX: Rot(PrimitiveKind.RX, op.Qubit0, -1, op.Angles[0]); break;
                case GateKind.RY: Rot(PrimitiveKind.RY, op.Qubit0, -1, op.Angles[0]); break;
                case GateKind.RZ: Rot(PrimitiveKind.RZ, op.Qubit0, -1, op.Angles[0]); break;
                case GateKind.Phase: Rot(PrimitiveKind.Phase, op.Qubit0, -1, op.Angles[0]); break;
                case GateKind.Rot:
                    Rot(PrimitiveKind.RZ, op.Qubit0, -1, op.Angles[0]);
                    Rot(PrimitiveKind.RY, op.Qubit0, -1, op.Angles[1]);
                    Rot(PrimitiveKind.RZ, op.Qubit0, -1, op.Angles[2]);
                    break;
                case GateKind.CNOT: Two(PrimitiveKind.CNOT); break;
                case GateKind.CZ: Two(PrimitiveKind.CZ); break;
                case GateKind.SWAP: Two(PrimitiveKind.SWAP); break;
                case GateKind.CRX: Rot(PrimitiveKind.CRX, op.Qubit0, op.Qubit1, op.Angles[0]); break;
                case GateKind.CRY: Rot(PrimitiveKind.CRY, op.Qubit0, op.Qubit1, op.Angles[0]); break;
                case GateKind.CRZ: Rot(PrimitiveKind.CRZ, op.Qubit0, op.Qubit1, op.Angles[0]); break;
                default: throw new NotSupportedException($"gate {op.Kind} is not supported by the simulator");
            }
            var last = prims[^1];
            last.EndsOperation = true;
            prims[^1] = last;
            _ = start;
        }
        Primitives = [.. prims];
        SlotAngles = [.. slots];
        Maps = [.. circuit.InputMaps];
        MapOffsets = new int[Maps.Length];
        int off = 0;
        for (int m = 0; m < Maps.Length; m++) { MapOffsets[m] = off; off += Maps[m].AngleCount; }
        MappedCount = off;
        SlotPrimitive = new int[SlotAngles.Length];
        for (int p = 0; p < Primitives.Length; p++) if (Primitives[p].Slot >= 0) SlotPrimitive[Primitives[p].Slot] = p;
        var diff = new List<int>();
        for (int s = 0; s < SlotAngles.Length; s++)
        {
            var a = SlotAngles[s];
            if (a.Kind == AngleKind.Constant) continue;
            if (a.Kind == AngleKind.Mapped && !Maps[a.Index].IsDifferentiable) continue;
            diff.Add(s);
        }
        DifferentiableSlots = [.. diff];
        SlotDifferentiable = new bool[SlotAngles.Length];
        foreach (int s in diff) SlotDifferentiable[s] = true;
        int shifts = 0;
        foreach (int s in DifferentiableSlots) shifts += Primitives[SlotPrimitive[s]].IsControlledRotation ? 4 : 2;
        ShiftEvaluations = shifts;
        var paramSlots = new List<int>();
        int paramShifts = 0;
        foreach (int s in diff)
        {
            var a = SlotAngles[s];
            if (a.Kind == AngleKind.Parameter || (a.Kind == AngleKind.Input && a.ScaleParameter >= 0))
            {
                paramSlots.Add(s);
                paramShifts += Primitives[SlotPrimitive[s]].IsControlledRotation ? 4 : 2;
            }
        }
        ParameterSlots = [.. paramSlots];
        ParameterShiftEvaluations = paramShifts;
    }

    public Circuit Circuit { get; }
    public int Qubits { get; }
    public Primitive[] Primitives { get; }
    public Angle[] SlotAngles { get; }
    public int[] SlotPrimitive { get; }
    /// <summary>Slots whose angle depends on parameters or inputs through a differentiable path.</summary>
    public int[] DifferentiableSlots { get; }
    public bool[] SlotDifferentiable { get; }
    /// <summary>Parameter-shift evaluations per row for one full gradient: 2 per Pauli rotation or phase, 4 per controlled rotation.</summary>
    public int ShiftEvaluations { get; }
    /// <summary>
    /// Slots whose angle depends on a trainable parameter (a rotation angle or a trainable input scale): the only slots
    /// a gradient with respect to the parameters alone has to shift.
    /// </summary>
    public int[] ParameterSlots { get; }
    /// <summary>Parameter-shift evaluations per row for a gradient with respect to the parameters only (no input gradient).</summary>
    public int ParameterShiftEvaluations { get; }
    public IInputAngleMap[] Maps { get; }
    public int[] MapOffsets { get; }
    public int MappedCount { get; }
    public int InputCount => Circuit.InputCount;
    public int ParameterCount => Circuit.ParameterCount;

    /// <summary>Slot angles for one row. <paramref name="mapped"/> is scratch of length <see cref="MappedCount"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Bind(ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, Span<double> mapped, Span<double> theta, int row)
    {
        for (int m = 0; m < Maps.Length; m++)
            Maps[m].Compute(inputs[..Maps[m].InputCount], mapped.Slice(MapOffsets[m], Maps[m].AngleCount));
        for (int s = 0; s < SlotAngles.Length; s++)
        {
            double v = SlotAngles[s].Evaluate(inputs, parameters, mapped, MapOffsets);
            if (!double.IsFinite(v))
                throw new ArgumentException($"angle {SlotAngles[s]} of gate {Circuit.Operations[Primitives[SlotPrimitive[s]].SourceOp]} evaluated to {v} for batch row {row}");
            theta[s] = v;
        }
    }

    /// <summary>Adds the chain rule of slot gradients into parameter and input gradients (both must be zeroed by the caller).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Backprop(ReadOnlySpan<double> gradTheta, ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, Span<double> gradParameters, Span<double> gradInputs, Span<double> gradMapped)
    {
        gradMapped.Clear();
        foreach (int s in DifferentiableSlots)
            SlotAngles[s].Backprop(gradTheta[s], inputs, parameters, gradParameters, gradInputs, gradMapped, MapOffsets);
        for (int m = 0; m < Maps.Length; m++)
            if (Maps[m].IsDifferentiable)
                Maps[m].Backprop(inputs[..Maps[m].InputCount], gradMapped.Slice(MapOffsets[m], Maps[m].AngleCount), gradInputs[..Maps[m].InputCount]);
    }
}
