namespace HybridRL.Quantum.Noise;

public enum ScheduleKind
{
    Constant,
    /// <summary>Linear from Start at progress 0 to End at progress 1.</summary>
    LinearDrift,
    /// <summary>Start before progress At, End from At on.</summary>
    Step,
}
