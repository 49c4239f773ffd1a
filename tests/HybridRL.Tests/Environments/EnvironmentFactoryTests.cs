using HybridRL.Environments;

namespace HybridRL.Tests.Environments;

public class EnvironmentFactoryTests
{
    [Fact]
    public void UnknownKeyIsNamedWithSuggestionAndKnownKeys()
    {
        var e = Assert.Throws<EnvironmentConfigException>(() =>
            EnvironmentFactory.Create("slippery-warehouse", new Dictionary<string, string> { ["slip_probabilty"] = "0.1" }));
        Assert.Equal("slip_probabilty", e.Key);
        Assert.Contains("Did you mean 'slip_probability'?", e.Message);
        Assert.Contains("step_cost", e.Message);
    }

    [Theory]
    [InlineData("slippery-warehouse", "slip_probability", "1.5")]
    [InlineData("slippery-warehouse", "max_steps", "0")]
    [InlineData("slippery-warehouse", "observation", "pixels")]
    [InlineData("cart-pole", "max_steps", "ten")]
    [InlineData("survey-drone", "window", "4")]
    [InlineData("qubit-steering", "drive_values", "1")]
    [InlineData("qubit-steering", "shots", "-3")]
    [InlineData("external", "timeout_seconds", "0")]
    public void OutOfRangeValueNamesKeyAndValue(string kind, string key, string value)
    {
        var e = Assert.Throws<EnvironmentConfigException>(() => EnvironmentFactory.Parse(kind, new Dictionary<string, string> { [key] = value, ["command"] = "python3 x.py" }.Where(p => kind == "external" || p.Key != "command").ToDictionary()));
        Assert.Equal(key, e.Key);
        Assert.Contains(value, e.Message);
    }

    [Fact]
    public void UnknownKindSuggestsNearest()
    {
        var e = Assert.Throws<EnvironmentConfigException>(() => EnvironmentFactory.Create("cart-pol", new Dictionary<string, string>()));
        Assert.Equal("kind", e.Key);
        Assert.Contains("cart-pole", e.Message);
    }

    [Fact]
    public void BadMapNamesTheKeyAndPosition()
    {
        var e = Assert.Throws<EnvironmentConfigException>(() => EnvironmentFactory.Parse("slippery-warehouse", new Dictionary<string, string> { ["map"] = "R.X/..D" }));
        Assert.Equal("map", e.Key);
        Assert.Contains("column 3", e.Message);
        Assert.Throws<EnvironmentConfigException>(() => EnvironmentFactory.Parse("slippery-warehouse", new Dictionary<string, string> { ["map"] = "R../.D" }));
    }

    [Fact]
    public void DefaultsAreCompleteAndResolvedValuesIncludeThem()
    {
        foreach (var kind in EnvironmentFactory.Kinds)
        {
            Assert.Equal(EnvironmentFactory.KnownKeys(kind), EnvironmentFactory.Defaults(kind).Keys.OrderBy(k => k, StringComparer.Ordinal));
            if (kind == "external") continue;
            var s = EnvironmentFactory.Parse(kind, new Dictionary<string, string>());
            Assert.Equal(EnvironmentFactory.KnownKeys(kind), s.Values.Keys);
            using var env = s.CreateEnvironment();
            Assert.Equal(kind, env.Name);
        }
        var w = EnvironmentFactory.Parse("slippery-warehouse", new Dictionary<string, string> { ["kind"] = "slippery-warehouse", ["step_cost"] = "0.05" });
        Assert.Equal("0.05", w.Values["step_cost"]);
        Assert.Equal("0.2", w.Values["slip_probability"]);
        Assert.Throws<EnvironmentConfigException>(() => EnvironmentFactory.Parse("external", new Dictionary<string, string>()));
    }

    [Fact]
    public void VectorEnvironmentIsIndependentOfCopyCountAndRestoresExactly()
    {
        var settings = EnvironmentFactory.Parse("slippery-warehouse", new Dictionary<string, string> { ["map"] = "dock-4x4", ["max_steps"] = "8" });
        using var four = new VectorEnvironment(4, settings);
        using var two = new VectorEnvironment(2, settings);
        four.Reset(99);
        two.Reset(99);
        var results4 = new StepResult[4];
        var results2 = new StepResult[2];
        int[] actions4 = new int[4], actions2 = new int[2];
        for (int t = 0; t < 30; t++)
        {
            for (int i = 0; i < 4; i++) actions4[i] = (t + i) % 4;
            actions2[0] = actions4[0]; actions2[1] = actions4[1];
            four.Step(actions4, results4);
            two.Step(actions2, results2);
            // Copies 0 and 1 see the same stream of episodes whatever the number of copies.
            Assert.Equal(four.Observations[..(2 * four.ObservationSize)].ToArray(), two.Observations.ToArray());
            for (int i = 0; i < 4; i++)
                if (results4[i].Done) Assert.Equal(1.0, four.FinalObservation(i).ToArray().Sum());   // one-hot final observation kept
        }
        Assert.True(four.CompletedEpisodes > 0);

        var ms = new MemoryStream();
        using (var wr = new BinaryWriter(ms, System.Text.Encoding.UTF8, true)) four.SaveState(wr);
        var after = new List<double[]>();
        for (int t = 0; t < 20; t++) { four.Step(actions4, results4); after.Add(four.Observations.ToArray()); }
        using var restored = new VectorEnvironment(4, settings);
        ms.Position = 0;
        using (var rd = new BinaryReader(ms)) restored.LoadState(rd);
        for (int t = 0; t < 20; t++) { restored.Step(actions4, results4); Assert.Equal(after[t], restored.Observations.ToArray()); }
    }

    [Fact]
    public void StepAllocatesNothing()
    {
        foreach (var kind in new[] { "cart-pole", "slippery-warehouse", "survey-drone", "qubit-steering" })
        {
            using var env = EnvironmentFactory.Create(kind, kind == "qubit-steering" ? new Dictionary<string, string> { ["slices"] = "10000", ["shots"] = "10" } : new Dictionary<string, string> { ["max_steps"] = "100000" });
            var obs = new double[env.ObservationSize];
            env.Reset(1, obs);
            for (int t = 0; t < 10; t++) if (env.Step(t % 2, obs).Done) env.Reset(2, obs);
            long before = GC.GetAllocatedBytesForCurrentThread();
            int steps = 0;
            for (int t = 0; t < 1000; t++) { var r = env.Step(t % 2, obs); steps++; if (r.Done) break; }
            Assert.Equal(0, GC.GetAllocatedBytesForCurrentThread() - before);
            Assert.True(steps > 0);
        }
    }
}
