using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary>The shell of the CLI through the real executable: about, --version, --help and an unknown command.</summary>
public sealed class AboutAndHelpCliTests
{
    [Fact]
    public void About_reports_the_runtime_and_that_the_tensor_library_loaded()
    {
        var (code, stdout, stderr) = CliProcess.Run(["about"], TimeSpan.FromMinutes(1));
        Assert.True(code == 0, stderr);
        Assert.Matches(@"(?m)^cores +\d+$", stdout);
        Assert.Matches(@"(?m)^TorchSharp +0\.107\.", stdout);
        Assert.Matches(@"(?m)^tensor library +loaded$", stdout); // on Debian 12 only with the libstdc++ fix (README, Platform notes)
        Assert.Matches(@"(?m)^libstdc\+\+ fix +", stdout);
        Assert.Matches(@"(?m)^sbatch +", stdout);
    }

    [Fact]
    public void Version_help_and_unknown_commands()
    {
        var (code, stdout, _) = CliProcess.Run(["--version"], TimeSpan.FromMinutes(1));
        Assert.Equal(0, code);
        Assert.Matches(@"^\d+\.\d+\.\d+", stdout.Trim());

        (code, stdout, _) = CliProcess.Run(["--help"], TimeSpan.FromMinutes(1));
        Assert.Equal(0, code);
        foreach (var command in new[] { "about", "train", "resume", "inspect", "eval", "env", "bench", "compare", "report", "estimate", "sweep" })
            Assert.Matches($@"(?m)^ +{command}\b", stdout);

        (code, _, var stderr) = CliProcess.Run(["trian", "x.yaml"], TimeSpan.FromMinutes(1));
        Assert.Equal(2, code); // usage error: exit 2, with a pointer to --help
        Assert.Contains("hybridrl --help", stderr);
    }
}
