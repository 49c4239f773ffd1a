using HybridRL.Environments;

namespace HybridRL.Tests.Environments;

public class CartPoleTests
{
    private static CartPoleEnvironment Make(Dictionary<string, string>? p = null) =>
        (CartPoleEnvironment)EnvironmentFactory.Create("cart-pole", p ?? new Dictionary<string, string>());

    [Fact]
    public void OneStepMatchesThePublishedEquationsWorkedByHand()
    {
        // Barto, Sutton & Anderson (1983), appendix equations, worked by hand (calculator) for
        // x = 0.2, x' = −0.3 (so sgn(x') = −1), θ = 0.1 rad, θ' = 0.5 rad/s, push right F = +10 N:
        //   sinθ = 0.0998334166, cosθ = 0.9950041653, mc + m = 1.1
        //   numerator   = 9.8·0.0998334166 + 0.9950041653·(−10 − 0.1·0.5·0.25·0.0998334166 + 0.0005·(−1))/1.1
        //                 − 0.000002·0.5/(0.1·0.5)                                            = −8.0687260061
        //   denominator = 0.5·(4/3 − 0.1·0.9950041653²/1.1)                                    =  0.6216651535
        //   θ'' = −12.9792155154 rad/s²
        //   x''  = (10 + 0.1·0.5·(0.25·0.0998334166 − (−12.9792155154)·0.9950041653) − 0.0005·(−1))/1.1 = 9.6795150843 m/s²
        // Euler (τ = 0.02): x = 0.2 + 0.02·(−0.3) = 0.194; x' = −0.3 + 0.02·9.6795150843 = −0.1064096983;
        //                   θ = 0.1 + 0.02·0.5 = 0.11;      θ' = 0.5 + 0.02·(−12.9792155154) = 0.2404156897.
        var env = Make();
        var obs = new double[4];
        env.Reset(1, obs);
        env.SetState(0.2, -0.3, 0.1, 0.5);
        var r = env.Step(1, obs);
        Assert.Equal(0.194, obs[0], 12);
        Assert.Equal(-0.10640969831454361, obs[1], 12);
        Assert.Equal(0.11, obs[2], 12);
        Assert.Equal(0.24041568969247945, obs[3], 12);
        Assert.Equal(1.0, r.Reward);
        Assert.False(r.Done);
    }

    [Fact]
    public void FailsPastTwelveDegreesAsTerminalAndCapTruncates()
    {
        var env = Make(new Dictionary<string, string> { ["max_steps"] = "3", ["failure_reward"] = "-1" });
        var obs = new double[4];
        env.Reset(7, obs);
        env.SetState(0, 0, 12.0 * Math.PI / 180 - 1e-4, 1.0);   // θ' = 1 rad/s crosses 12° within one 0.02 s step
        var r = env.Step(1, obs);
        Assert.True(r.Terminal);
        Assert.False(r.Truncated);
        Assert.Equal(-1.0, r.Reward);
        Assert.Throws<InvalidOperationException>(() => env.Step(0, obs));

        env.Reset(7, obs);
        env.SetState(0, 0, 0, 0);
        Assert.False(env.Step(0, obs).Done);
        Assert.False(env.Step(1, obs).Done);
        var last = env.Step(0, obs);
        Assert.True(last.Truncated);     // time limit: not a terminal state
        Assert.False(last.Terminal);
    }

    [Fact]
    public void LeavingTheTrackIsTerminal()
    {
        var env = Make();
        var obs = new double[4];
        env.Reset(3, obs);
        env.SetState(2.399, 1.0, 0, 0);
        Assert.True(env.Step(1, obs).Terminal);  // x = 2.399 + 0.02 > 2.4 m
    }

    [Fact]
    public void SameSeedSameEpisodeAndRestoreReproducesTrajectory()
    {
        var a = Make();
        var b = Make();
        var oa = new double[4];
        var ob = new double[4];
        a.Reset(42, oa);
        b.Reset(42, ob);
        Assert.Equal(oa, ob);
        Assert.All(oa, v => Assert.InRange(v, -0.05, 0.05));
        b.Reset(43, ob);
        Assert.NotEqual(oa, ob);
        TrajectoryAssert.RestoreReproduces(a, 42, t => t % 3 == 0 ? 1 : 0, 5, 20);
    }
}
