namespace HybridRL.Quantum.Noise;

/// <summary>A noise strength as a function of training progress t ∈ [0, 1].</summary>
public sealed record StrengthSchedule
{
    public ScheduleKind Kind { get; }
    public double Start { get; }
    public double End { get; }
    public double At { get; }

    private StrengthSchedule(ScheduleKind kind, double start, double end, double at)
    {
        CheckProbability(start, nameof(start));
        CheckProbability(end, nameof(end));
        if (!(at >= 0 && at <= 1)) throw new ArgumentOutOfRangeException(nameof(at), at, "step position must be a progress value in [0, 1]");
        Kind = kind; Start = start; End = end; At = at;
    }

    public static StrengthSchedule Constant(double value) => new(ScheduleKind.Constant, value, value, 0);
    public static StrengthSchedule LinearDrift(double start, double end) => new(ScheduleKind.LinearDrift, start, end, 0);
    public static StrengthSchedule Step(double before, double after, double at) => new(ScheduleKind.Step, before, after, at);

    public static implicit operator StrengthSchedule(double value) => Constant(value);

    /// <summary>Strength at training progress t ∈ [0, 1].</summary>
    public double ValueAt(double progress)
    {
        if (!(progress >= 0 && progress <= 1)) throw new ArgumentOutOfRangeException(nameof(progress), progress, "training progress must be in [0, 1]");
        return Kind switch
        {
            ScheduleKind.Constant => Start,
            ScheduleKind.LinearDrift => Start + (End - Start) * progress,
            ScheduleKind.Step => progress < At ? Start : End,
            _ => throw new InvalidOperationException($"unknown schedule {Kind}"),
        };
    }

    internal static void CheckProbability(double p, string name)
    {
        if (!(p >= 0 && p <= 1)) throw new ArgumentOutOfRangeException(name, p, "noise strength must be a probability in [0, 1]");
    }

    public override string ToString() => Kind switch
    {
        ScheduleKind.Constant => $"{Start}",
        ScheduleKind.LinearDrift => $"linear({Start}->{End})",
        _ => $"step({Start}->{End}@{At})",
    };
}
