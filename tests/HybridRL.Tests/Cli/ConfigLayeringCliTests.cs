using System.Text.RegularExpressions;
using HybridRL.Tests.Config;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary>Layering through the real program: experiment file &lt; HYBRIDRL_* environment variables &lt; --set.</summary>
public sealed class ConfigLayeringCliTests
{
    private static readonly string Quickstart = ConfigTestPaths.SmallWarehouseDqn;

    private static string LearningRate(IDictionary<string, string>? env, params string[] extra)
    {
        var (code, stdout, stderr) = CliProcess.Run(["inspect", Quickstart, "--resolved", .. extra], environment: env);
        Assert.True(code == 0, stderr);
        var m = Regex.Match(stdout, @"^\s+learning_rate:\s*([^\s#]+)", RegexOptions.Multiline);
        Assert.True(m.Success, stdout);
        return m.Groups[1].Value;
    }

    [Fact]
    public void File_is_overridden_by_environment_which_is_overridden_by_set()
    {
        var env = new Dictionary<string, string> { ["HYBRIDRL_TRAINER__DQN__LEARNING_RATE"] = "0.02" };
        Assert.Equal("0.01", LearningRate(null));                                              // the fixture says 0.01
        Assert.Equal("0.02", LearningRate(env));                                               // the variable wins over the file
        Assert.Equal("0.03", LearningRate(env, "--set", "trainer.dqn.learning_rate=0.03"));    // --set wins over both
    }
}
