using HybridRL.Experiments.Config;

namespace HybridRL.Tests.Config;

public sealed class SpecRoundTripTests : IDisposable
{
    private readonly ScratchFolder _dir = new();

    public void Dispose() => _dir.Dispose();

    public static TheoryData<string> ExampleConfigs()
    {
        var data = new TheoryData<string>();
        foreach (var f in ConfigTestPaths.ExperimentFiles()) data.Add(Path.GetFileName(f));
        return data;
    }

    private ExperimentSpec Reload(ExperimentSpec spec, string name)
    {
        var path = _dir.Write(name, spec.ToYaml());
        return ExperimentSpecLoader.Load([path], [], new Dictionary<string, string>(), null);
    }

    [Theory]
    [MemberData(nameof(ExampleConfigs))]
    public void Every_example_config_loads_and_its_resolved_yaml_reproduces_the_spec(string name)
    {
        var spec = ExperimentSpecLoader.Load([Path.Combine(ConfigTestPaths.ConfigsFolder, name)], [], new Dictionary<string, string>(), null);
        var again = Reload(spec, "resolved-" + name);
        Assert.Equal(spec, again);
        Assert.Equal(spec.ToYaml(), again.ToYaml());
        Assert.Equal(spec.Hash(), again.Hash());
        Assert.True(SpecDiff.Compare(spec, again).IsEmpty);
        // The annotated form is valid input too and gives the same spec.
        var annotated = ExperimentSpecLoader.Load([_dir.Write("annotated-" + name, spec.ToAnnotatedYaml())], [], new Dictionary<string, string>(), null);
        Assert.Equal(spec, annotated);
    }

    [Fact]
    public void Example_configs_cover_every_trainer_and_the_hardware_profile_is_used()
    {
        var specs = ConfigTestPaths.ExperimentFiles().Select(ExperimentSpecLoader.LoadFile).ToList();
        Assert.Equal(Enum.GetValues<TrainerKind>().Order(), specs.Select(s => s.Trainer.Kind).Distinct().Order());
        var noisy = specs.Single(s => s.Experiment.Name == "noisy-shots");
        Assert.Equal("example-device", noisy.Hardware!.Name);
        Assert.Contains("estimates, not vendor quotes", noisy.Hardware.Note);
        Assert.Equal(GradientMethod.ParameterShift, noisy.Model.Simulation!.Gradient);
        Assert.Equal(0.003, noisy.Trainer.Dqn!.LearningRate); // inherited from cartpole-dqn.yaml through extends
        var quick = specs.Single(s => s.Experiment.Name == "quickstart");
        Assert.Equal((4, 4, 10000L), (quick.Model.Circuit!.Qubits, quick.Model.Circuit.Layers, quick.Experiment.Budget.EnvSteps)); // as written in configs/quickstart.yaml
    }

    [Fact]
    public void Special_values_survive_the_round_trip()
    {
        var file = _dir.Write("special.yaml", """
            experiment:
              name: odd.values_1
              description: "quotes \" and back\\slash, colon: hash # and a
                second line"
              seed: 9223372036854775807
              budget:
                wall_seconds: 0.1
            environment:
              kind: external
              command: "run --flag: yes"
              empty_list: []
              blob: |
                line one
                line two
              nested:
                - name: a
                  size: 1
                - name: b
            model:
              simulation:
                mode: trajectories
                gradient: parameter_shift
                noise:
                  depolarizing: 1e-05
                  two_qubit_depolarizing: 0.30000000000000004
              circuit:
                rotations: [rz]
            trainer:
              kind: dqn
              dqn:
                learning_rate: 0.000123456789012345
            hardware:
              seconds_per_shot: 2.5e-7
              price_per_shot: 0
            """);
        var spec = ExperimentSpecLoader.LoadFile(file);
        Assert.Equal(1e-5, spec.Model.Simulation!.Noise.Depolarizing);
        Assert.Equal(0.1 + 0.2, spec.Model.Simulation.Noise.TwoQubitDepolarizing); // 0.30000000000000004 is the double nearest 0.1 + 0.2
        Assert.Equal(long.MaxValue, (long)spec.Experiment.Seed);
        Assert.Equal("line one\nline two\n", spec.Environment.Parameters["blob"]);
        Assert.Equal("[]", spec.Environment.Parameters["empty_list"]);
        Assert.Equal("b", spec.Environment.Parameters["nested:1:name"]);
        Assert.Equal(0.0, spec.Hardware!.PricePerShot);
        var again = Reload(spec, "special-again.yaml");
        Assert.Equal(spec, again);
        Assert.Equal(spec.Hash(), again.Hash());
    }

    [Fact]
    public void Hash_is_16_hex_digits_and_changes_with_any_value()
    {
        var a = ExperimentSpecLoader.LoadFile(Path.Combine(ConfigTestPaths.ConfigsFolder, "quickstart.yaml"));
        var b = ExperimentSpecLoader.Load([Path.Combine(ConfigTestPaths.ConfigsFolder, "quickstart.yaml")], ["trainer.dqn.gamma=0.96"], new Dictionary<string, string>(), null);
        Assert.Matches("^[0-9a-f]{16}$", a.Hash());
        Assert.NotEqual(a.Hash(), b.Hash());
        Assert.Equal(a.Hash(), ExperimentSpecLoader.LoadFile(Path.Combine(ConfigTestPaths.ConfigsFolder, "quickstart.yaml")).Hash());
        // xxHash64 of the canonical YAML text, checked against the library directly (System.IO.Hashing is the reference implementation).
        var expected = System.IO.Hashing.XxHash64.HashToUInt64(System.Text.Encoding.UTF8.GetBytes(a.ToYaml())).ToString("x16");
        Assert.Equal(expected, a.Hash());
    }

    [Fact]
    public void Resolved_yaml_writes_only_applicable_keys()
    {
        var spec = ExperimentSpecLoader.LoadFile(Path.Combine(ConfigTestPaths.ConfigsFolder, "classical-baseline.yaml"));
        var yaml = spec.ToYaml();
        Assert.Contains("hidden_sizes: [64, 64]", yaml);
        Assert.DoesNotContain("circuit:", yaml);
        Assert.DoesNotContain("genetic:", yaml);
        Assert.DoesNotContain("hardware:", yaml);
        Assert.DoesNotContain("polyak_tau", yaml); // target_update is hard
    }
}
