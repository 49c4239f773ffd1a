using HybridRL.Checkpoints;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Resume;

/// <summary>
/// A damaged newest checkpoint (one flipped byte, or a truncated file) is caught by its checksums, reported with
/// the file and section named, skipped in favour of the previous valid checkpoint, and the run still ends
/// bit-identical to an uninterrupted one.
/// </summary>
public sealed class CorruptCheckpointResumeTests
{
    [Theory]
    [InlineData("flip")]
    [InlineData("truncate")]
    public void DamagedNewestCheckpointFallsBackToThePreviousOne(string damage)
    {
        var scenario = ResumeScenario.For("genetic");
        using var tmp = new TempDirectory();
        string config = scenario.WriteConfig(tmp.Path);
        scenario.RunToEnd(config, tmp.Combine("baseline"));
        var expected = ResumeRunResult.Read(scenario.RunDir(tmp.Combine("baseline")));

        string runs = tmp.Combine("damaged");
        using (var cli = CliProcess.Start(scenario.TrainArgs(config, runs)))
        {
            scenario.WaitForCheckpoints(runs, cli, 3, TimeSpan.FromMinutes(1));
            cli.Signal(9);
            cli.WaitForExit(TimeSpan.FromSeconds(30));
        }
        string dir = Path.Combine(scenario.RunDir(runs), "checkpoints");
        var list = CheckpointStore.List(dir);
        Assert.True(list.Count >= 2, "need a newest and a previous checkpoint");
        string newest = list[0].Path;
        string section;
        using (var reader = CheckpointReader.Open(newest))
        {
            var info = reader.Sections.Single(s => s.Name == "model.center");
            section = info.Name;
            using var fs = new FileStream(newest, FileMode.Open, FileAccess.ReadWrite);
            if (damage == "flip")
            {
                fs.Position = info.PayloadOffset + info.Length / 2;
                int b = fs.ReadByte();
                fs.Position--;
                fs.WriteByte((byte)(b ^ 0x10));
            }
            else
            {
                fs.SetLength(info.PayloadOffset + info.Length / 2); // cut inside model.center
            }
        }
        Assert.Throws<CheckpointCorruptException>(() => CheckpointReader.Open(newest).Dispose());
        // What a kill in the middle of a checkpoint write leaves: a partial temporary file, which must be ignored and cleaned up.
        byte[] previousBytes = File.ReadAllBytes(list[1].Path);
        string partial = Path.Combine(dir, $".ckpt-{list[0].Step + 1:D12}.hrlc.tmp-999999-0badf00d");
        File.WriteAllBytes(partial, previousBytes.AsSpan(0, previousBytes.Length / 3).ToArray());

        var (code, stdout, stderr) = CliProcess.Run(ResumeScenario.ResumeArgs(scenario.RunDir(runs)), TimeSpan.FromMinutes(2));
        Assert.True(code == 0, $"resume exited {code}\n{stdout}\n{stderr}");
        string log = File.ReadAllText(Path.Combine(scenario.RunDir(runs), "log.json"));
        foreach (var text in new[] { stderr, log })
        {
            Assert.Contains("skipped checkpoint", text);
            Assert.Contains(Path.GetFileName(newest), text);
            Assert.Contains($"section '{section}'", text);
        }
        Assert.Contains(Path.GetFileName(list[1].Path), log); // resumed from the previous one
        Assert.False(File.Exists(partial), "the partial temporary checkpoint was not cleaned up");
        ResumeRunResult.Read(scenario.RunDir(runs)).AssertSameAs(expected, $"after a {damage}ed newest checkpoint");
    }
}
