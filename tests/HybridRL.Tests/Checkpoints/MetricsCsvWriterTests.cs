using HybridRL.Tests.Support;
using HybridRL.Training;
using HybridRL.Experiments.Runs;

namespace HybridRL.Tests.Checkpoints;

public class MetricsCsvWriterTests
{
    private static MetricsRow Row(int i) => new() { EnvSteps = 100L * i, Episodes = i, Updates = 25L * i, WallSeconds = 0.1 * i, TrainReturn = -1.0 / 3.0, Epsilon = 0.5, CircuitExecutions = 4_000L * i, ParameterCount = 42 };

    [Fact]
    public void WritesTheContractHeaderAndRoundTripFormattedRows()
    {
        using var tmp = new TempDirectory();
        string p = tmp.Combine("metrics.csv");
        using (var w = MetricsCsvWriter.Create(p))
        {
            w.Append(Row(1));
            w.Append(new MetricsRow { Generations = 3, FitnessMean = 1e-300, FitnessBest = double.MaxValue, Sigma = 0.1 });
            Assert.Equal(2, w.RowsWritten);
        }
        string[] lines = File.ReadAllLines(p);
        Assert.Equal("env_steps,episodes,updates,generations,wall_seconds,train_return,eval_return,loss,fitness_mean,fitness_best,fitness_std,epsilon,sigma,circuit_executions,shots,hardware_executions,parameter_count", lines[0]);
        Assert.Equal("100,1,25,,0.1,-0.3333333333333333,,,,,,0.5,,4000,,,42", lines[1]);
        Assert.Equal(",,,3,,,,,1E-300,1.7976931348623157E+308,,,0.1,,,,", lines[2]);
        string[] f = lines[1].Split(',');
        Assert.Equal(17, f.Length);
        Assert.Equal(-1.0 / 3.0, double.Parse(f[5], System.Globalization.CultureInfo.InvariantCulture)); // "R" round-trips exactly
        Assert.Equal(2, MetricsCsvWriter.CountRows(p));
    }

    [Fact]
    public void ResumeTruncatesToTheCheckpointCursorSoRowsAreNotDuplicated()
    {
        using var tmp = new TempDirectory();
        string p = tmp.Combine("metrics.csv");
        int cursor;
        using (var w = MetricsCsvWriter.Create(p))
        {
            for (int i = 1; i <= 3; i++) w.Append(Row(i));
            w.FlushToDisk();
            cursor = w.RowsWritten; // checkpoint written here
            for (int i = 4; i <= 5; i++) w.Append(Row(i)); // logged after the checkpoint, then the job is killed
        }
        File.AppendAllText(p, "600,6,15"); // and a half-written line

        using (var w = MetricsCsvWriter.OpenForResume(p, cursor))
        {
            Assert.Equal(3, w.RowsWritten);
            for (int i = 4; i <= 5; i++) w.Append(Row(i)); // the resumed run logs the same intervals again
            Assert.Equal(5, w.RowsWritten);
        }
        string[] lines = File.ReadAllLines(p);
        Assert.Equal(6, lines.Length);
        Assert.Equal(new[] { "100", "200", "300", "400", "500" }, lines.Skip(1).Select(l => l.Split(',')[0]));
    }

    [Fact]
    public void TruncateToRowsCanGoBackToTheHeader()
    {
        using var tmp = new TempDirectory();
        string p = tmp.Combine("metrics.csv");
        using var w = MetricsCsvWriter.Create(p);
        w.Append(Row(1));
        w.Append(Row(2));
        w.TruncateToRows(1);
        w.Append(Row(9));
        w.TruncateToRows(0);
        Assert.Equal(0, w.RowsWritten);
        w.Append(Row(7));
        w.FlushToDisk();
        Assert.Equal(new[] { MetricsCsvWriter.Header, "700,7,175,,0.7000000000000001,-0.3333333333333333,,,,,,0.5,,28000,,,42" }, File.ReadAllLines(p));
    }

    [Fact]
    public void BadResumeInputsGiveClearErrors()
    {
        using var tmp = new TempDirectory();
        string p = tmp.Combine("metrics.csv");
        using (var w = MetricsCsvWriter.Create(p)) w.Append(Row(1));

        var ahead = Assert.Throws<InvalidDataException>(() => MetricsCsvWriter.OpenForResume(p, 4));
        Assert.Contains("holds 1 complete rows but 4 were requested", ahead.Message);
        Assert.Contains(p, ahead.Message);

        string other = tmp.Combine("other.csv");
        File.WriteAllText(other, "a,b,c\n1,2,3\n");
        var header = Assert.Throws<InvalidDataException>(() => MetricsCsvWriter.OpenForResume(other, 1));
        Assert.Contains("expected header", header.Message);

        Assert.Throws<InvalidDataException>(() => MetricsCsvWriter.OpenForResume(tmp.Combine("missing.csv"), 2));
        using var fresh = MetricsCsvWriter.OpenForResume(tmp.Combine("missing.csv"), 0);
        Assert.Equal(0, fresh.RowsWritten);
    }
}
