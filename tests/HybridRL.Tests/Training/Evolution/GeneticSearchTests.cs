using HybridRL.Training.Evolution;
using static HybridRL.Tests.Training.Evolution.EvolutionTestKit;

namespace HybridRL.Tests.Training.Evolution;

public class GeneticSearchTests
{
    [Fact]
    public void BestMemberIsCarriedOverUnmutatedAndFlaggedForExtraEpisodes()
    {
        // Such et al. 2017: the elite is copied into the next generation unmutated and evaluated again.
        var ga = new GeneticSearch(new GeneticSearchSettings(Population: 6, Truncation: 3, MutationSigma: 0.1, Elites: 2, EliteEpisodes: 5),
            [0.0, 0.0, 0.0], seed: 3);
        var pop = new double[18];
        ga.Ask(pop);
        Assert.Equal([0.0, 0.0, 0.0], pop[..3]); // generation 0: the initial vector, unmutated, in slot 0
        Assert.Equal([5, 0, 0, 0, 0, 0], ga.ExtraEpisodes.ToArray()); // only one distinct elite at generation 0
        double[] fitness = [0.1, 0.5, 0.9, -1, 0.7, 0.2];
        ga.Tell(fitness);
        Assert.Equal(pop[6..9], ga.Center.ToArray()); // slot 2 was best
        Assert.Equal(0.9, ga.BestFitness);
        var next = new double[18];
        ga.Ask(next);
        Assert.Equal(pop[6..9], next[..3]);   // best (slot 2) → elite slot 0, bit-exact
        Assert.Equal(pop[12..15], next[3..6]); // second best (slot 4) → elite slot 1
        Assert.Equal([5, 5, 0, 0, 0, 0], ga.ExtraEpisodes.ToArray());
        // Children are mutants, never exact copies.
        for (int k = 2; k < 6; k++) Assert.NotEqual(next[(k * 3)..(k * 3 + 3)], next[..3]);
    }

    [Fact]
    public void ChildrenDescendFromTheTruncatedParentsOnly()
    {
        // Such et al. 2017, truncation selection: children are parent + σε; with σ tiny and parents far apart,
        // each child lies next to one of the top-T members and never next to a discarded one.
        double sigma = 1e-6;
        var ga = new GeneticSearch(new GeneticSearchSettings(Population: 8, Truncation: 2, MutationSigma: sigma, Elites: 0), [0.0, 0.0], seed: 5);
        var pop = new double[16];
        ga.Ask(pop);
        // Overwrite nothing: instead tell fitness that makes slots 3 and 6 the top two.
        ga.Tell([0, 0, 0, 5, 0, 0, 4, 0]);
        var parents = new[] { pop[6..8], pop[12..14] };
        var next = new double[16];
        ga.Ask(next);
        Assert.Equal(2, ga.ParentCount);
        for (int k = 0; k < 8; k++)
        {
            double dist = parents.Min(p => Math.Sqrt(Math.Pow(next[2 * k] - p[0], 2) + Math.Pow(next[2 * k + 1] - p[1], 2)));
            Assert.True(dist < 10 * sigma, $"child {k} is {dist} from the nearest parent");
        }
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.5)]
    public void MakesClearProgressOnTheSphere(double crossover)
    {
        // Known minimum 0 at the origin; f(x0) = 10 in 10 dimensions. A fixed budget of 300 generations
        // × 50 members must cut the value by three orders of magnitude (seeds 21–24 reach 4e-4 … 8e-4).
        var ga = new GeneticSearch(new GeneticSearchSettings(Population: 50, Truncation: 10, MutationSigma: 0.02, Elites: 1, Crossover: crossover),
            Filled(10, 1.0), seed: 21);
        Minimise(ga, Sphere, maxGenerations: 300);
        double f = Sphere(ga.Center);
        Assert.True(f < 10 * 1e-3, $"f(center) = {f}");
        Assert.True(-ga.BestFitness < 10 * 1e-3);
    }

    [Fact]
    public void RejectsBadSettingsNamingTheKey()
    {
        double[] x = [1, 2];
        Assert.Equal("population", Assert.Throws<ArgumentException>(() => new GeneticSearch(new GeneticSearchSettings(Population: 1), x, 1)).ParamName);
        Assert.Equal("truncation", Assert.Throws<ArgumentException>(() => new GeneticSearch(new GeneticSearchSettings(Population: 4, Truncation: 5), x, 1)).ParamName);
        Assert.Equal("truncation", Assert.Throws<ArgumentException>(() => new GeneticSearch(new GeneticSearchSettings(Truncation: 0), x, 1)).ParamName);
        Assert.Equal("mutation_sigma", Assert.Throws<ArgumentException>(() => new GeneticSearch(new GeneticSearchSettings(MutationSigma: 0), x, 1)).ParamName);
        Assert.Equal("elites", Assert.Throws<ArgumentException>(() => new GeneticSearch(new GeneticSearchSettings(Population: 4, Truncation: 2, Elites: 4), x, 1)).ParamName);
        Assert.Equal("crossover", Assert.Throws<ArgumentException>(() => new GeneticSearch(new GeneticSearchSettings(Crossover: 1.5), x, 1)).ParamName);
        Assert.Equal("elite_episodes", Assert.Throws<ArgumentException>(() => new GeneticSearch(new GeneticSearchSettings(EliteEpisodes: -1), x, 1)).ParamName);
        Assert.Equal("initialParameters", Assert.Throws<ArgumentException>(() => new GeneticSearch(new GeneticSearchSettings(), [double.NaN], 1)).ParamName);
    }
}
