using HybridRL.Training.DeepQ;

namespace HybridRL.Tests.Training;

public class BellmanTargetsTests
{
    // Hand-built batch of three transitions, two actions, γ = 0.9.
    // Row 0: not terminal; Row 1: terminal; Row 2: truncated by a time limit (not terminal: must bootstrap).
    private static readonly double[] Rewards = [1.0, -1.0, 0.5];
    private static readonly bool[] Terminal = [false, true, false];
    private static readonly double[] NextTarget = [2.0, 3.0, /* row 1 */ 10.0, 20.0, /* row 2 */ 4.0, -1.0];
    private static readonly double[] NextOnline = [5.0, 1.0, /* row 1 */ 0.0, 9.0, /* row 2 */ -2.0, 7.0];

    [Fact]
    public void DqnTargetsEqualHandComputedBellmanTargets()
    {
        var y = new double[3];
        BellmanTargets.Compute(Rewards, Terminal, NextTarget, NextOnline, 2, 0.9, doubleQ: false, y);
        // Mnih et al. 2015: y = r + γ max_a' Q_target(s', a'); terminal: y = r. Worked by hand:
        Assert.Equal(1.0 + 0.9 * 3.0, y[0], 15);   // 3.7
        Assert.Equal(-1.0, y[1], 15);              // terminal: no bootstrap
        Assert.Equal(0.5 + 0.9 * 4.0, y[2], 15);   // truncated still bootstraps: 4.1
    }

    [Fact]
    public void DoubleDqnTargetsUseOnlineArgmaxAndTargetValue()
    {
        var y = new double[3];
        BellmanTargets.Compute(Rewards, Terminal, NextTarget, NextOnline, 2, 0.9, doubleQ: true, y);
        // van Hasselt et al. 2016: y = r + γ Q_target(s', argmax_a' Q_online(s', a')). By hand:
        Assert.Equal(1.0 + 0.9 * 2.0, y[0], 15);   // online argmax is action 0 → Q_target = 2
        Assert.Equal(-1.0, y[1], 15);
        Assert.Equal(0.5 + 0.9 * -1.0, y[2], 15);  // online argmax is action 1 → Q_target = -1
    }

    [Fact]
    public void ArgMaxTakesTheFirstOfTies() => Assert.Equal(1, BellmanTargets.ArgMax([0.0, 2.0, 2.0]));
}
