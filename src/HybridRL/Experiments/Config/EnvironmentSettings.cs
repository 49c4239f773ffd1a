namespace HybridRL.Experiments.Config;

/// <summary>
/// The <c>environment</c> section: a kind plus free-form parameters passed through as strings.
/// Parameter keys are relative to the section; nested values use ':' (a list <c>map: [a, b]</c> gives
/// <c>map:0</c> and <c>map:1</c>); an empty list is the value "[]". The environment layer validates them.
/// </summary>
public sealed record EnvironmentSettings
{
    public required string Kind { get; init; }
    public required EquatableStringMap Parameters { get; init; }
}
