using HybridRL.Tests.Support;
using HybridRL.Training;
using HybridRL.Checkpoints;

namespace HybridRL.Tests.Checkpoints;

public class CheckpointStoreTests
{
    private static CheckpointHeader Header => new() { TrainerKind = "deep-q", ConfigHash = "0011" };

    private static string Save(string dir, long step, double? score = null, int keep = 3) =>
        new CheckpointWriter()
            .AddSection("parameters", w => w.WriteDoubles([step, step + 0.5]))
            .AddSection("counters", new TrainingCounters { EnvSteps = step })
            .Save(dir, step, Header, score, keep);

    private static long[] Steps(string dir) => CheckpointStore.List(dir).Select(c => c.Step).OrderBy(s => s).ToArray();

    private static void FlipPayloadByte(string path, string section)
    {
        long at;
        using (var r = CheckpointReader.Open(path)) at = r.Sections.Single(s => s.Name == section).PayloadOffset + 3;
        using var fs = new FileStream(path, FileMode.Open, FileAccess.ReadWrite);
        fs.Position = at;
        int b = fs.ReadByte();
        fs.Position = at;
        fs.WriteByte((byte)(b ^ 0x80));
    }

    [Fact]
    public void FindNewestValidFallsBackToThePreviousGoodCheckpointAndSaysWhy()
    {
        using var tmp = new TempDirectory();
        Save(tmp.Path, 10);
        Save(tmp.Path, 20);
        string newest = Save(tmp.Path, 30);
        FlipPayloadByte(newest, "parameters");

        string? found = CheckpointStore.FindNewestValid(tmp.Path, out var rejected);
        Assert.Equal(Path.Combine(tmp.Path, "ckpt-000000000020.hrlc"), found);
        string reason = Assert.Single(rejected);
        Assert.Contains("ckpt-000000000030.hrlc", reason);
        Assert.Contains("section 'parameters'", reason);
        Assert.Contains("checksum mismatch", reason);

        using var reader = CheckpointStore.OpenNewestValid(tmp.Path, out _);
        Assert.NotNull(reader);
        Assert.Equal(20, reader.Header.Step);
        using var p = reader.GetSection("parameters");
        Assert.Equal(new[] { 20.0, 20.5 }, p.ReadDoubles());
    }

    [Fact]
    public void TruncatedNewestIsSkipped()
    {
        using var tmp = new TempDirectory();
        Save(tmp.Path, 1);
        string newest = Save(tmp.Path, 2);
        using (var fs = new FileStream(newest, FileMode.Open, FileAccess.Write)) fs.SetLength(fs.Length - 5);
        Assert.Equal(Path.Combine(tmp.Path, "ckpt-000000000001.hrlc"), CheckpointStore.FindNewestValid(tmp.Path, out var rejected));
        Assert.Contains("truncated", Assert.Single(rejected));
    }

    [Fact]
    public void NoValidCheckpointGivesNullWithEveryReason()
    {
        using var tmp = new TempDirectory();
        Assert.Null(CheckpointStore.FindNewestValid(tmp.Combine("missing-dir"), out var none));
        Assert.Empty(none);
        string a = Save(tmp.Path, 1);
        string b = Save(tmp.Path, 2);
        File.WriteAllText(a, "not a checkpoint");
        File.WriteAllBytes(b, []);
        Assert.Null(CheckpointStore.FindNewestValid(tmp.Path, out var rejected));
        Assert.Equal(2, rejected.Count);
        Assert.Contains("ckpt-000000000002.hrlc", rejected[0]); // newest first
        Assert.Contains("bad magic", rejected[1]);
    }

    [Fact]
    public void RetentionKeepsTheLastKAndTheBest()
    {
        using var tmp = new TempDirectory();
        double[] scores = [0.1, 0.9, 0.3, 0.2, 0.4, 0.5];
        for (int i = 0; i < scores.Length; i++) Save(tmp.Path, i + 1, scores[i], keep: 2);

        Assert.Equal(new long[] { 2, 5, 6 }, Steps(tmp.Path)); // last two (5, 6) plus the best (step 2, score 0.9)
        Assert.Equal("ckpt-000000000006.hrlc", CheckpointStore.ReadLatestPointer(tmp.Path));
        var best = CheckpointStore.ReadBestPointer(tmp.Path);
        Assert.Equal(new BestCheckpointPointer("ckpt-000000000002.hrlc", 0.9), best);

        Save(tmp.Path, 7, 1.5, keep: 2); // a new best replaces the old best, which is then pruned
        Assert.Equal(new long[] { 6, 7 }, Steps(tmp.Path));
        Assert.Equal("ckpt-000000000007.hrlc", CheckpointStore.ReadBestPointer(tmp.Path)!.Value.FileName);
    }

