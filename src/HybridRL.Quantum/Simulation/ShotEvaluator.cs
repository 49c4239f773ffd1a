using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;

namespace HybridRL.Quantum.Simulation;

/// <summary>Noise-free state vector with finite shots per measurement setting (optionally with read-out error).</summary>
internal sealed class ShotEvaluator : EvaluatorBase
{
    private readonly double[]? _p01, _p10;

    public ShotEvaluator(Circuit circuit, IReadOnlyList<Observable> observables, SimulationOptions options, GradientMethod method)
        : base(circuit, observables, options, method)
    {
        var ro = options.Noise?.Readout;
        if (ro != null && !ro.IsZero) { _p01 = [.. ro.P01]; _p10 = [.. ro.P10]; }
    }

    public override SimulationMode Mode => SimulationMode.Shots;
    protected override int StateBits => Qubits;
    protected override bool NeedsScratchState => AnyBasisChange;
    protected override bool NeedsProbabilities => true;

    protected override void EvaluateRow(Workspace ws, ReadOnlySpan<double> theta, Span<double> outputs, int kt)
    {
        StateVectorOps.RunFused(ws, C.Primitives, theta, Qubits, kt);
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
                RotateToSetting(r, m, Qubits, Qubits, s, false, kt);
            }
            var prob = ws.Prob;
            for (int j = 0; j < prob.Length; j++) prob[j] = r[j] * r[j] + m[j] * m[j];
            AddSampledExpectations(prob, Qubits, s, shots, ws.Rng, _p01, _p10, outputs, 1.0, ws.TermSums);
        }
        AddConstants(outputs);
        ws.Executions += Plan.SettingCount;
        ws.Shots += (long)shots * Plan.Settings.Length;
    }
}
