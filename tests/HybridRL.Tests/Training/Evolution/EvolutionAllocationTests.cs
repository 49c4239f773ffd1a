using HybridRL.Training.Evolution;

namespace HybridRL.Tests.Training.Evolution;

public class EvolutionAllocationTests
{
    public static TheoryData<string> Methods => ["genetic", "es", "cma-diagonal", "cma-full-lazy"];

    private static IEvolutionStrategy Build(string method, double[] x0) => method switch
    {
        "genetic" => new GeneticSearch(new GeneticSearchSettings(Population: 16, Truncation: 4, Elites: 1, Crossover: 0.5), x0, 1),
        "es" => new EvolutionStrategiesSearch(new EvolutionStrategiesSettings(Population: 16), x0, 1),
        "cma-diagonal" => new CmaEvolutionStrategy(new CmaEsSettings(Covariance: CmaCovarianceMode.Diagonal), x0, 1),
        "cma-full-lazy" => new CmaEvolutionStrategy(new CmaEsSettings(Covariance: CmaCovarianceMode.Full), x0, 1),
        _ => throw new ArgumentOutOfRangeException(nameof(method)),
    };

    [Theory]
    [MemberData(nameof(Methods))]
    public void AskAndTellDoNotAllocateBetweenDecompositions(string method)
    {
        // Design rule (hot paths: no per-generation allocation). Measured with the runtime's per-thread counter.
        // For full CMA-ES in 200 dimensions the lazy gap 1/((c₁ + c_μ) n 10) ≈ 2.3 generations (Hansen 2016,
        // Table 1 rates), so some measured generations skip the eigen-decomposition; those must not allocate.
        // (The decomposition itself allocates a small work buffer inside MathNet.Numerics.)
        int n = method == "cma-full-lazy" ? 200 : 60;
        var es = Build(method, new double[n]);
        var pop = new double[es.PopulationSize * n];
        var fit = new double[es.PopulationSize];
        var perGeneration = new List<long>();
        for (int g = 0; g < 12; g++)
        {
            long before = GC.GetAllocatedBytesForCurrentThread();
            es.Ask(pop);
            for (int k = 0; k < fit.Length; k++) fit[k] = -pop[k * n] * pop[k * n] - 0.01 * k;
            es.Tell(fit);
            perGeneration.Add(GC.GetAllocatedBytesForCurrentThread() - before);
        }
        if (method == "cma-full-lazy")
            Assert.Contains(0L, perGeneration.Skip(2));
        else
            Assert.All(perGeneration.Skip(2), bytes => Assert.Equal(0L, bytes));
    }
}