    [Fact]
    public void RetentionWithoutScoresKeepsTheLastK()
    {
        using var tmp = new TempDirectory();
        for (int i = 1; i <= 5; i++)
        {
            Save(tmp.Path, i * 100, keep: 3);
            Assert.Equal($"ckpt-{i * 100:D12}.hrlc", CheckpointStore.ReadLatestPointer(tmp.Path));
        }
        Assert.Equal(new long[] { 300, 400, 500 }, Steps(tmp.Path));
        Assert.Null(CheckpointStore.ReadBestPointer(tmp.Path));
        Assert.Equal("ckpt-000000000500.hrlc\n", File.ReadAllText(tmp.Combine("latest")));
    }

    [Fact]
    public void ACrashBeforeTheRenameLeavesThePreviousCheckpointValid()
    {
        using var tmp = new TempDirectory();
        Save(tmp.Path, 10);
        // Simulate a writer killed after writing (part of) its temp file but before the rename.
        string full = Save(tmp.Combine("elsewhere"), 20);
        byte[] bytes = File.ReadAllBytes(full);
        string temp = tmp.Combine(".ckpt-000000000020.hrlc.tmp-424242-0badf00d");
        File.WriteAllBytes(temp, bytes.AsSpan(0, bytes.Length / 2).ToArray());
        string fullTemp = tmp.Combine(".ckpt-000000000020.hrlc.tmp-424242-00c0ffee");
        File.WriteAllBytes(fullTemp, bytes);

        Assert.Equal(new long[] { 10 }, Steps(tmp.Path));
        Assert.Equal(Path.Combine(tmp.Path, "ckpt-000000000010.hrlc"), CheckpointStore.FindNewestValid(tmp.Path, out var rejected));
        Assert.Empty(rejected);
        Assert.Equal("ckpt-000000000010.hrlc", CheckpointStore.ReadLatestPointer(tmp.Path));

        Save(tmp.Path, 20); // the next successful save removes the leftovers
        Assert.False(File.Exists(temp));
        Assert.False(File.Exists(fullTemp));
        Assert.Equal(new long[] { 10, 20 }, Steps(tmp.Path));
    }

    [Fact]
    public void SavingAfterResumingFromAnOlderCheckpointDropsTheAbandonedNewerOnes()
    {
        using var tmp = new TempDirectory();
        Save(tmp.Path, 10);
        string corrupt = Save(tmp.Path, 20);
        FlipPayloadByte(corrupt, "counters");
        Assert.EndsWith("ckpt-000000000010.hrlc", CheckpointStore.FindNewestValid(tmp.Path, out _));
        Save(tmp.Path, 15); // the resumed run's next checkpoint
        Assert.Equal(new long[] { 10, 15 }, Steps(tmp.Path));
        Assert.Equal("ckpt-000000000015.hrlc", CheckpointStore.ReadLatestPointer(tmp.Path));
    }

    [Fact]
    public void FileNamesParseAndTemporaryNamesAreIgnored()
    {
        Assert.Equal("ckpt-000000001234.hrlc", CheckpointFormat.FileNameFor(1234));
        Assert.True(CheckpointFormat.TryParseStep("/a/b/ckpt-000000001234.hrlc", out long s));
        Assert.Equal(1234, s);
        Assert.False(CheckpointFormat.TryParseStep(".ckpt-000000001234.hrlc.tmp-1-ab", out _));
        Assert.False(CheckpointFormat.TryParseStep("ckpt-12x4.hrlc", out _));
        Assert.False(CheckpointFormat.TryParseStep("ckpt-.hrlc", out _));
        Assert.Throws<ArgumentOutOfRangeException>(() => CheckpointFormat.FileNameFor(-1));
    }
}
