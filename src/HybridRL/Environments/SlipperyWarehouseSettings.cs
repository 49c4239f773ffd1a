namespace HybridRL.Environments;

/// <summary>Settings of the <c>slippery-warehouse</c> task (see <see cref="SlipperyWarehouseEnvironment"/>).</summary>
public sealed class SlipperyWarehouseSettings : EnvironmentSettings
{
    public const string KindName = "slippery-warehouse";

    public static readonly IReadOnlyDictionary<string, string> Defaults = new SortedDictionary<string, string>(StringComparer.Ordinal)
    {
        ["map"] = "dock-3x4",
        ["slip_probability"] = "0.2",
        ["step_cost"] = "0.01",
        ["dock_reward"] = "1",
        ["hole_penalty"] = "1",
        ["max_steps"] = "100",
        ["observation"] = "one-hot",
        ["start"] = "map",
    };

    private SlipperyWarehouseSettings(IReadOnlyDictionary<string, string> values) : base(KindName, values) { }

    public GridMap Map { get; private init; } = null!;
    public double SlipProbability { get; private init; }
    public GridRewards Rewards { get; private init; }
    public int MaxSteps { get; private init; }
    public GridObservation Observation { get; private init; }

    /// <summary>
    /// <c>start</c>: <c>map</c> (default) starts every episode on a start cell 'R' of the map (uniformly if there are
    /// several); <c>random</c> starts it on any non-terminal cell, uniformly ("exploring starts", Sutton &amp; Barto
    /// 2018 §5.3), so that every cell is visited during training. The optimal policy is the same for both (it is
    /// optimal from every state); only the start distribution of the task and of <see cref="ToTabularModel"/> differs.
    /// </summary>
    public bool RandomStart { get; private init; }

    public static SlipperyWarehouseSettings Parse(IReadOnlyDictionary<string, string> parameters)
    {
        var p = new ParameterReader(KindName, Defaults, parameters);
        string mapValue = p.String("map", allowEmpty: false);
        var map = WarehouseMaps.Resolve(mapValue);
        double slip = p.Double("slip_probability", 0, 1, maxExclusive: true);
        double stepCost = p.Double("step_cost", 0, 1000);
        double dock = p.Double("dock_reward", -1000, 1000);
        double hole = p.Double("hole_penalty", -1000, 1000);
        int maxSteps = p.Int("max_steps", 1, 10_000_000);
        var obs = p.Choice("observation", "one-hot", "binary", "index", "coordinates") switch
        {
            "one-hot" => GridObservation.OneHot,
            "binary" => GridObservation.Binary,
            "index" => GridObservation.Index,
            _ => GridObservation.Coordinates,
        };
        bool randomStart = p.Choice("start", "map", "random") == "random";
        return new SlipperyWarehouseSettings(p.Resolved)
        {
            Map = map,
            SlipProbability = slip,
            Rewards = new GridRewards(stepCost, dock, -hole),
            MaxSteps = maxSteps,
            Observation = obs,
            RandomStart = randomStart,
        };
    }

    public override IEnvironment CreateEnvironment() => new SlipperyWarehouseEnvironment(this);

    public override TabularModel ToTabularModel() => Rewards.BuildModel(Map, SlipProbability, RandomStart);

}
