using HybridRL.Tests.Support;
using HybridRL.Training;
using HybridRL.Checkpoints;

namespace HybridRL.Tests.Checkpoints;

public class CheckpointCorruptionTests
{
    private static CheckpointHeader Header => new() { TrainerKind = "evolution", ConfigHash = "cafe" };

    private static string WriteSmall(string dir) =>
        new CheckpointWriter()
            .AddSection("parameters", w => w.WriteDoubles([1.0, 2.0, 3.0]))
            .AddSection("trainer", w => { w.Write(7); w.Write("population"); })
            .AddSection("counters", new TrainingCounters { EnvSteps = 5 })
            .Save(dir, 3, Header, 1.0);

    [Fact]
    public void FlippingAnyByteIsDetectedAndNamesTheFile()
    {
        using var tmp = new TempDirectory();
        string path = WriteSmall(tmp.Path);
        byte[] good = File.ReadAllBytes(path);
        List<CheckpointSectionInfo> sections;
        using (var r = CheckpointReader.Open(path)) sections = [.. r.Sections];
        string bad = tmp.Combine("flipped.hrlc");

        for (int i = 0; i < good.Length; i++)
        {
            byte[] copy = (byte[])good.Clone();
            copy[i] ^= 0x01;
            File.WriteAllBytes(bad, copy);
            var ex = Assert.Throws<CheckpointCorruptException>(() => CheckpointReader.Open(bad).Dispose());
            Assert.Contains(bad, ex.Message);

            // A flip inside a section's length field, payload or checksum is attributed to that section by name
            // (a flip inside the name itself is reported under the damaged name).
            foreach (var s in sections)
            {
                long end = s.PayloadOffset + s.Length + 8;
                if (i >= s.PayloadOffset - 8 && i < end)
                    Assert.Equal(s.Name, ex.Section);
                if (i >= s.PayloadOffset && i < s.PayloadOffset + s.Length)
                {
                    Assert.Contains("checksum mismatch", ex.Message);
                    Assert.Contains($"section '{s.Name}'", ex.Message);
                    Assert.NotNull(ex.ExpectedChecksum);
                    Assert.NotEqual(ex.ExpectedChecksum, ex.ActualChecksum);
                }
            }
            if (i < 8) Assert.Contains("bad magic", ex.Message);
        }
    }

    [Fact]
    public void TruncationAtEveryOffsetIsDetected()
    {
        using var tmp = new TempDirectory();
        string path = WriteSmall(tmp.Path);
        byte[] good = File.ReadAllBytes(path);
        string bad = tmp.Combine("cut.hrlc");
        for (int n = 0; n < good.Length; n++)
        {
            File.WriteAllBytes(bad, good.AsSpan(0, n).ToArray());
            var ex = Assert.Throws<CheckpointCorruptException>(() => CheckpointReader.Open(bad).Dispose());
            Assert.Contains(bad, ex.Message);
            Assert.Contains("truncated", ex.Message);
        }
    }

    [Fact]
    public void TruncationInsideALargeSectionNamesItAndTheOffset()
    {
        using var tmp = new TempDirectory();
        var big = new byte[3_000_000];
        string path = new CheckpointWriter()
            .AddSection("parameters", w => w.WriteDoubles([0.5]))
            .AddStreamSection("trainer", s => s.Write(big))
            .Save(tmp.Path, 1, Header, null);
        long length = new FileInfo(path).Length;
        using (var r = CheckpointReader.Open(path)) Assert.Equal(big.Length, r.Sections[1].Length);

        foreach (long cut in new[] { length - 1, length - 24, length - 30, length / 2, 200 })
        {
            using (var fs = new FileStream(path, FileMode.Open, FileAccess.Write)) fs.SetLength(cut);
            var ex = Assert.Throws<CheckpointCorruptException>(() => CheckpointReader.Open(path).Dispose());
            Assert.Contains("truncated", ex.Message);
            Assert.Contains(path, ex.Message);
            if (cut > 200) Assert.True(ex.Section is "trainer" or "footer", ex.Message);
            if (cut == length / 2) Assert.Equal("trainer", ex.Section);
        }
    }

    [Fact]
    public void TrailingBytesAfterTheFooterAreRejected()
    {
        using var tmp = new TempDirectory();
        string path = WriteSmall(tmp.Path);
        File.AppendAllText(path, "x");
        var ex = Assert.Throws<CheckpointCorruptException>(() => CheckpointReader.Open(path).Dispose());
        Assert.Equal("footer", ex.Section);
        Assert.Contains("unexpected bytes after the footer", ex.Message);
    }

    [Theory]
    [InlineData(3, "format version 3 is not supported (this program reads version 2)")]
    [InlineData(1, "version 1 files come from an earlier build, whose checksums were XxHash3")]
    public void OtherFormatVersionsAreRejectedClearly(byte version, string expected)
    {
        using var tmp = new TempDirectory();
        string path = WriteSmall(tmp.Path);
        byte[] b = File.ReadAllBytes(path);
        b[8] = version; // version field (u32 LE at offset 8), see docs/checkpoint-format.md
        File.WriteAllBytes(path, b);
        var ex = Assert.Throws<CheckpointCorruptException>(() => CheckpointReader.Open(path).Dispose());
        Assert.Contains(expected, ex.Message);
    }

    [Fact]
    public void SectionChecksumsAreXxHash64AsTheFormatDocumentSays()
    {
        // xxHash64 of the empty input with seed 0 is 0xEF46DB3751D8E999 (the reference implementation's value, from memory).
        Assert.Equal(0xEF46DB3751D8E999UL, System.IO.Hashing.XxHash64.HashToUInt64([]));
        using var tmp = new TempDirectory();
        string path = WriteSmall(tmp.Path);
        byte[] file = File.ReadAllBytes(path);
        using var reader = CheckpointReader.Open(path);
        foreach (var section in reader.Sections)
        {
            // docs/checkpoint-format.md: section checksum = XxHash64(payload ‖ name bytes ‖ payload length as u64 LE)
            var payload = file.AsSpan((int)section.PayloadOffset, (int)section.Length);
            var data = new List<byte>(payload.ToArray());
            data.AddRange(System.Text.Encoding.UTF8.GetBytes(section.Name));
            data.AddRange(BitConverter.GetBytes((ulong)section.Length));
            Assert.True(BitConverter.IsLittleEndian);
            Assert.Equal(System.IO.Hashing.XxHash64.HashToUInt64(data.ToArray()), section.Checksum);
        }
    }
}
