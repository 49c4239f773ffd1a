using HybridRL.Quantum.Circuits;
using HybridRL.Quantum.Observables;

namespace HybridRL.Quantum.Simulation;

/// <summary>What one gradient would cost on hardware, where it must be estimated by parameter shift.</summary>
public static class GradientCost
{
    /// <summary>
    /// Shifted circuit evaluations per input row for one full gradient (parameters and inputs): 2 per
    /// occurrence of a parameter- or input-dependent Pauli rotation or phase angle, 4 per controlled rotation.
    /// </summary>
    public static int ShiftEvaluationsPerRow(Circuit circuit)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        return new CompiledCircuit(circuit).ShiftEvaluations;
    }

    /// <summary>Hardware circuit executions per row for one gradient: shift evaluations × measurement settings.</summary>
    public static long HardwareExecutionsPerGradient(Circuit circuit, IReadOnlyList<Observable> observables)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        return (long)ShiftEvaluationsPerRow(circuit) * MeasurementSettings(circuit, observables);
    }

    /// <summary>Distinct measurement settings (qubit-wise commuting groups) needed to estimate the observables.</summary>
    public static int MeasurementSettings(Circuit circuit, IReadOnlyList<Observable> observables) =>
        new MeasurementPlan(observables, circuit.Qubits).SettingCount;
}
