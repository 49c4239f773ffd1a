using HybridRL.Experiments.Estimation;

namespace HybridRL.Tests.Experiments;

public sealed class SlurmTimeTests
{
    [Theory]
    // Hand-worked: 1.5 × 100 s + 300 s = 450 s → 7.5 min → 8 min.
    [InlineData(100, 1.5, 5, "00:08:00")]
    // 0 s + 5 min = exactly 5 min (no extra minute for an exact value).
    [InlineData(0, 1.5, 5, "00:05:00")]
    // 1.5 × 2 h + 5 min = 3 h 05 min.
    [InlineData(7200, 1.5, 5, "03:05:00")]
    // 1.5 × 20 h = 30 h → 1 day 6 h 05 min in Slurm's days-hours:minutes:seconds form.
    [InlineData(72000, 1.5, 5, "1-06:05:00")]
    // No margin, factor 1: 61 s rounds up to 2 min; 0 s is still at least one minute.
    [InlineData(61, 1, 0, "00:02:00")]
    [InlineData(0, 1, 0, "00:01:00")]
    public void Suggest_RoundsUpToMinutes(double seconds, double factor, double margin, string expected) =>
        Assert.Equal(expected, SlurmTime.Suggest(seconds, factor, margin));

    [Fact]
    public void Suggest_RejectsNegativeOrNaN()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => SlurmTime.Suggest(-1, 1.5, 5));
        Assert.Throws<ArgumentOutOfRangeException>(() => SlurmTime.Suggest(double.NaN, 1.5, 5));
        Assert.Throws<ArgumentOutOfRangeException>(() => SlurmTime.Suggest(10, 0.5, 5));
    }
}
