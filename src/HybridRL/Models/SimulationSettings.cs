using HybridRL.Quantum.Simulation;

namespace HybridRL.Models;

/// <summary>How the circuit is simulated (config section <c>model.simulation</c>).</summary>
public sealed record SimulationSettings
{
    /// <summary><c>model.simulation.mode</c>: exact (StateVector) | shots | density_matrix | trajectories.</summary>
    public SimulationMode Mode { get; init; } = SimulationMode.StateVector;
    /// <summary><c>model.simulation.shots</c> (shots mode; optional for density_matrix / trajectories).</summary>
    public int Shots { get; init; }
    /// <summary><c>model.simulation.trajectories</c> per row when shots is 0 (trajectories mode).</summary>
    public int Trajectories { get; init; } = 256;
    /// <summary><c>model.simulation.gradient</c>: adjoint | parameter_shift (Auto: adjoint when exact).</summary>
    public GradientMethod Gradient { get; init; } = GradientMethod.Auto;
    /// <summary><c>model.simulation.noise.depolarizing</c>: single-qubit depolarizing after every gate.</summary>
    public double Depolarizing { get; init; }
    /// <summary><c>model.simulation.noise.two_qubit_depolarizing</c>: after every two-qubit gate.</summary>
    public double TwoQubitDepolarizing { get; init; }
    /// <summary><c>model.simulation.noise.amplitude_damping</c>: after every gate.</summary>
    public double AmplitudeDamping { get; init; }
    /// <summary><c>model.simulation.noise.phase_damping</c>: after every gate.</summary>
    public double PhaseDamping { get; init; }
    /// <summary><c>model.simulation.noise.readout</c>: symmetric read-out flip probability per qubit.</summary>
    public double Readout { get; init; }
    /// <summary><c>model.simulation.noise.bit_flip</c>: X error probability after every gate.</summary>
    public double BitFlip { get; init; }
    /// <summary><c>model.simulation.noise.phase_flip</c>: Z error probability after every gate.</summary>
    public double PhaseFlip { get; init; }
    /// <summary><c>model.simulation.noise.schedule</c>: how gate-noise strengths move over training (constant, linear drift, step).</summary>
    public HybridRL.Quantum.Noise.ScheduleKind Schedule { get; init; } = HybridRL.Quantum.Noise.ScheduleKind.Constant;
    /// <summary><c>model.simulation.noise.end_scale</c>: strength at the end of training (linear) or after the step, as a multiple of the start.</summary>
    public double EndScale { get; init; } = 1.0;
    /// <summary><c>model.simulation.noise.step_at</c>: training progress in [0, 1] at which a step schedule switches.</summary>
    public double StepAt { get; init; } = 0.5;
    /// <summary><c>model.simulation.threads</c>: engine worker threads (results do not depend on it).</summary>
    public int Threads { get; init; } = 1;

    public bool HasNoise => Depolarizing > 0 || TwoQubitDepolarizing > 0 || AmplitudeDamping > 0 || PhaseDamping > 0 || BitFlip > 0 || PhaseFlip > 0 || Readout > 0;
}
