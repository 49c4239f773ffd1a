using HybridRL.Training.Evolution;

namespace HybridRL.Tests.Training.Evolution;

public class VectorAdamTests
{
    [Fact]
    public void TwoStepsMatchKingmaBaAlgorithm1ByHand()
    {
        // Kingma & Ba 2015, Algorithm 1, α = 0.1, β₁ = 0.9, β₂ = 0.999, ε = 1e-8; hand-worked.
        var adam = new VectorAdam(2, 0.1);
        double[] theta = [1, 1];
        adam.Step(theta, [-4, -12]);
        // Step 1: m = 0.1 g, v = 0.001 g², m̂ = g, v̂ = g², θ ← θ − 0.1 g/(|g| + ε) ≈ θ + 0.1.
        Assert.Equal(1 + 0.1 * 4 / (4 + 1e-8), theta[0], 15);
        Assert.Equal(1 + 0.1 * 12 / (12 + 1e-8), theta[1], 15);
        adam.Step(theta, [2, -12]);
        // Step 2, coordinate 0: m = 0.9(−0.4) + 0.1(2) = −0.16, v = 0.999(0.016) + 0.001(4) = 0.019984,
        // m̂ = −0.16/0.19 = −0.842105, v̂ = 0.019984/0.001999 = 9.996998, step = 0.1 × 0.842105/3.161803 = 0.0266337.
        Assert.Equal(1 + 0.1 * 4 / (4 + 1e-8) + 0.0266337, theta[0], 6);
        // Coordinate 1: constant gradient −12 → m̂ = −12, v̂ = 144, step +0.1 again.
        Assert.Equal(1 + 0.2, theta[1], 8);
        Assert.Equal(2, adam.Steps);
    }
}
