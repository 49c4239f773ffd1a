namespace HybridRL.Analysis.Ledger;

/// <summary>Analytic hardware-equivalent circuit executions of a training run, by purpose.</summary>
public readonly record struct HardwareCountBreakdown(long ActingExecutions, long UpdateForwardExecutions, long ShiftedExecutions)
{
    public long Total => ActingExecutions + UpdateForwardExecutions + ShiftedExecutions;
}
