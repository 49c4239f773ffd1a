using HybridRL.Environments;

namespace HybridRL.Tests.Environments;

public class ValueIterationTests
{
    private static Dictionary<string, string> Warehouse(string map, string slip, string cost, string hole = "1") => new()
    {
        ["map"] = map, ["slip_probability"] = slip, ["step_cost"] = cost, ["dock_reward"] = "1", ["hole_penalty"] = hole,
    };

    [Fact]
    public void CorridorMatchesHandWorkedValues()
    {
        // Map "R.D" (one row). Hand-worked (Bellman optimality, Sutton & Barto 2018 eq. 4.1) with slip p = 0.2,
        // step cost c = 0.1, dock reward 1, gamma = 0.9. Moving east: 0.8 east, 0.1 north + 0.1 south bump (stay).
        // Middle: V_m = 0.8(1 − c) + 0.2(−c + γ V_m)  →  V_m = (0.8 − c) / (1 − 0.2γ) = 0.7 / 0.82.
        // Start:  V_R = 0.8(−c + γ V_m) + 0.2(−c + γ V_R) →  V_R = (0.8 γ V_m − c) / (1 − 0.2γ).
        var settings = (SlipperyWarehouseSettings)EnvironmentFactory.Parse("slippery-warehouse", Warehouse("R.D", "0.2", "0.1"));
        var result = ValueIteration.Solve(settings.ToTabularModel(), 0.9);
        double vm = 0.7 / 0.82;
        double vr = (0.8 * 0.9 * vm - 0.1) / 0.82;
        Assert.Equal(vr, result.Values[0], 10);
        Assert.Equal(vm, result.Values[1], 10);
        Assert.Equal(0.0, result.Values[2]);            // the dock is terminal
        Assert.Equal(1, result.Policy[0]);               // east
        Assert.Equal(1, result.Policy[1]);
        Assert.Equal(vr, result.OptimalStartReturn, 10);
    }

    [Fact]
    public void PushingIntoAWallAvoidsTheHoleWithoutDiscount()
    {
        // Map (2 x 3), no step cost, gamma = 1, slip p = 0.2:
        //   R.D
        //   .o.
        // Hand-worked: pushing north from the top-middle cell bumps the wall (stay) and slips only west (to R) or east
        // (to the dock), so the hole is never risked and the dock is reached with probability 1: V = 1 everywhere
        // except the hole. The other actions of the top-middle cell (Bellman backup by hand, values V(R) = V(.) = 1):
        //   east:  0.8·(+1) + 0.1·V(stay, north bump) + 0.1·(−1, hole)   = 0.8
        //   west:  0.8·V(R) + 0.1·V(stay)             + 0.1·(−1, hole)   = 0.8
        //   south: 0.8·(−1) + 0.1·(+1, dock)          + 0.1·V(R)         = −0.6
        var settings = (SlipperyWarehouseSettings)EnvironmentFactory.Parse("slippery-warehouse", Warehouse("R.D/.o.", "0.2", "0"));
        var model = settings.ToTabularModel();
        var result = ValueIteration.Solve(model, 1.0);
        int middle = settings.Map.StateOf(0, 1);
        foreach (var (r, c) in new[] { (0, 0), (0, 1), (1, 0), (1, 2) })
            Assert.Equal(1.0, result.Values[settings.Map.StateOf(r, c)], 9);   // hand-worked above
        Assert.Equal(1.0, result.ActionValues[middle * 4 + 0], 9);   // north
        Assert.Equal(0.8, result.ActionValues[middle * 4 + 1], 9);   // east
        Assert.Equal(-0.6, result.ActionValues[middle * 4 + 2], 9);  // south
        Assert.Equal(0.8, result.ActionValues[middle * 4 + 3], 9);   // west
        Assert.Equal(0, result.Policy[middle]);
    }

    [Fact]
    public void PolicyEvaluationMatchesHandWorkedReturns()
    {
        // "R.D", p = 0.2, c = 0.1, gamma = 0.9.
        var settings = (SlipperyWarehouseSettings)EnvironmentFactory.Parse("slippery-warehouse", Warehouse("R.D", "0.2", "0.1"));
        var model = settings.ToTabularModel();
        // Always west: the robot never moves from R (west bumps the wall, slips bump north/south):
        // V = −c + γ V  →  V = −c / (1 − γ) = −1 (hand-worked, geometric series).
        Assert.Equal(-1.0, PolicyEvaluation.Evaluate(model, _ => 3, 0.9), 10);
        // Always east equals the optimal value from the hand-worked corridor case.
        double vm = 0.7 / 0.82, vr = (0.8 * 0.9 * vm - 0.1) / 0.82;
        Assert.Equal(vr, PolicyEvaluation.Evaluate(model, _ => 1, 0.9), 10);
        // The optimal policy of value iteration evaluates to the optimal start return (exact DP, two methods agree).
        var vi = ValueIteration.Solve(model, 0.9);
        Assert.Equal(vi.OptimalStartReturn, PolicyEvaluation.Evaluate(model, vi.Policy, 0.9), 10);
    }

    [Fact]
    public void PolicyEvaluationRejectsNonTerminatingPolicyWithoutDiscount()
    {
        var settings = (SlipperyWarehouseSettings)EnvironmentFactory.Parse("slippery-warehouse", Warehouse("R.D", "0.2", "0.1"));
        var e = Assert.Throws<InvalidOperationException>(() => PolicyEvaluation.Evaluate(settings.ToTabularModel(), _ => 3, 1.0));
        Assert.Contains("never terminates", e.Message);
    }

    [Fact]
    public void BuilderRejectsProbabilitiesThatDoNotSumToOne()
    {
        var b = new TabularModelBuilder(2, 1).AddTransition(0, 0, 1, 0.5, 0).SetTerminal(1).SetStartProbability(0, 1);
        Assert.Throws<InvalidOperationException>(() => b.Build());
    }

    [Theory]
    [InlineData("dock-3x4")]
    [InlineData("dock-4x4")]
    [InlineData("aisles-5x6")]
    [InlineData("loading-bay-8x8")]
    public void BuiltInMapsSolveAndTheirOptimalPolicyEvaluatesToTheOptimum(string name)
    {
        var settings = EnvironmentFactory.Parse("slippery-warehouse", new Dictionary<string, string> { ["map"] = name });
        var model = settings.ToTabularModel()!;
        var vi = ValueIteration.Solve(model, 0.99);
        // Exact DP cross-check: the linear-solve evaluation of the greedy policy reproduces V* at the start.
        Assert.Equal(vi.OptimalStartReturn, PolicyEvaluation.Evaluate(model, vi.Policy, 0.99), 8);
        Assert.True(vi.OptimalStartReturn > 0, $"{name}: the dock should be worth reaching");
    }

    [Fact]
    public void SolutionTextShowsReturnAndMoves()
    {
        var solution = TabularSolution.Solve("slippery-warehouse", Warehouse("R.D", "0.2", "0.1"), 0.9);
        string text = solution.Format();
        Assert.Contains("optimal expected return from the start: " + ((0.8 * 0.9 * (0.7 / 0.82) - 0.1) / 0.82).ToString("F6", System.Globalization.CultureInfo.InvariantCulture), text);
        Assert.Contains(">>D", text);
        Assert.Throws<EnvironmentConfigException>(() => TabularSolution.Solve("cart-pole", new Dictionary<string, string>(), 0.9));
    }
}
