namespace HybridRL.Analysis.Ledger;

/// <summary>
/// Analytic count of the circuit executions a device would need for a training run when every gradient comes
/// from the parameter-shift rule (Mitarai et al. 2018; Schuld et al. 2019): two shifted evaluations per
/// Pauli-rotation parameter, four per controlled rotation (the four-term rule for controlled rotations,
/// whose generator has eigenvalues 0, ±1/2). One "evaluation" is <c>measurementGroups</c> executions
/// (one per commuting group of measured observables). Pure functions, checked overflow.
/// </summary>
public static class HardwareCount
{
    /// <summary>Parameter-shift terms for one full gradient: 2 per Pauli rotation + 4 per controlled rotation.</summary>
    public static long ShiftTerms(long pauliRotationParameters, long controlledRotationParameters)
    {
        if (pauliRotationParameters < 0 || controlledRotationParameters < 0) throw new ArgumentOutOfRangeException(nameof(pauliRotationParameters), "parameter counts must be ≥ 0");
        return checked(2 * pauliRotationParameters + 4 * controlledRotationParameters);
    }

    /// <summary>
    /// Executions for training: acting = steps·forwardExecutionsPerStep; update forwards =
    /// updates·batch·forwardExecutionsPerSample (e.g. online + target network per batch row); shifted =
    /// updates·batch·parameterShiftTermsPerGradient. Every term is multiplied by <paramref name="measurementGroups"/>.
    /// With P Pauli-rotation parameters the shifted part is 2·P·B·U.
    /// </summary>
    public static HardwareCountBreakdown ForTraining(long parameterShiftTermsPerGradient, int batch, long updates,
        int forwardExecutionsPerStep, long steps, int forwardExecutionsPerSample = 0, int measurementGroups = 1)
    {
        if (parameterShiftTermsPerGradient < 0) throw new ArgumentOutOfRangeException(nameof(parameterShiftTermsPerGradient), parameterShiftTermsPerGradient, "must be ≥ 0");
        if (batch < 0) throw new ArgumentOutOfRangeException(nameof(batch), batch, "must be ≥ 0");
        if (updates < 0) throw new ArgumentOutOfRangeException(nameof(updates), updates, "must be ≥ 0");
        if (forwardExecutionsPerStep < 0) throw new ArgumentOutOfRangeException(nameof(forwardExecutionsPerStep), forwardExecutionsPerStep, "must be ≥ 0");
        if (steps < 0) throw new ArgumentOutOfRangeException(nameof(steps), steps, "must be ≥ 0");
        if (forwardExecutionsPerSample < 0) throw new ArgumentOutOfRangeException(nameof(forwardExecutionsPerSample), forwardExecutionsPerSample, "must be ≥ 0");
        if (measurementGroups < 1) throw new ArgumentOutOfRangeException(nameof(measurementGroups), measurementGroups, "must be ≥ 1");
        checked
        {
            long acting = steps * forwardExecutionsPerStep * measurementGroups;
            long forwards = updates * batch * forwardExecutionsPerSample * measurementGroups;
            long shifted = updates * batch * parameterShiftTermsPerGradient * measurementGroups;
            return new HardwareCountBreakdown(acting, forwards, shifted);
        }
    }

    /// <summary>
    /// Executions for gradient-free evolutionary training: every environment step of every evaluated episode is one
    /// forward evaluation (no gradients, so no shifted executions).
    /// </summary>
    public static HardwareCountBreakdown ForEvolution(long environmentSteps, int forwardExecutionsPerStep, int measurementGroups = 1) =>
        ForTraining(0, 0, 0, forwardExecutionsPerStep, environmentSteps, 0, measurementGroups);
}
