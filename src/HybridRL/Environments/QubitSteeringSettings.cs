namespace HybridRL.Environments;

/// <summary>Settings of the <c>qubit-steering</c> task (see <see cref="QubitSteeringEnvironment"/>).</summary>
public sealed class QubitSteeringSettings : EnvironmentSettings
{
    public const string KindName = "qubit-steering";

    public static readonly IReadOnlyDictionary<string, string> Defaults = new SortedDictionary<string, string>(StringComparer.Ordinal)
    {
        ["drive_values"] = "-4,4",
        ["slices"] = "20",
        ["slice_duration"] = "0.1",
        ["initial_field"] = "-2",
        ["target_field"] = "2",
        ["shots"] = "0",
        ["reward"] = "final",
        ["observe_time"] = "false",
    };

    private QubitSteeringSettings(IReadOnlyDictionary<string, string> values) : base(KindName, values) { }

    /// <summary>Drive-field values h, one per action.</summary>
    public IReadOnlyList<double> DriveValues { get; private init; } = [];
    public int Slices { get; private init; }
    public double SliceDuration { get; private init; }
    /// <summary>The qubit starts in the ground state of H(initial_field).</summary>
    public double InitialField { get; private init; }
    /// <summary>The target is the ground state of H(target_field).</summary>
    public double TargetField { get; private init; }
    /// <summary>Measurement shots per Bloch axis per observation (0 = exact expectations).</summary>
    public int Shots { get; private init; }
    /// <summary>True: every step is rewarded with its fidelity gain; false: fidelity only at the end.</summary>
    public bool ShapedReward { get; private init; }
    /// <summary>Append the elapsed fraction of the protocol (step / slices) to the observation.</summary>
    public bool ObserveTime { get; private init; }

    public static QubitSteeringSettings Parse(IReadOnlyDictionary<string, string> parameters)
    {
        var p = new ParameterReader(KindName, Defaults, parameters);
        return new QubitSteeringSettings(p.Resolved)
        {
            DriveValues = p.DoubleList("drive_values", 2, 16, -100, 100),
            Slices = p.Int("slices", 1, 10_000),
            SliceDuration = p.Double("slice_duration", 0, 100, minExclusive: true),
            InitialField = p.Double("initial_field", -100, 100),
            TargetField = p.Double("target_field", -100, 100),
            Shots = p.Int("shots", 0, 1_000_000),
            ShapedReward = p.Choice("reward", "final", "shaped") == "shaped",
            ObserveTime = p.Bool("observe_time"),
        };
    }

    public override IEnvironment CreateEnvironment() => new QubitSteeringEnvironment(this);
}
