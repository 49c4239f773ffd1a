using HybridRL.Tests.Config;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary>`hybridrl env solve` and `hybridrl env list`.</summary>
[Collection(ConsoleCollection.Name)]
public sealed class EnvCliTests
{
    private static readonly string Quickstart = ConfigTestPaths.SmallWarehouseDqn;

    [Fact]
    public void Solve_prints_the_optimal_return_of_the_built_in_dock_map()
    {
        var (code, stdout, stderr) = InProcessCli.Run("env", "solve", Quickstart, "--gamma", "0.99");
        Assert.True(code == 0, stderr);
        // Exact value iteration (Sutton & Barto 2018 §4.4) on dock-3x4 with the Russell & Norvig 0.8/0.1/0.1 slip
        // model, step cost 0.01: 0.474298 at γ = 0.99 (the environment helper's value iteration).
        Assert.Contains("optimal expected return from the start: 0.474298", stdout);
        Assert.Contains("discount (gamma): 0.99", stdout);
    }

    [Fact]
    public void Solve_matches_a_hand_computed_two_cell_map()
    {
        using var tmp = new TempDirectory();
        var (code, stdout, stderr) = InProcessCli.Run("env", "solve", Quickstart, "--set", "environment.map=RD", "--gamma", "0.9");
        Assert.True(code == 0, stderr);
        // Hand-worked: map "RD", moving east reaches the dock with 0.8; the two perpendicular slips (0.1 each) hit the
        // boundary and stay. V = 0.8·(1 − 0.01) + 0.2·(−0.01 + 0.9·V) ⇒ V = 0.79 / 0.82 = 0.963415 (6 d.p.).
        Assert.Contains("optimal expected return from the start: 0.963415", stdout);
    }

    [Fact]
    public void Solve_defaults_to_the_dqn_discount()
    {
        var (code, stdout, stderr) = InProcessCli.Run("env", "solve", Quickstart);
        Assert.True(code == 0, stderr);
        Assert.Contains("discount (gamma): 0.95", stdout);                          // trainer.dqn.gamma in the fixture
    }

    [Fact]
    public void Solve_refuses_non_tabular_kinds_and_bad_discounts_with_exit_2()
    {
        var (code, _, stderr) = InProcessCli.Run("env", "solve", Path.Combine(ConfigTestPaths.ConfigsFolder, "cartpole-dqn.yaml"));
        Assert.Equal(2, code);
        Assert.Contains("'cart-pole' has no exact tabular model", stderr);
        (code, _, stderr) = InProcessCli.Run("env", "solve", Quickstart, "--gamma", "1.5");
        Assert.Equal(2, code);
        Assert.Contains("--gamma", stderr);
    }

    [Fact]
    public void List_shows_every_kind_with_its_defaults()
    {
        var (code, stdout, stderr) = InProcessCli.Run("env", "list");
        Assert.True(code == 0, stderr);
        foreach (var kind in HybridRL.Environments.EnvironmentFactory.Kinds) Assert.Contains(kind + "\n", stdout);
        Assert.Contains("  map: dock-3x4\n", stdout);
        Assert.Contains("  slip_probability: 0.2\n", stdout);
    }
}
