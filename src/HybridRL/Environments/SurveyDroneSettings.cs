namespace HybridRL.Environments;

/// <summary>Settings of the <c>survey-drone</c> task (see <see cref="SurveyDroneEnvironment"/>).</summary>
public sealed class SurveyDroneSettings : EnvironmentSettings
{
    public const string KindName = "survey-drone";

    public static readonly IReadOnlyDictionary<string, string> Defaults = new SortedDictionary<string, string>(StringComparer.Ordinal)
    {
        ["map"] = "",
        ["size"] = "10",
        ["wall_density"] = "0.2",
        ["seed_map"] = "1",
        ["window"] = "5",
        ["slip_probability"] = "0",
        ["step_cost"] = "0",
        ["target_reward"] = "1",
        ["max_steps"] = "200",
    };

    private SurveyDroneSettings(IReadOnlyDictionary<string, string> values) : base(KindName, values) { }

    public GridMap Map { get; private init; } = null!;
    public int Window { get; private init; }
    public double SlipProbability { get; private init; }
    public GridRewards Rewards { get; private init; }
    public int MaxSteps { get; private init; }

    public static SurveyDroneSettings Parse(IReadOnlyDictionary<string, string> parameters)
    {
        var p = new ParameterReader(KindName, Defaults, parameters);
        string mapText = p.String("map");
        int size = p.Int("size", 2, 64);
        double density = p.Double("wall_density", 0, 0.6);
        ulong seedMap = p.UInt64("seed_map");
        int window = p.Int("window", 1, 15);
        if (window % 2 == 0) throw new EnvironmentConfigException("window", $"parameter 'window' of environment '{KindName}' has value '{window}'; allowed: an odd integer in [1, 15]");
        double slip = p.Double("slip_probability", 0, 1, maxExclusive: true);
        double stepCost = p.Double("step_cost", 0, 1000);
        double targetReward = p.Double("target_reward", -1000, 1000);
        int maxSteps = p.Int("max_steps", 1, 10_000_000);
        GridMap map;
        if (mapText.Length > 0)
        {
            map = GridMap.Parse(mapText, "map");
            for (int s = 0; s < map.StateCount; s++)
                if (map.CellOfState(s) == GridCell.Hole)
                    throw new EnvironmentConfigException("map", $"parameter 'map' of environment '{KindName}': survey maps have no holes ('o'); use '.', '#', 'R', 'D'");
        }
        else
        {
            map = SurveyMapGenerator.Generate(size, density, seedMap);
        }
        return new SurveyDroneSettings(p.Resolved)
        {
            Map = map,
            Window = window,
            SlipProbability = slip,
            Rewards = new GridRewards(stepCost, targetReward, 0),
            MaxSteps = maxSteps,
        };
    }

    public override IEnvironment CreateEnvironment() => new SurveyDroneEnvironment(this);

    /// <summary>Exact model over the drone's position (the visited marks change only the observation, never dynamics or reward).</summary>
    public override TabularModel ToTabularModel() => Rewards.BuildModel(Map, SlipProbability);
}
