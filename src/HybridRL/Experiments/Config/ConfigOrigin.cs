namespace HybridRL.Experiments.Config;

/// <summary>Where a configuration value came from.</summary>
/// <param name="Source">A file path (as shown to the user), <c>--set</c>, or <c>environment variable NAME</c>.</param>
/// <param name="Line">1-based line when known.</param>
public sealed record ConfigOrigin(string Source, int? Line);
