namespace HybridRL.Experiments.Config;

/// <summary>One key whose resolved value differs between two specs.</summary>
/// <param name="Key">Dotted key (environment parameters as <c>environment.name</c>).</param>
/// <param name="Before">Canonical value text in the first spec; null = not present (key does not apply).</param>
/// <param name="After">Canonical value text in the second spec; null = not present.</param>
/// <param name="SafeOnResume">Whether this change may be made when resuming a run.</param>
public sealed record SpecDifference(string Key, string? Before, string? After, bool SafeOnResume);
