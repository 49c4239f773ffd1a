namespace HybridRL.Environments;

/// <summary>Settings of the <c>cart-pole</c> task (see <see cref="CartPoleEnvironment"/>).</summary>
public sealed class CartPoleSettings : EnvironmentSettings
{
    public const string KindName = "cart-pole";

    public static readonly IReadOnlyDictionary<string, string> Defaults = new SortedDictionary<string, string>(StringComparer.Ordinal)
    {
        ["max_steps"] = "500",
        ["initial_spread"] = "0.05",
        ["failure_reward"] = "0",
        ["friction"] = "true",
    };

    private CartPoleSettings(IReadOnlyDictionary<string, string> values) : base(KindName, values) { }

    /// <summary>Episode cap (truncation, not a terminal state).</summary>
    public int MaxSteps { get; private init; }

    /// <summary>Each state variable starts uniform in [−spread, +spread] (0 = the paper's all-zero start).</summary>
    public double InitialSpread { get; private init; }

    /// <summary>Reward of the step on which the pole falls or the cart leaves the track (every other step earns 1).</summary>
    public double FailureReward { get; private init; }

    /// <summary>Whether the paper's cart and pole friction terms are included.</summary>
    public bool Friction { get; private init; }

    public static CartPoleSettings Parse(IReadOnlyDictionary<string, string> parameters)
    {
        var p = new ParameterReader(KindName, Defaults, parameters);
        return new CartPoleSettings(p.Resolved)
        {
            MaxSteps = p.Int("max_steps", 1, 10_000_000),
            InitialSpread = p.Double("initial_spread", 0, 0.2),
            FailureReward = p.Double("failure_reward", -1000, 1000),
            Friction = p.Bool("friction"),
        };
    }

    public override IEnvironment CreateEnvironment() => new CartPoleEnvironment(this);
}
