namespace HybridRL.Experiments.Config;

/// <summary>
/// The <c>hardware</c> section: a timing/price model of a device used to cost circuit executions.
/// Values are estimates from a user-supplied profile, never vendor quotes.
/// </summary>
public sealed record HardwareSettings
{
    public required string Name { get; init; }
    public required string Note { get; init; }
    public required double SecondsPerShot { get; init; }
    public required double PerCircuitOverheadSeconds { get; init; }
    public required int CircuitsPerJob { get; init; }
    public required double QueueLatencySeconds { get; init; }
    /// <summary>Price per shot in the profile's currency; null when the profile gives none.</summary>
    public required double? PricePerShot { get; init; }
}
