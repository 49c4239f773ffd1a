using System.Text.Json.Nodes;
using HybridRL.Checkpoints;

namespace HybridRL.Tests.Resume;

/// <summary>
/// What an exact resume must reproduce of a finished run: metrics rows without the wall_seconds column,
/// summary.json without wall_seconds, and every section of the newest checkpoint (the counters section
/// with its wall-clock field blanked).
/// </summary>
public sealed record ResumeRunResult(IReadOnlyList<string> MetricsRows, string Summary, double? FinalReturn, IReadOnlyDictionary<string, byte[]> Sections, string NewestCheckpoint)
{
    /// <summary>Reads a finished run folder.</summary>
    public static ResumeRunResult Read(string runDir)
    {
        var lines = File.ReadAllLines(Path.Combine(runDir, "metrics.csv"));
        var header = lines[0].Split(',');
        int wall = Array.IndexOf(header, "wall_seconds");
        Assert.True(wall >= 0, "metrics.csv has no wall_seconds column");
        var rows = lines.Select(l => string.Join(',', l.Split(',').Where((_, i) => i != wall))).ToList();

        var summary = JsonNode.Parse(File.ReadAllText(Path.Combine(runDir, "summary.json")))!.AsObject();
        Assert.Equal("done", (string?)summary["status"]);
        summary.Remove("wall_seconds");
        double? final = summary["final_return"]?.GetValue<double>();

        var list = CheckpointStore.List(Path.Combine(runDir, "checkpoints"));
        Assert.NotEmpty(list);
        var sections = new Dictionary<string, byte[]>(StringComparer.Ordinal);
        using (var reader = CheckpointReader.Open(list[0].Path))
        {
            foreach (var s in reader.Sections)
            {
                var bytes = reader.ReadSectionBytes(s.Name).ToArray();
                if (s.Name == "counters") BlankWallSeconds(bytes);
                sections[s.Name] = bytes;
            }
        }
        return new ResumeRunResult(rows, summary.ToJsonString(), final, sections, Path.GetFileName(list[0].Path));
    }

    // counters section layout (TrainingCounters.Save): int32 version, 7 × int64 counters, float64 wall seconds, int32 rows.
    private static void BlankWallSeconds(byte[] counters) => Array.Clear(counters, 4 + 7 * 8, 8);

    /// <summary>Asserts bit-identity with <paramref name="expected"/>, naming the first difference.</summary>
    public void AssertSameAs(ResumeRunResult expected, string what)
    {
        Assert.True(expected.MetricsRows.Count == MetricsRows.Count, $"{what}: {MetricsRows.Count} metrics rows, uninterrupted run has {expected.MetricsRows.Count}");
        for (int i = 0; i < MetricsRows.Count; i++)
            Assert.True(expected.MetricsRows[i] == MetricsRows[i], $"{what}: metrics line {i} differs:\n  uninterrupted {expected.MetricsRows[i]}\n  resumed       {MetricsRows[i]}");
        Assert.True(expected.Summary == Summary, $"{what}: summary differs:\n  uninterrupted {expected.Summary}\n  resumed       {Summary}");
        Assert.Equal(expected.NewestCheckpoint, NewestCheckpoint);
        Assert.Equal(expected.Sections.Keys.Order(), Sections.Keys.Order());
        foreach (var (name, bytes) in expected.Sections)
            Assert.True(bytes.AsSpan().SequenceEqual(Sections[name]), $"{what}: final checkpoint section '{name}' differs from the uninterrupted run's");
    }
}
