using System.Numerics;
using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Noise;

namespace HybridRL.Quantum.Simulation;

/// <summary>One-off access to final states (for inspection and tests; evaluators are the fast path).</summary>
public static class StateVectorSimulator
{
    /// <summary>Final state vector of one row (qubit 0 = least significant index bit).</summary>
    public static Complex[] Run(Circuit circuit, ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, bool fuse = true)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        var c = new CompiledCircuit(circuit);
        Check(c, inputs, parameters);
        var ws = new Workspace(1 << c.Qubits, c.Qubits, c.SlotAngles.Length, c.MappedCount, 1, c.ParameterCount, c.InputCount, false, false);
        c.Bind(inputs, parameters, ws.Mapped, ws.Theta, 0);
        if (fuse) StateVectorOps.RunFused(ws, c.Primitives, ws.Theta, c.Qubits, 1);
        else
        {
            StateVectorOps.ResetToZero(ws.Re, ws.Im);
            foreach (var p in c.Primitives) StateVectorOps.Apply(ws.Re, ws.Im, c.Qubits, p, p.Slot >= 0 ? ws.Theta[p.Slot] : 0, false, 1);
        }
        var psi = new Complex[ws.Re.Length];
        for (int j = 0; j < psi.Length; j++) psi[j] = new Complex(ws.Re[j], ws.Im[j]);
        return psi;
    }

    /// <summary>Final density matrix ρ[row, column] of one row under a noise model at the given progress.</summary>
    public static Complex[,] RunDensity(Circuit circuit, NoiseModel noise, ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters, double progress = 0)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        ArgumentNullException.ThrowIfNull(noise);
        var obs = new[] { Observables.Observable.ZOn(0) };
        var ev = new DensityMatrixEvaluator(circuit, obs, new SimulationOptions { Mode = SimulationMode.DensityMatrix, Noise = noise, Gradient = GradientMethod.ParameterShift }, GradientMethod.ParameterShift);
        if (progress != 0) ev.NoiseProgress = progress;
        var c = new CompiledCircuit(circuit);
        Check(c, inputs, parameters);
        int n = c.Qubits;
        var ws = new Workspace(1 << (2 * n), n, c.SlotAngles.Length, c.MappedCount, 1, c.ParameterCount, c.InputCount, false, false);
        c.Bind(inputs, parameters, ws.Mapped, ws.Theta, 0);
        ev.RunDensity(ws, ws.Theta, 1);
        int d = 1 << n;
        var rho = new Complex[d, d];
        for (int r = 0; r < d; r++)
            for (int col = 0; col < d; col++)
                rho[r, col] = new Complex(ws.Re[r | (col << n)], ws.Im[r | (col << n)]);
        return rho;
    }

    private static void Check(CompiledCircuit c, ReadOnlySpan<double> inputs, ReadOnlySpan<double> parameters)
    {
        if (inputs.Length != c.InputCount) throw new ArgumentException($"inputs has {inputs.Length} values, the circuit takes {c.InputCount}", nameof(inputs));
        if (parameters.Length != c.ParameterCount) throw new ArgumentException($"parameters has {parameters.Length} values, the circuit takes {c.ParameterCount}", nameof(parameters));
    }
}
