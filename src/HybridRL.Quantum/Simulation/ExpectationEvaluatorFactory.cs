using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;

namespace HybridRL.Quantum.Simulation;

/// <summary>Creates the evaluator for a simulation mode, checking that mode, shots, noise and gradient method fit together.</summary>
public static class ExpectationEvaluatorFactory
{
    public static IExpectationEvaluator Create(Circuit circuit, IReadOnlyList<Observable> observables, SimulationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        ArgumentNullException.ThrowIfNull(observables);
        options ??= SimulationOptions.Exact;
        if (circuit.Qubits > Circuit.MaxQubits)
            throw new ArgumentException($"the simulator supports at most {Circuit.MaxQubits} qubits; the circuit has {circuit.Qubits}");
        if (options.Shots < 0) throw new ArgumentOutOfRangeException(nameof(options), options.Shots, "Shots must be non-negative");
        if (options.Threads < 1) throw new ArgumentOutOfRangeException(nameof(options), options.Threads, "Threads must be at least 1");
        options.Noise?.Validate(circuit.Qubits);
        bool gateNoise = options.Noise?.HasGateNoise == true;
        bool readout = options.Noise?.Readout is { IsZero: false };
        bool exact = options.Mode == SimulationMode.StateVector;
        switch (options.Mode)
        {
            case SimulationMode.StateVector:
                if (options.Shots > 0) throw new ArgumentException($"Shots = {options.Shots} given with the exact StateVector mode; use SimulationMode.Shots for finite-shot estimates");
                if (gateNoise || readout) throw new ArgumentException("a noise model was given with the exact StateVector mode; use SimulationMode.DensityMatrix or SimulationMode.Trajectories");
                break;
            case SimulationMode.Shots:
                if (options.Shots <= 0) throw new ArgumentException("the Shots mode needs Shots > 0");
                if (gateNoise) throw new ArgumentException("gate noise needs SimulationMode.DensityMatrix or SimulationMode.Trajectories (the Shots mode only supports read-out error)");
                break;
        }
        var method = options.Gradient;
        if (method == GradientMethod.Auto) method = exact ? GradientMethod.Adjoint : GradientMethod.ParameterShift;
        if (method == GradientMethod.Adjoint && !exact)
            throw new ArgumentException($"adjoint differentiation needs the exact state vector; with {options.Mode}{(options.Shots > 0 ? $" and {options.Shots} shots" : "")}{(gateNoise || readout ? " and noise" : "")} use GradientMethod.ParameterShift");
        return options.Mode switch
        {
            SimulationMode.StateVector => new ExactStateVectorEvaluator(circuit, observables, options, method),
            SimulationMode.Shots => new ShotEvaluator(circuit, observables, options, method),
            SimulationMode.DensityMatrix => new DensityMatrixEvaluator(circuit, observables, options, method),
            SimulationMode.Trajectories => new TrajectoryEvaluator(circuit, observables, options, method),
            _ => throw new ArgumentOutOfRangeException(nameof(options), options.Mode, "unknown simulation mode"),
        };
    }
}
