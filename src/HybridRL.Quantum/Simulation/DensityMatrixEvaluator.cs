using System.Runtime.CompilerServices;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Noise;
using HybridRL.Quantum.Observables;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// Density-matrix simulation with Kraus channels after gates. ρ is stored as a vector over 2n bits:
/// index = row | (column &lt;&lt; n), so U ρ U† is U on bits 0..n−1 and conj(U) on bits n..2n−1, and a
/// channel is its superoperator Σ K⊗conj(K) on (row bits, column bits).
/// </summary>
internal sealed class DensityMatrixEvaluator : EvaluatorBase
{
    public const int MaxQubits = 12;
    private NoiseProgram _noise;

    public DensityMatrixEvaluator(Circuit circuit, IReadOnlyList<Observable> observables, SimulationOptions options, GradientMethod method)
        : base(circuit, observables, options, method)
    {
        if (circuit.Qubits > MaxQubits)
            throw new ArgumentException($"density-matrix simulation supports at most {MaxQubits} qubits (memory 16·4^n bytes); the circuit has {circuit.Qubits}. Use the Trajectories mode for larger noisy circuits");
        _noise = new NoiseProgram(circuit, options.Noise ?? NoiseModel.None, 0);
    }

    public override SimulationMode Mode => SimulationMode.DensityMatrix;
    protected override int StateBits => 2 * Qubits;
    protected override bool NeedsScratchState => AnyBasisChange;
    protected override bool NeedsProbabilities => true;

    protected override void OnProgressChanged(double progress) =>
        _noise = new NoiseProgram(C.Circuit, Options.Noise ?? NoiseModel.None, progress);

    /// <summary>Runs the circuit with noise into ws.Re/ws.Im (the vectorised ρ).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal void RunDensity(Workspace ws, ReadOnlySpan<double> theta, int kt)
    {
        int n = Qubits, bits = 2 * n;
        var re = ws.Re; var im = ws.Im;
        StateVectorOps.ResetToZero(re, im);
        var after = _noise.After;
        var prims = C.Primitives;
        Span<int> targets = stackalloc int[4];
        for (int i = 0; i < prims.Length; i++)
        {
            ref readonly var p = ref prims[i];
            double t = p.Slot >= 0 ? theta[p.Slot] : 0;
            switch (p.Kind)
            {
                case PrimitiveKind.CNOT:
                    StateKernels.ApplyCnot(re, im, bits, p.Q0, p.Q1, kt);
                    StateKernels.ApplyCnot(re, im, bits, p.Q0 + n, p.Q1 + n, kt);
                    break;
                case PrimitiveKind.CZ:
                    StateKernels.ApplyCz(re, im, bits, p.Q0, p.Q1, kt);
                    StateKernels.ApplyCz(re, im, bits, p.Q0 + n, p.Q1 + n, kt);
                    break;
                case PrimitiveKind.SWAP:
                    StateKernels.ApplySwap(re, im, bits, p.Q0, p.Q1, kt);
                    StateKernels.ApplySwap(re, im, bits, p.Q0 + n, p.Q1 + n, kt);
                    break;
                case PrimitiveKind.CRX or PrimitiveKind.CRY or PrimitiveKind.CRZ:
                {
                    var m = p.Matrix(t);
                    StateKernels.ApplyControlled1(re, im, bits, p.Q0, p.Q1, m, kt);
                    StateKernels.ApplyControlled1(re, im, bits, p.Q0 + n, p.Q1 + n, m.Conjugate(), kt);
                    break;
                }
                default:
                {
                    var m = p.Kind == PrimitiveKind.Fixed1 ? p.Fixed : p.Matrix(t);
                    StateVectorOps.Apply1Smart(re, im, bits, p.Q0, m, kt);
                    StateVectorOps.Apply1Smart(re, im, bits, p.Q0 + n, m.Conjugate(), kt);
                    break;
                }
            }
            if (!p.EndsOperation) continue;
            foreach (var (set, q0, q1) in after[p.SourceOp])
            {
                if (set.Qubits == 1)
                {
                    targets[0] = q0; targets[1] = q0 + n;
                    StateKernels.ApplyDense(re, im, bits, targets[..2], set.SuperRe, set.SuperIm, ws.Dense);
                }
                else
                {
                    targets[0] = q0; targets[1] = q1; targets[2] = q0 + n; targets[3] = q1 + n;
                    StateKernels.ApplyDense(re, im, bits, targets[..4], set.SuperRe, set.SuperIm, ws.Dense);
                }
            }
        }
    }

    protected override void EvaluateRow(Workspace ws, ReadOnlySpan<double> theta, Span<double> outputs, int kt)
    {
        RunDensity(ws, theta, kt);
        int n = Qubits, dim = 1 << n;
        outputs.Clear();
        int shots = Options.Shots;
        foreach (var s in Plan.Settings)
        {
            double[] r = ws.Re, m = ws.Im;
            if ((s.XBasis | s.YBasis) != 0)
            {
                Array.Copy(ws.Re, ws.SRe, ws.Re.Length);
                Array.Copy(ws.Im, ws.SIm, ws.Im.Length);
                r = ws.SRe; m = ws.SIm;
                RotateToSetting(r, m, 2 * n, n, s, true, kt);
            }
            var prob = ws.Prob;
            for (int j = 0; j < dim; j++) prob[j] = Math.Max(0, r[j | (j << n)]);
            if (shots > 0) AddSampledExpectations(prob, n, s, shots, ws.Rng, _noise.P01, _noise.P10, outputs, 1.0, ws.TermSums);
            else
            {
                if (_noise.P01 != null) ApplyReadout(prob, n, _noise.P01, _noise.P10!);
                AddExpectationsFromProbabilities(prob, s, outputs, 1.0);
            }
        }
        AddConstants(outputs);
        ws.Executions += Plan.SettingCount;
        ws.Shots += (long)shots * Plan.Settings.Length;
    }
}
