using HybridRL.Training;
using HybridRL.Training.DeepQ;

namespace HybridRL.Tests.Training;

public class TrainingBudgetTests
{
    [Fact]
    public void FirstLimitReachedEndsTheRun()
    {
        var budget = new TrainingBudget(EnvSteps: 100, Episodes: 5);
        var c = new TrainingCounters { EnvSteps = 40, Episodes = 5 };
        Assert.Equal("episodes", budget.ReachedBy(c));
        c.Episodes = 4;
        Assert.Null(budget.ReachedBy(c));
        Assert.Equal(0.8, budget.Progress(c), 12); // episodes 4/5 is closest to its limit
    }

    [Fact]
    public void ExplorationSchedulesHitTheirEndpoints()
    {
        var lin = new ExplorationSchedule(1.0, 0.1, 100, DecayShape.Linear);
        Assert.Equal(1.0, lin.At(0), 15);
        Assert.Equal(0.55, lin.At(50), 15); // halfway between 1.0 and 0.1
        Assert.Equal(0.1, lin.At(1000), 15);
        var exp = new ExplorationSchedule(1.0, 0.01, 100, DecayShape.Exponential);
        Assert.Equal(0.1, exp.At(50), 12); // geometric midpoint of 1 and 0.01
    }

    [Fact]
    public void CosineLearningRateFallsToItsFloor()
    {
        var lr = new LearningRateSchedule(0.1, LearningRateShape.Cosine, 0.1);
        Assert.Equal(0.1, lr.At(0), 15);
        Assert.Equal(0.01, lr.At(1), 15);
        Assert.Equal(0.1 * (0.1 + 0.9 * 0.5), lr.At(0.5), 15); // cos(π/2) = 0
    }
}
