using System.Runtime.CompilerServices;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;

namespace HybridRL.Quantum.Simulation;

/// <summary>Exact state-vector expectations; gradients by adjoint differentiation or parameter shift.</summary>
internal sealed class ExactStateVectorEvaluator : EvaluatorBase
{
    public ExactStateVectorEvaluator(Circuit circuit, IReadOnlyList<Observable> observables, SimulationOptions options, GradientMethod method)
        : base(circuit, observables, options, method)
    {
        int T = Plan.Terms.Length, dim = 1 << circuit.Qubits;
        if (T > 0 && T <= 64 && (long)dim * T <= 1 << 16 && Plan.Terms.All(t => t.XMask == 0))
        {
            _diagSigns = new double[dim * T];
            for (int j = 0; j < dim; j++)
                for (int t = 0; t < T; t++)
                    _diagSigns[j * T + t] = (System.Numerics.BitOperations.PopCount((ulong)j & Plan.Terms[t].ZMask) & 1) == 0 ? 1 : -1;
        }
    }

    /// <summary>sign_t(j) table [dim × terms] when every term is a Z string and the table is small.</summary>
    private readonly double[]? _diagSigns;

    private const int RunLimit = 16;

    public override SimulationMode Mode => SimulationMode.StateVector;
    protected override int StateBits => Qubits;
    protected override bool NeedsAdjointBuffers => GradientMethod == GradientMethod.Adjoint;

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    protected override void EvaluateRow(Workspace ws, ReadOnlySpan<double> theta, Span<double> outputs, int kt)
    {
        StateVectorOps.RunFused(ws, C.Primitives, theta, Qubits, kt);
        Expectations(ws, outputs);
        ws.Executions += Plan.SettingCount;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Expectations(Workspace ws, Span<double> outputs)
    {
        outputs.Clear();
        if (_diagSigns != null)
        {
            // All terms are Z strings: one pass over probabilities with the sign table.
            var terms = Plan.Terms;
            int T = terms.Length;
            Span<double> sums = stackalloc double[T];
            sums.Clear();
            var re = ws.Re; var im = ws.Im; var sg = _diagSigns;
            for (int j = 0; j < re.Length; j++)
            {
                double pj = re[j] * re[j] + im[j] * im[j];
                int row = j * T;
                for (int t = 0; t < T; t++) sums[t] += pj * sg[row + t];
            }
            for (int t = 0; t < T; t++) outputs[terms[t].Output] += terms[t].Weight * sums[t];
            AddConstants(outputs);
            return;
        }
        foreach (var e in Plan.Terms)
        {
            double v = e.XMask == 0
                ? StateKernels.ZExpectation(ws.Re, ws.Im, e.ZMask)
                : StateKernels.PauliInner(ws.Re, ws.Im, ws.Re, ws.Im, e.XMask, e.ZMask).re;
            outputs[e.Output] += e.Weight * v;
        }
        AddConstants(outputs);
    }

    /// <summary>
    /// Adjoint differentiation (Jones &amp; Gacon 2020): one forward sweep to |ψ⟩, λ = (Σ_k g_k O_k)|ψ⟩, then one
    /// backward sweep undoing each gate on both; for U = exp(−iθP/2) the derivative is Im⟨λ|P|ψ⟩ at the point
    /// just after the gate (controlled: P restricted to control = 1; phase: −2·Im⟨λ|Π₁|ψ⟩).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    protected override void AdjointRow(Workspace ws, ReadOnlySpan<double> theta, ReadOnlySpan<double> gOut, Span<double> gTheta, int kt)
    {
        StateVectorOps.RunFused(ws, C.Primitives, theta, Qubits, kt);
        var re = ws.Re; var im = ws.Im; var lr = ws.LRe; var li = ws.LIm;
        if (_diagSigns != null)
        {
            // All terms diagonal: λ_j = (Σ_t c_t·sign_t(j))·ψ_j in one pass.
            var terms = Plan.Terms;
            int T = terms.Length;
            Span<double> c = stackalloc double[T];
            for (int t = 0; t < T; t++) c[t] = gOut[terms[t].Output] * terms[t].Weight;
            var sg = _diagSigns;
            for (int j = 0; j < re.Length; j++)
            {
                double d = 0;
                int row = j * T;
                for (int t = 0; t < T; t++) d += c[t] * sg[row + t];
                lr[j] = d * re[j];
                li[j] = d * im[j];
            }
        }
        else
        {
            Array.Clear(lr); Array.Clear(li);
            foreach (var e in Plan.Terms)
            {
                double c = gOut[e.Output] * e.Weight;
                if (c != 0) StateKernels.AddPauli(lr, li, re, im, e.XMask, e.ZMask, c, 0);
            }
        }
        var prims = C.Primitives;
        var diff = C.SlotDifferentiable;
        int n = Qubits;
        bool big = n >= StateKernels.ParallelBits && kt > 1;
        Span<char> modes = stackalloc char[RunLimit];
        Span<Mat2> invs = stackalloc Mat2[RunLimit];
        Span<double> acc = stackalloc double[RunLimit];
        for (int i = prims.Length - 1; i >= 0; i--)
        {
            ref readonly var p = ref prims[i];
            double t = p.Slot >= 0 ? theta[p.Slot] : 0;
            if (!big && p.IsSingleQubit)
            {
                // Maximal run of single-qubit primitives on this qubit, processed pair-locally in one pass.
                int j = i;
                while (j - 1 >= 0 && i - (j - 1) < RunLimit && prims[j - 1].IsSingleQubit && prims[j - 1].Q0 == p.Q0) j--;
                int count = i - j + 1;
                for (int e = 0; e < count; e++)
                {
                    ref readonly var pe = ref prims[i - e];
                    bool d = pe.Slot >= 0 && diff[pe.Slot];
                    modes[e] = !d ? 'N' : pe.Kind == PrimitiveKind.Phase ? 'P' : pe.Generator;
                    invs[e] = pe.Kind == PrimitiveKind.Fixed1 ? pe.Fixed.Adjoint() : pe.Matrix(-theta[pe.Slot]);
                }
                AdjointKernels.StepRun(re, im, lr, li, n, p.Q0, modes[..count], invs[..count], acc);
                for (int e = 0; e < count; e++)
                    if (modes[e] != 'N') gTheta[prims[i - e].Slot] += acc[e];
                i = j;
                continue;
            }
            if (p.Slot >= 0 && diff[p.Slot] && !big)
            {
                // Single fused pass: derivative term, then undo on ψ and λ.
                var inv = p.Matrix(-t);
                double g = p.Kind switch
                {
                    PrimitiveKind.Phase => AdjointKernels.Step(re, im, lr, li, n, p.Q0, 0, 'P', inv, i > 0),
                    PrimitiveKind.CRX or PrimitiveKind.CRY or PrimitiveKind.CRZ => AdjointKernels.Step(re, im, lr, li, n, p.Q1, 1L << p.Q0, p.Generator, inv, i > 0),
                    _ => AdjointKernels.Step(re, im, lr, li, n, p.Q0, 0, p.Generator, inv, i > 0),
                };
                gTheta[p.Slot] += g;
                continue;
            }
            if (p.Slot >= 0 && diff[p.Slot])
            {
                double g = p.Kind switch
                {
                    PrimitiveKind.Phase => -2 * StateKernels.ProjectorInner(lr, li, re, im, 1L << p.Q0).im,
                    PrimitiveKind.CRX or PrimitiveKind.CRY or PrimitiveKind.CRZ => StateKernels.Pauli1Inner(lr, li, re, im, p.Q1, p.Generator, 1L << p.Q0).im,
                    _ => StateKernels.Pauli1Inner(lr, li, re, im, p.Q0, p.Generator, 0).im,
                };
                gTheta[p.Slot] += g;
            }
            if (i == 0) break;
            if (!big && p.Kind == PrimitiveKind.CNOT) { StateKernels.ApplyCnotBoth(re, im, lr, li, n, p.Q0, p.Q1); continue; }
            if (!big && p.Kind == PrimitiveKind.CZ) { StateKernels.ApplyCzBoth(re, im, lr, li, n, p.Q0, p.Q1); continue; }
            StateVectorOps.Apply(re, im, n, p, t, true, kt);
            StateVectorOps.Apply(lr, li, n, p, t, true, kt);
        }
    }
}
