using HybridRL.Tests.Config;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary>One quickstart run with a reduced budget (400 environment steps), trained once through the real program.</summary>
public sealed class QuickstartRunFixture : IDisposable
{
    public const string Budget = "experiment.budget.env_steps=400";
    public static readonly string Quickstart = Path.Combine(ConfigTestPaths.ConfigsFolder, "quickstart.yaml");

    private readonly TempDirectory _tmp = new();

    public QuickstartRunFixture()
    {
        RunsDir = _tmp.Combine("runs");
        (ExitCode, Stdout, Stderr) = CliProcess.Run(["train", Quickstart, "--set", Budget, "--runs-dir", RunsDir, "--quiet"]);
        RunDir = Stdout.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries).FirstOrDefault() ?? "";
    }

    public string RunsDir { get; }
    public string RunDir { get; }
    public int ExitCode { get; }
    public string Stdout { get; }
    public string Stderr { get; }
    public string Scratch(string name) => _tmp.Combine(name);

    public void Dispose() => _tmp.Dispose();
}
