using HybridRL.Tests.Support;
using HybridRL.Checkpoints;

namespace HybridRL.Tests.Checkpoints;

public class AtomicFileTests
{
    [Fact]
    public void WritesAndReplacesWholeFiles()
    {
        using var tmp = new TempDirectory();
        string p = tmp.Combine("sub", "summary.json");
        AtomicFile.WriteAllText(p, "{\"a\":1}");
        Assert.Equal("{\"a\":1}", File.ReadAllText(p));
        AtomicFile.WriteAllBytes(p, new byte[] { 1, 2, 3 });
        Assert.Equal(new byte[] { 1, 2, 3 }, File.ReadAllBytes(p));
        AtomicFile.Write(p, s => s.Write("xyz"u8));
        Assert.Equal("xyz", File.ReadAllText(p));
        Assert.Single(Directory.GetFiles(tmp.Combine("sub")));
    }

    [Fact]
    public void AFailedWriteKeepsTheOldContentAndLeavesNoTempFile()
    {
        using var tmp = new TempDirectory();
        string p = tmp.Combine("summary.json");
        AtomicFile.WriteAllText(p, "old");
        Assert.Throws<InvalidOperationException>(() => AtomicFile.Write(p, s =>
        {
            s.Write("partial new content"u8);
            throw new InvalidOperationException("disk full (simulated)");
        }));
        Assert.Equal("old", File.ReadAllText(p));
        Assert.Single(Directory.GetFiles(tmp.Path));
    }
}
