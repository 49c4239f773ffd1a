using HybridRL.Training;

namespace HybridRL.Tests.Training;

/// <summary>The training benchmark runs end to end and reports every figure (no timing assertions: DESIGN.md, Performance).</summary>
public sealed class TrainingBenchmarkTests
{
    [Fact]
    public void Quick_run_reports_finite_positive_figures()
    {
        var figures = TrainingBenchmark.Run(quick: true);
        foreach (var key in new[] { "dqn_updates_per_second", "env_steps_per_second_acting", "evolution_member_episodes_per_second", "parallel_efficiency_2_cores" })
        {
            Assert.True(figures.TryGetValue(key, out double v), $"missing {key}");
            Assert.True(double.IsFinite(v) && v > 0, $"{key} = {v}");
        }
    }
}
