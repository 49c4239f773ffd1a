using System.Runtime.CompilerServices;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Noise;
using HybridRL.Quantum.Observables;

namespace HybridRL.Quantum.Simulation;

/// <summary>
/// Monte-Carlo trajectories (quantum jumps) on the state vector: after each gate, one Kraus operator K_k of
/// each attached channel is chosen with probability ‖K_k ψ‖² and ψ ← K_k ψ / ‖K_k ψ‖. The average over
/// trajectories of ⟨ψ|O|ψ⟩ is an unbiased estimate of Tr(Oρ). Without shots, each trajectory contributes its exact
/// expectation; with shots, each shot is one trajectory measured once in every setting.
/// </summary>
internal sealed class TrajectoryEvaluator : EvaluatorBase
{
    private NoiseProgram _noise;

    public TrajectoryEvaluator(Circuit circuit, IReadOnlyList<Observable> observables, SimulationOptions options, GradientMethod method)
        : base(circuit, observables, options, method)
    {
        if (options.Shots <= 0 && options.Trajectories < 1)
            throw new ArgumentOutOfRangeException(nameof(options), options.Trajectories, "Trajectories must be at least 1 in the Trajectories mode");
        _noise = new NoiseProgram(circuit, options.Noise ?? NoiseModel.None, 0);
    }

    public override SimulationMode Mode => SimulationMode.Trajectories;
    protected override int StateBits => Qubits;
    protected override bool NeedsScratchState => AnyBasisChange;
    protected override bool NeedsProbabilities => true;

    protected override void OnProgressChanged(double progress) =>
        _noise = new NoiseProgram(C.Circuit, Options.Noise ?? NoiseModel.None, progress);

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void RunTrajectory(Workspace ws, ReadOnlySpan<double> theta, int kt)
    {
        int n = Qubits;
        var re = ws.Re; var im = ws.Im;
        StateVectorOps.ResetToZero(re, im);
        var after = _noise.After;
        var prims = C.Primitives;
        var rng = ws.Rng;
        for (int i = 0; i < prims.Length; i++)
        {
            ref readonly var p = ref prims[i];
            StateVectorOps.Apply(re, im, n, p, p.Slot >= 0 ? theta[p.Slot] : 0, false, kt);
            if (!p.EndsOperation) continue;
            foreach (var (set, q0, q1) in after[p.SourceOp])
            {
                if (set.Qubits == 2)
                {
                    // Mixed-unitary: identity with probability 1 − 15p/16, else one of the 15 other Pauli pairs uniformly.
                    if (rng.NextDouble() < set.IdentityProbability) continue;
                    int idx = 1 + rng.NextInt(15);
                    ApplyPauli(re, im, n, q0, idx & 3, kt);
                    ApplyPauli(re, im, n, q1, idx >> 2, kt);
                    continue;
                }
                Jump(ws, set, q0, n, kt);
            }
        }
    }

    private static void ApplyPauli(double[] re, double[] im, int n, int q, int which, int kt)
    {
        switch (which)
        {
            case 1: StateKernels.Apply1(re, im, n, q, Mat2.X, kt); break;
            case 2: StateKernels.Apply1(re, im, n, q, Mat2.Y, kt); break;
            case 3: StateKernels.ApplyDiag1(re, im, n, q, 1, 0, -1, 0, kt); break;
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Jump(Workspace ws, KrausSet set, int q, int n, int kt)
    {
        var re = ws.Re; var im = ws.Im;
        // Reduced density matrix of qubit q: r00, r11, r01 = Σ ψ_{·0·} conj(ψ_{·1·}).
        double r00 = 0, r11 = 0, r01r = 0, r01i = 0;
        int stride = 1 << q;
        for (int j = 0; j < re.Length; j++)
        {
            if ((j & stride) != 0) continue;
            double ar = re[j], ai = im[j], br = re[j | stride], bi = im[j | stride];
            r00 += ar * ar + ai * ai;
            r11 += br * br + bi * bi;
            r01r += ar * br + ai * bi;
            r01i += ai * br - ar * bi;
        }
        double u = ws.Rng.NextDouble() * (r00 + r11);
        var mats = set.Mats;
        double cum = 0;
        int chosen = mats.Length - 1;
        double pChosen = 0;
        for (int k = 0; k < mats.Length; k++)
        {
            double pk = KrausProbability(mats[k], r00, r11, r01r, r01i);
            cum += pk;
            if (u < cum || k == mats.Length - 1) { chosen = k; pChosen = pk; break; }
        }
        if (pChosen <= 0) return;
        var m = mats[chosen].Scale(1 / Math.Sqrt(pChosen / (r00 + r11)));
        StateVectorOps.Apply1Smart(re, im, n, q, m, kt);
    }

    /// <summary>Tr(K r K†) for a 2×2 K and Hermitian r = [[r00, r01], [conj r01, r11]].</summary>
    private static double KrausProbability(in Mat2 k, double r00, double r11, double r01r, double r01i)
    {
        // Σ_a Σ_{b,c} K[a,b] r[b,c] conj(K[a,c])
        double s = 0;
        for (int a = 0; a < 2; a++)
        {
            KrausSet.Get(k, a, 0, out double k0r, out double k0i);
            KrausSet.Get(k, a, 1, out double k1r, out double k1i);
            s += (k0r * k0r + k0i * k0i) * r00 + (k1r * k1r + k1i * k1i) * r11;
            // 2 Re(K[a,0] r01 conj(K[a,1]))
            double pr = k0r * r01r - k0i * r01i, pi = k0r * r01i + k0i * r01r;
            s += 2 * (pr * k1r + pi * k1i);
        }
        return s;
    }

    protected override void EvaluateRow(Workspace ws, ReadOnlySpan<double> theta, Span<double> outputs, int kt)
    {
        int n = Qubits;
        outputs.Clear();
        int shots = Options.Shots;
        int trajectories = shots > 0 ? shots : Options.Trajectories;
        double factor = 1.0 / trajectories;
        for (int tr = 0; tr < trajectories; tr++)
        {
            RunTrajectory(ws, theta, kt);
            foreach (var s in Plan.Settings)
            {
                double[] r = ws.Re, m = ws.Im;
                if ((s.XBasis | s.YBasis) != 0)
                {
                    Array.Copy(ws.Re, ws.SRe, ws.Re.Length);
                    Array.Copy(ws.Im, ws.SIm, ws.Im.Length);
                    r = ws.SRe; m = ws.SIm;
                    RotateToSetting(r, m, n, n, s, false, kt);
                }
                var prob = ws.Prob;
                for (int j = 0; j < prob.Length; j++) prob[j] = r[j] * r[j] + m[j] * m[j];
                if (shots > 0) AddSampledExpectations(prob, n, s, 1, ws.Rng, _noise.P01, _noise.P10, outputs, factor, ws.TermSums);
                else
                {
                    if (_noise.P01 != null) ApplyReadout(prob, n, _noise.P01, _noise.P10!);
                    AddExpectationsFromProbabilities(prob, s, outputs, factor);
                }
            }
        }
        AddConstants(outputs);
        ws.Executions += Plan.SettingCount;
        ws.Shots += (long)shots * Plan.Settings.Length;
    }
}
