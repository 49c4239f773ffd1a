using HybridRL.Tests.Support;

namespace HybridRL.Tests.Resume;

/// <summary>An evolution run gives the same metrics rows and final parameters with one worker thread as with two (DESIGN.md, Determinism).</summary>
public sealed class ThreadCountDeterminismTests
{
    [Fact]
    public void GeneticRunIsIdenticalForOneAndTwoThreads()
    {
        var one = ResumeScenario.For("genetic").With("model.simulation.threads=1", "experiment.budget.generations=15");
        var two = ResumeScenario.For("genetic").With("model.simulation.threads=2", "experiment.budget.generations=15");
        using var tmp = new TempDirectory();
        string config = one.WriteConfig(tmp.Path);
        one.RunToEnd(config, tmp.Combine("t1"));
        two.RunToEnd(config, tmp.Combine("t2"));
        var a = ResumeRunResult.Read(one.RunDir(tmp.Combine("t1")));
        var b = ResumeRunResult.Read(two.RunDir(tmp.Combine("t2")));
        Assert.Equal(a.MetricsRows, b.MetricsRows);
        Assert.Equal(a.FinalReturn, b.FinalReturn);
        Assert.Equal(a.Sections["model.center"], b.Sections["model.center"]);
        Assert.Equal(a.Sections["search"], b.Sections["search"]);
    }
}
