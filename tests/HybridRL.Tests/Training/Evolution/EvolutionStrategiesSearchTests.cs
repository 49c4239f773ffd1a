using HybridRL.Training.Evolution;
using static HybridRL.Tests.Training.Evolution.EvolutionTestKit;

namespace HybridRL.Tests.Training.Evolution;

public class EvolutionStrategiesSearchTests
{
    [Fact]
    public void AntitheticPairsSumToTwiceTheCenter()
    {
        // Salimans et al. 2017, mirrored sampling: members θ + σε and θ − σε, so each pair sums to 2θ.
        double[] x0 = [0.3, -1.2, 2.5, 0.0, 7.0];
        var es = new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(Population: 8, Sigma: 0.1), x0, seed: 4);
        var pop = new double[8 * 5];
        es.Ask(pop);
        for (int i = 0; i < 4; i++)
            for (int j = 0; j < 5; j++)
            {
                Assert.Equal(2 * x0[j], pop[2 * i * 5 + j] + pop[(2 * i + 1) * 5 + j], 14);
                Assert.NotEqual(pop[2 * i * 5 + j], pop[(2 * i + 1) * 5 + j]);
            }
        Assert.All(es.ExtraEpisodes.ToArray(), e => Assert.Equal(0, e));
    }

    [Fact]
    public void GradientEstimateOfOnePairMatchesTheFormula()
    {
        // Salimans et al. 2017, Algorithm 1 with mirrored sampling and centred ranks:
        // one pair with F(θ+σε) > F(θ−σε) has shaped values +0.5, −0.5, so g = (1/(λσ)) (0.5 − (−0.5)) ε = ε/(2σ);
        // with L2 coefficient c the ascent direction is g − cθ.
        double sigma = 0.05, decay = 0.01;
        double[] theta = [0.4, -0.8, 1.5];
        var es = new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(Population: 2, Sigma: sigma, WeightDecay: decay), theta, seed: 8);
        var pop = new double[6];
        es.Ask(pop);
        es.Tell([1.0, 0.0]);
        Assert.Equal([0.5, -0.5], es.ShapedFitness.ToArray());
        for (int j = 0; j < 3; j++)
        {
            double eps = (pop[j] - theta[j]) / sigma;
            Assert.Equal(eps / (2 * sigma) - decay * theta[j], es.AscentGradient(j), 9);
        }
        // Adam's first step moves each coordinate by α along the sign of the ascent gradient (Kingma & Ba 2015, §2).
        for (int j = 0; j < 3; j++)
            Assert.Equal(theta[j] + 0.01 * Math.Sign(es.AscentGradient(j)), es.Center[j], 7);
    }

    [Fact]
    public void EqualFitnessLeavesOnlyWeightDecay()
    {
        // Hand-worked: equal fitness gives equal centred ranks, so the rank term vanishes and the ascent
        // gradient is −cθ (Salimans et al. 2017: L2 coefficient applied to the gradient estimate).
        double[] theta = [2.0, -3.0];
        var es = new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(Population: 6, WeightDecay: 0.005), theta, seed: 1);
        es.Ask(new double[12]);
        es.Tell([1, 1, 1, 1, 1, 1]);
        Assert.Equal(-0.005 * 2.0, es.AscentGradient(0), 15);
        Assert.Equal(-0.005 * -3.0, es.AscentGradient(1), 15);
    }

    [Fact]
    public void MakesClearProgressOnTheSphere()
    {
        // Known minimum 0 at the origin; f(x0) = 10 in 10 dimensions. A fixed budget of 400 generations
        // × 20 members must cut the value by four orders of magnitude (seeds 12–15 reach 6e-5 … 2e-4).
        var es = new EvolutionStrategiesSearch(
            new EvolutionStrategiesSettings(Population: 20, Sigma: 0.05, LearningRate: 0.02, WeightDecay: 0), Filled(10, 1.0), seed: 12);
        Minimise(es, Sphere, maxGenerations: 400);
        double f = Sphere(es.Center);
        Assert.True(f < 10 * 1e-4, $"f(center) = {f}");
        Assert.True(-es.BestFitness <= Sphere(Filled(10, 1.0)));
    }

    [Fact]
    public void RejectsBadSettingsNamingTheKey()
    {
        double[] x = [1, 2];
        Assert.Equal("population", Assert.Throws<ArgumentException>(() => new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(Population: 7), x, 1)).ParamName);
        Assert.Equal("sigma", Assert.Throws<ArgumentException>(() => new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(Sigma: -1), x, 1)).ParamName);
        Assert.Equal("learning_rate", Assert.Throws<ArgumentException>(() => new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(LearningRate: double.NaN), x, 1)).ParamName);
        Assert.Equal("weight_decay", Assert.Throws<ArgumentException>(() => new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(WeightDecay: -0.1), x, 1)).ParamName);
        Assert.Equal("adam_beta1", Assert.Throws<ArgumentException>(() => new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(AdamBeta1: 1), x, 1)).ParamName);
        Assert.Equal("adam_beta2", Assert.Throws<ArgumentException>(() => new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(AdamBeta2: -0.5), x, 1)).ParamName);
        Assert.Equal("adam_epsilon", Assert.Throws<ArgumentException>(() => new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(AdamEpsilon: 0), x, 1)).ParamName);
    }
}
