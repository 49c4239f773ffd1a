using HybridRL.Tests.Config;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary>
/// Every malformed case in Config/bad/ through `hybridrl train FILE`: exit 2, the expected fragment on stderr,
/// and the --runs-dir folder is not even created. All cases in-process (one parse and build each); cases that need
/// environment variables, and a few others, through the real program as a child process.
/// </summary>
[Collection(ConsoleCollection.Name)]
public sealed class BadConfigCliTests
{
    public static TheoryData<string> CaseNames()
    {
        var data = new TheoryData<string>();
        foreach (var c in BadConfigCase.All()) data.Add(Path.GetFileName(c.File));
        return data;
    }

    private static string[] TrainArgs(BadConfigCase c, string runsDir)
    {
        var args = new List<string> { "train", c.File, "--runs-dir", runsDir };
        foreach (var s in c.Sets) { args.Add("--set"); args.Add(s); }
        return args.ToArray();
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Train_refuses_each_malformed_case_with_exit_2_and_creates_nothing(string name)
    {
        var c = BadConfigCase.Parse(Path.Combine(ConfigTestPaths.BadCasesFolder, name));
        using var tmp = new TempDirectory();
        string runs = tmp.Combine("runs");
        var (code, stdout, stderr) = c.Environment.Count == 0
            ? InProcessCli.Run(TrainArgs(c, runs))
            : CliProcess.Run(TrainArgs(c, runs), environment: new Dictionary<string, string>(c.Environment));
        Assert.True(code == 2, $"{name}: exit {code}; stderr:\n{stderr}\nstdout:\n{stdout}");
        Assert.Contains(c.Expect, stderr, StringComparison.Ordinal);
        Assert.StartsWith("error: ", stderr, StringComparison.Ordinal);
        Assert.DoesNotContain("   at ", stderr, StringComparison.Ordinal); // one message, no stack trace
        Assert.False(Directory.Exists(runs), $"{name}: {runs} was created");
    }

    [Theory]
    [InlineData("unknown-key-typo.yaml")]
    [InlineData("bad-set-key.yaml")]
    [InlineData("syntax-unclosed-bracket.yaml")]
    [InlineData("out-of-range-qubits.yaml")]
    public void The_real_program_refuses_malformed_cases_the_same_way(string name)
    {
        var c = BadConfigCase.Parse(Path.Combine(ConfigTestPaths.BadCasesFolder, name));
        using var tmp = new TempDirectory();
        string runs = tmp.Combine("runs");
        var (code, _, stderr) = CliProcess.Run(TrainArgs(c, runs), environment: new Dictionary<string, string>(c.Environment));
        Assert.True(code == 2, $"{name}: exit {code}; stderr:\n{stderr}");
        Assert.Contains(c.Expect, stderr, StringComparison.Ordinal);
        Assert.False(Directory.Exists(runs));
    }
}
