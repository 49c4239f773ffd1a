using HybridRL.Environments;

namespace HybridRL.Tests.Environments;

public class GridTaskTests
{
    [Fact]
    public void WarehouseEpisodeIsDeterministicUnderSeed()
    {
        var p = new Dictionary<string, string> { ["map"] = "dock-4x4" };
        var a = EnvironmentFactory.Create("slippery-warehouse", p);
        var b = EnvironmentFactory.Create("slippery-warehouse", p);
        Assert.Equal(Play(a, 11), Play(b, 11));
        Assert.NotEqual(Play(a, 11), Play(a, 12));
    }

    private static string Play(IEnvironment env, ulong seed)
    {
        var obs = new double[env.ObservationSize];
        env.Reset(seed, obs);
        var trace = new System.Text.StringBuilder();
        for (int t = 0; t < 60; t++)
        {
            var r = env.Step(t % 4, obs);
            trace.Append(env.StateIndex).Append(':').Append(r.Reward).Append(r.Terminal ? 'T' : r.Truncated ? 't' : '-').Append(' ');
            if (r.Done) break;
        }
        return trace.ToString();
    }

    [Fact]
    public void SlipFrequenciesFollowTheEightyTenTenModel()
    {
        // Russell & Norvig (AIMA ch. 17): 0.8 intended, 0.1 each perpendicular. Map "./R/." with west/east blocked by
        // '#': pushing north reaches the top cell with p = 0.8; slips east/west bump (stay) with 0.2.
        var env = EnvironmentFactory.Create("slippery-warehouse", new Dictionary<string, string> { ["map"] = "#D#/#R#/#.#" });
        var obs = new double[env.ObservationSize];
        int n = 20_000, reached = 0;
        for (int i = 0; i < n; i++)
        {
            env.Reset((ulong)i, obs);
            if (env.Step(0, obs).Terminal) reached++;
        }
        // Binomial(20000, 0.8): standard deviation √(n·0.8·0.2) ≈ 57; allow 5 standard deviations (common practice).
        Assert.InRange(reached, 16_000 - 283, 16_000 + 283);
    }

    [Fact]
    public void HoleIsTerminalWithPenaltyAndTimeLimitTruncates()
    {
        var env = EnvironmentFactory.Create("slippery-warehouse",
            new Dictionary<string, string> { ["map"] = "Ro/.D", ["slip_probability"] = "0", ["step_cost"] = "0.25", ["hole_penalty"] = "2", ["max_steps"] = "2" });
        var obs = new double[env.ObservationSize];
        env.Reset(1, obs);
        var r = env.Step(1, obs);           // east into the hole
        Assert.True(r.Terminal);
        Assert.Equal(-2.25, r.Reward);      // −step_cost − hole_penalty
        env.Reset(1, obs);
        Assert.False(env.Step(0, obs).Done); // north: bump
        var cut = env.Step(0, obs);
        Assert.True(cut.Truncated);
        Assert.False(cut.Terminal);
        Assert.Equal(-0.25, cut.Reward);
    }

    [Fact]
    public void ObservationEncodingsAndStateIndex()
    {
        foreach (var (mode, size, binary) in new[] { ("one-hot", 11, true), ("binary", 4, true), ("coordinates", 2, false) })
        {
            var env = EnvironmentFactory.Create("slippery-warehouse", new Dictionary<string, string> { ["observation"] = mode });
            Assert.Equal(size, env.ObservationSize);
            Assert.Equal(binary, env.ObservationIsBinary);
            Assert.Equal(11, env.StateCount);   // dock-3x4 has one blocked cell of 12
            var obs = new double[size];
            env.Reset(5, obs);
            Assert.Equal(0, env.StateIndex);     // 'R' is the first cell
            if (mode == "one-hot") Assert.Equal(1.0, obs[0]);
            if (mode == "binary") Assert.Equal(new double[] { 0, 0, 0, 0 }, obs);
        }
    }

    [Fact]
    public void WarehouseRestoreReproducesTrajectory()
    {
        var p = new Dictionary<string, string> { ["map"] = "aisles-5x6", ["max_steps"] = "15" };
        var env = EnvironmentFactory.Create("slippery-warehouse", p);
        TrajectoryAssert.RestoreReproduces(env, 9, t => (t * 7) % 4, 6, 40, () => EnvironmentFactory.Create("slippery-warehouse", p));
    }

    [Fact]
    public void SurveyDroneSeesWindowOneHotAndRestoresVisitedMarks()
    {
        var p = new Dictionary<string, string> { ["seed_map"] = "3" };
        var env = (SurveyDroneEnvironment)EnvironmentFactory.Create("survey-drone", p);
        Assert.Equal(100, env.ObservationSize);   // 5 × 5 window × 4 kinds
        Assert.True(env.ObservationIsBinary);
        var obs = new double[100];
        env.Reset(1, obs);
        for (int cell = 0; cell < 25; cell++)
            Assert.Equal(1.0, obs[(cell * 4)..(cell * 4 + 4)].Sum());   // exactly one kind per window cell
        Assert.Equal(1.0, obs[12 * 4 + 3]);                               // own cell (window centre) is visited
        TrajectoryAssert.RestoreReproduces(env, 4, t => (t * 5 + t / 3) % 4, 10, 30,
            () => EnvironmentFactory.Create("survey-drone", p));
    }

    [Fact]
    public void SurveyMapsAreReproducibleFromTheirSeed()
    {
        var m1 = SurveyMapGenerator.Generate(10, 0.2, 5).ToText();
        var m2 = SurveyMapGenerator.Generate(10, 0.2, 5).ToText();
        var m3 = SurveyMapGenerator.Generate(10, 0.2, 6).ToText();
        Assert.Equal(m1, m2);
        Assert.NotEqual(m1, m3);
    }

    [Fact]
    public void SurveyDroneOracleOnAHandWorkedCorridor()
    {
        // Map "R..D", deterministic moves, reward 1 on the target, gamma = 0.9: the shortest path takes 3 steps and
        // the reward arrives on the third, so V*(start) = γ² = 0.81 (hand-worked).
        var settings = EnvironmentFactory.Parse("survey-drone", new Dictionary<string, string> { ["map"] = "R..D", ["window"] = "3" });
        var vi = ValueIteration.Solve(settings.ToTabularModel()!, 0.9);
        Assert.Equal(0.81, vi.OptimalStartReturn, 12);
        var env = settings.CreateEnvironment();
        var obs = new double[env.ObservationSize];
        env.Reset(0, obs);
        Assert.Equal(1.0, obs[(0 * 3 + 1) * 4 + 1]);   // the cell north of the drone is outside the map: wall
        Assert.False(env.Step(1, obs).Done);
        Assert.False(env.Step(1, obs).Done);
        var r = env.Step(1, obs);
        Assert.True(r.Terminal);
        Assert.Equal(1.0, r.Reward);
    }
}
