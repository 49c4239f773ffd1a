namespace HybridRL.Analysis.Ledger;

/// <summary>
/// Estimated device time and cost for a hardware-equivalent workload under one <see cref="HardwareProfile"/>.
/// DeviceSeconds = ShotSeconds + OverheadSeconds + QueueSeconds. Cost is null when the profile has no price.
/// These are estimates from the user's profile, not vendor quotes.
/// </summary>
public sealed record HardwareEstimate(
    string ProfileName,
    double HardwareExecutions,
    double HardwareShots,
    double Jobs,
    double ShotSeconds,
    double OverheadSeconds,
    double QueueSeconds,
    double? Cost,
    string? Currency)
{
    public double DeviceSeconds => ShotSeconds + OverheadSeconds + QueueSeconds;
}
