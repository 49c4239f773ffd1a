namespace HybridRL.Environments;

/// <summary>
/// Built-in warehouse floor maps (our own invented layouts; legend in <see cref="GridCell"/>). The optimal
/// returns listed in the docs are computed by <see cref="ValueIteration"/> for the default rewards.
/// </summary>
public static class WarehouseMaps
{
    private static readonly Dictionary<string, string> Maps = new(StringComparer.Ordinal)
    {
        // 3 x 4, 11 states (fits 4 qubits of basis encoding): a short aisle with two open hatches.
        ["dock-3x4"] = "R.#./..o./o..D",
        // 4 x 4, 14 states: dock in the middle of the bottom row, a rack and three hatches.
        ["dock-4x4"] = "..R./.#o./o.../.#D.",
        // 5 x 6, 25 states: two aisles between shelf racks.
        ["aisles-5x6"] = "R...../.##.#./...o../.#.##./o....D",
        // 8 x 8: a loading bay with racks, hatches and the dock in the far corner.
        ["loading-bay-8x8"] = "R......./.##.##../.##o##../......../.o.##.#./##...o../.#.#..../...o..#D",
    };

    public static IReadOnlyCollection<string> Names => Maps.Keys;

    public static bool TryGet(string name, out string text) => Maps.TryGetValue(name, out text!);

    /// <summary>Resolves a <c>map</c> parameter: a built-in map name, or a text map (only legend characters, rows separated by '/' or newlines).</summary>
    public static GridMap Resolve(string value, string key = "map")
    {
        if (TryGet(value, out var text)) return GridMap.Parse(text, key);
        if (value.Contains('/') || value.Contains('\n') || value.All(ch => ".#oRD \t".Contains(ch))) return GridMap.Parse(value, key);
        throw new EnvironmentConfigException(key,
            $"parameter '{key}' is '{value}', which is neither a built-in map ({string.Join(", ", Names)}) nor a text map (legend '.', '#', 'o', 'R', 'D'; rows separated by '/' or newlines)");
    }
}
