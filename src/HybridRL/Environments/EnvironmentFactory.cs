namespace HybridRL.Environments;

/// <summary>
/// Builds environments from a kind name and a string parameter dictionary (from the experiment file).
/// Kinds: <c>cart-pole</c>, <c>slippery-warehouse</c>, <c>survey-drone</c>, <c>qubit-steering</c>, <c>external</c>.
/// Unknown kinds and keys, malformed and out-of-range values raise <see cref="EnvironmentConfigException"/>.
/// </summary>
public static class EnvironmentFactory
{
    private static readonly Dictionary<string, (IReadOnlyDictionary<string, string> Defaults, Func<IReadOnlyDictionary<string, string>, EnvironmentSettings> Parse)> Table =
        new(StringComparer.Ordinal)
        {
            [CartPoleSettings.KindName] = (CartPoleSettings.Defaults, CartPoleSettings.Parse),
            [SlipperyWarehouseSettings.KindName] = (SlipperyWarehouseSettings.Defaults, SlipperyWarehouseSettings.Parse),
            [SurveyDroneSettings.KindName] = (SurveyDroneSettings.Defaults, SurveyDroneSettings.Parse),
            [QubitSteeringSettings.KindName] = (QubitSteeringSettings.Defaults, QubitSteeringSettings.Parse),
            [ExternalEnvironmentSettings.KindName] = (ExternalEnvironmentSettings.Defaults, ExternalEnvironmentSettings.Parse),
        };

    /// <summary>All environment kinds, sorted.</summary>
    public static IReadOnlyList<string> Kinds { get; } = Table.Keys.OrderBy(k => k, StringComparer.Ordinal).ToArray();

    /// <summary>The parameter keys a kind accepts (the bridge also accepts any key starting with <c>child.</c>).</summary>
    public static IReadOnlyList<string> KnownKeys(string kind) => Entry(kind).Defaults.Keys.OrderBy(k => k, StringComparer.Ordinal).ToArray();

    /// <summary>Default value of every key of a kind (invariant-culture text).</summary>
    public static IReadOnlyDictionary<string, string> Defaults(string kind) => Entry(kind).Defaults;

    /// <summary>Validates the parameters into typed settings (no environment is built, no process started).</summary>
    public static EnvironmentSettings Parse(string kind, IReadOnlyDictionary<string, string> parameters)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        return Entry(kind).Parse(parameters);
    }

    /// <summary>Parses settings whose kind is given by the <c>kind</c> entry of the dictionary.</summary>
    public static EnvironmentSettings Parse(IReadOnlyDictionary<string, string> parameters)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        if (!parameters.TryGetValue("kind", out var kind) || string.IsNullOrWhiteSpace(kind))
            throw new EnvironmentConfigException("kind", $"environment parameter 'kind' is missing; one of: {string.Join(", ", Kinds)}");
        return Parse(kind.Trim(), parameters);
    }

    public static IEnvironment Create(string kind, IReadOnlyDictionary<string, string> parameters) => Parse(kind, parameters).CreateEnvironment();

    public static IEnvironment Create(EnvironmentSettings settings)
    {
        ArgumentNullException.ThrowIfNull(settings);
        return settings.CreateEnvironment();
    }

    private static (IReadOnlyDictionary<string, string> Defaults, Func<IReadOnlyDictionary<string, string>, EnvironmentSettings> Parse) Entry(string kind)
    {
        ArgumentNullException.ThrowIfNull(kind);
        if (Table.TryGetValue(kind, out var e)) return e;
        string? near = ParameterReader.Nearest(kind, Kinds);
        throw new EnvironmentConfigException("kind",
            $"unknown environment kind '{kind}'.{(near is null ? "" : $" Did you mean '{near}'?")} Known kinds: {string.Join(", ", Kinds)}.");
    }
}
