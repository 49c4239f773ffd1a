using HybridRL.Tests.Support;

namespace HybridRL.Tests.Resume;

/// <summary>
/// Exact resume where the circuit engine samples shots (its seed and call counter must be checkpointed), and for
/// deep Q with the other optimiser and target options (RMSProp state round trip, Double DQN).
/// </summary>
public sealed class SampledSimulationResumeTests
{
    public static TheoryData<string, string[]> Cases => new()
    {
        { "dqn", ["model.simulation.mode=shots", "model.simulation.shots=64", "model.simulation.gradient=parameter_shift",
                  "trainer.dqn.optimizer=rmsprop", "trainer.dqn.double_dqn=true", "experiment.budget.env_steps=200"] },
        { "genetic", ["model.simulation.mode=shots", "model.simulation.shots=64", "experiment.budget.generations=20"] },
    };

    [Theory]
    [MemberData(nameof(Cases))]
    public void InterruptedSampledRunResumesBitIdentically(string trainer, string[] sets)
    {
        var scenario = ResumeScenario.For(trainer).With(sets);
        using var tmp = new TempDirectory();
        string config = scenario.WriteConfig(tmp.Path);
        scenario.RunToEnd(config, tmp.Combine("baseline"));
        var expected = ResumeRunResult.Read(scenario.RunDir(tmp.Combine("baseline")));
        Assert.NotEqual("0", System.Text.Json.Nodes.JsonNode.Parse(expected.Summary)!["shots"]!.ToJsonString());

        string runs = tmp.Combine("interrupted");
        using (var cli = CliProcess.Start(scenario.TrainArgs(config, runs)))
        {
            scenario.WaitForCheckpoints(runs, cli, 3, TimeSpan.FromMinutes(1));
            cli.Signal(15);
            int code = cli.WaitForExit(TimeSpan.FromSeconds(30));
            Assert.True(code == 3, $"SIGTERM gave exit {code}\n{cli.Stderr}");
        }
        var (rc, stdout, stderr) = CliProcess.Run(ResumeScenario.ResumeArgs(scenario.RunDir(runs)), TimeSpan.FromMinutes(2));
        Assert.True(rc == 0, $"resume exited {rc}\n{stdout}\n{stderr}");
        ResumeRunResult.Read(scenario.RunDir(runs)).AssertSameAs(expected, $"{trainer} with shots after SIGTERM and resume");
    }
}
