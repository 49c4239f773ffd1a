using HybridRL.Training.Evolution;
using static HybridRL.Tests.Training.Evolution.EvolutionTestKit;

namespace HybridRL.Tests.Training.Evolution;

/// <summary>Exact resume: save after k generations, load into a fresh instance, continue — bit-identical to an uninterrupted run.</summary>
public class EvolutionCheckpointTests
{
    public static TheoryData<string> Methods => ["genetic", "genetic-crossover", "es", "cma-full", "cma-diagonal"];

    private static IEvolutionStrategy Build(string method, double[] x0) => method switch
    {
        "genetic" => EvolutionStrategyFactory.Create(EvolutionKind.Genetic, new GeneticSearchSettings(Population: 12, Truncation: 4, MutationSigma: 0.1, Elites: 2, EliteEpisodes: 3), x0, 77),
        "genetic-crossover" => EvolutionStrategyFactory.Create(new GeneticSearchSettings(Population: 12, Truncation: 4, MutationSigma: 0.1, Elites: 1, Crossover: 0.5), x0, 77),
        "es" => EvolutionStrategyFactory.Create(EvolutionKind.EvolutionStrategies, new EvolutionStrategiesSettings(Population: 10, Sigma: 0.1, LearningRate: 0.05), x0, 77),
        "cma-full" => EvolutionStrategyFactory.Create(EvolutionKind.CmaEs, new CmaEsSettings(Sigma0: 0.5, Covariance: CmaCovarianceMode.Full), x0, 77),
        "cma-diagonal" => EvolutionStrategyFactory.Create(EvolutionKind.CmaEs, new CmaEsSettings(Sigma0: 0.5, Covariance: CmaCovarianceMode.Diagonal), x0, 77),
        _ => throw new ArgumentOutOfRangeException(nameof(method)),
    };

    /// <summary>Runs generations, recording every asked population and the told fitness.</summary>
    private static List<double[]> Run(IEvolutionStrategy es, int generations)
    {
        var log = new List<double[]>();
        int n = es.Dimension;
        for (int g = 0; g < generations; g++)
        {
            var pop = new double[es.PopulationSize * n];
            es.Ask(pop);
            var fit = new double[es.PopulationSize];
            for (int k = 0; k < fit.Length; k++) fit[k] = -Rosenbrock(pop.AsSpan(k * n, n));
            es.Tell(fit);
            log.Add(pop);
            log.Add(fit);
        }
        return log;
    }

    private static byte[] Save(IEvolutionStrategy es)
    {
        using var ms = new MemoryStream();
        using (var w = new BinaryWriter(ms, System.Text.Encoding.UTF8, leaveOpen: true)) es.Save(w);
        return ms.ToArray();
    }

    private static void Load(IEvolutionStrategy es, byte[] state)
    {
        using var r = new BinaryReader(new MemoryStream(state));
        es.Load(r);
        Assert.Equal(state.Length, r.BaseStream.Position); // the whole checkpoint is consumed
    }

    private static void AssertSameState(IEvolutionStrategy a, IEvolutionStrategy b)
    {
        Assert.Equal(a.Generation, b.Generation);
        Assert.Equal(a.StepSize, b.StepSize);
        Assert.Equal(a.BestFitness, b.BestFitness);
        Assert.Equal(a.Best.ToArray(), b.Best.ToArray());
        Assert.Equal(a.Center.ToArray(), b.Center.ToArray());
        Assert.Equal(Save(a), Save(b)); // complete state, byte for byte
    }

    [Theory]
    [MemberData(nameof(Methods))]
    public void ResumeAfterTellIsBitIdentical(string method)
    {
        double[] x0 = [-1.0, 0.5, 2.0, 0.0, 1.0, -0.5];
        var uninterrupted = Build(method, x0);
        var expected = Run(uninterrupted, 25);

        var first = Build(method, x0);
        var head = Run(first, 10);
        byte[] state = Save(first);
        var resumed = Build(method, x0);
        Load(resumed, state);
        var tail = Run(resumed, 15);

        var combined = head.Concat(tail).ToList();
        Assert.Equal(expected.Count, combined.Count);
        for (int i = 0; i < expected.Count; i++) Assert.Equal(expected[i], combined[i]); // exact double equality
        AssertSameState(uninterrupted, resumed);
    }

    [Theory]
    [MemberData(nameof(Methods))]
    public void ResumeBetweenAskAndTellReturnsThePendingGeneration(string method)
    {
        double[] x0 = [0.3, 0.3, 0.3, 0.3];
        var a = Build(method, x0);
        Run(a, 4);
        var pending = new double[a.PopulationSize * 4];
        a.Ask(pending);
        var again = new double[pending.Length];
        a.Ask(again);
        Assert.Equal(pending, again); // asking twice does not draw a new generation
        byte[] state = Save(a);
        var b = Build(method, x0);
        Load(b, state);
        var resumedPending = new double[pending.Length];
        b.Ask(resumedPending);
        Assert.Equal(pending, resumedPending);
        Assert.Equal(a.ExtraEpisodes.ToArray(), b.ExtraEpisodes.ToArray());
        var fit = Enumerable.Range(0, a.PopulationSize).Select(k => -Sphere(pending.AsSpan(k * 4, 4))).ToArray();
        a.Tell(fit);
        b.Tell(fit);
        Assert.Equal(Run(a, 5), Run(b, 5));
        AssertSameState(a, b);
    }

    [Fact]
    public void LoadRejectsAnotherMethodOrOtherSettings()
    {
        double[] x0 = [1.0, 2.0, 3.0];
        byte[] esState = Save(Build("es", x0));
        Assert.Throws<InvalidDataException>(() => Load(Build("cma-full", x0), esState));
        var otherSigma = EvolutionStrategyFactory.Create(new EvolutionStrategiesSettings(Population: 10, Sigma: 0.2, LearningRate: 0.05), x0, 77);
        Assert.Throws<InvalidDataException>(() => Load(otherSigma, esState));
        var otherDimension = Build("es", [1.0, 2.0]);
        Assert.Throws<InvalidDataException>(() => Load(otherDimension, esState));
    }

    [Fact]
    public void FactoryChecksThatSettingsMatchTheKind()
    {
        var ex = Assert.Throws<ArgumentException>(() => EvolutionStrategyFactory.Create(EvolutionKind.CmaEs, new GeneticSearchSettings(), [1.0], 1));
        Assert.Equal("settings", ex.ParamName);
        Assert.IsType<CmaEvolutionStrategy>(EvolutionStrategyFactory.Create(EvolutionKind.CmaEs, new CmaEsSettings(), [1.0], 1));
    }

    [Fact]
    public void TellWithoutAskOrWithWrongLengthsIsRejected()
    {
        var es = Build("cma-full", [1.0, 2.0]);
        Assert.Throws<InvalidOperationException>(() => es.Tell(new double[es.PopulationSize]));
        Assert.Equal("population", Assert.Throws<ArgumentException>(() => es.Ask(new double[3])).ParamName);
        es.Ask(new double[es.PopulationSize * 2]);
        Assert.Equal("fitness", Assert.Throws<ArgumentException>(() => es.Tell(new double[1])).ParamName);
    }
}
