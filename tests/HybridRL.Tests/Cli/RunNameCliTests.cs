using HybridRL.Tests.Config;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Cli;

/// <summary><c>train --name</c> and <c>--run-id</c> choose the run folder runs/&lt;name&gt;/&lt;run id&gt;; the default name is experiment.name.</summary>
public sealed class RunNameCliTests
{
    [Fact]
    public void Name_and_run_id_choose_the_run_folder()
    {
        using var dir = new TempDirectory();
        string[] small = ["--set", "experiment.budget.env_steps=30", "--set", "trainer.dqn.warmup_steps=16", "--set", "logging.final_eval_episodes=1", "-q"];
        var (code, stdout, stderr) = CliProcess.Run(["train", ConfigTestPaths.SmallWarehouseDqn, "--runs-dir", dir.Path, "--name", "lr-study", "--run-id", "first", .. small],
            TimeSpan.FromMinutes(2));
        Assert.True(code == 0, stderr);
        string run = dir.Combine("lr-study", "first");
        Assert.StartsWith(run, stdout.Trim()); // the run folder is printed first
        Assert.True(File.Exists(Path.Combine(run, "summary.json")));

        // without --name the folder is named after experiment.name (the fixture says quickstart)
        (code, stdout, stderr) = CliProcess.Run(["train", ConfigTestPaths.SmallWarehouseDqn, "--runs-dir", dir.Path, .. small], TimeSpan.FromMinutes(2));
        Assert.True(code == 0, stderr);
        Assert.Single(Directory.GetDirectories(dir.Combine("quickstart")));
    }
}
