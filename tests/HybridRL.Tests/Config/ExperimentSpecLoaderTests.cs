using HybridRL.Experiments.Config;

namespace HybridRL.Tests.Config;

public sealed class ExperimentSpecLoaderTests : IDisposable
{
    private const string Minimal = """
        experiment:
          budget:
            env_steps: 100
        environment:
          kind: cart-pole
        """;

    private readonly ScratchFolder _dir = new();

    public void Dispose() => _dir.Dispose();

    private static Dictionary<string, string> NoEnv() => new();

    private static ExperimentSpec Load(string file, string[]? sets = null, Dictionary<string, string>? env = null) =>
        ExperimentSpecLoader.Load([file], sets ?? [], env ?? NoEnv(), null);

    [Fact]
    public void Minimal_file_gets_defaults_from_the_key_table()
    {
        var spec = Load(_dir.Write("tiny-run.yaml", Minimal));
        Assert.Equal("tiny-run", spec.Experiment.Name); // default name = file stem
        Assert.Equal(100, spec.Experiment.Budget.EnvSteps);
        Assert.Equal(TrainerKind.Dqn, spec.Trainer.Kind);
        Assert.NotNull(spec.Trainer.Dqn);
        Assert.Null(spec.Trainer.Genetic);
        Assert.Equal(32, spec.Trainer.Dqn!.BatchSize);
        Assert.Equal(0.99, spec.Trainer.Dqn.Gamma);
        Assert.Equal(4, spec.Model.Circuit!.Qubits);
        Assert.Equal([RotationAxis.Ry, RotationAxis.Rz], spec.Model.Circuit.Rotations);
        Assert.Null(spec.Model.Classical);
        Assert.Null(spec.Hardware);
        Assert.Empty(spec.Environment.Parameters);
        // Every default in the table matches what the spec reports.
        foreach (var (path, value, key) in ResolvedPairs(spec).Where(p => p.Key is not null && p.Key.Default is not null && p.Path is not ("experiment.name" or "experiment.budget.env_steps")))
        {
            var expected = key!.Kind == ConfigValueKind.Text ? (string)key.Default! : ConfigValueFormat.Format(key.Kind, key.Default!);
            Assert.True(expected == value, $"{path}: default {key.DefaultText} but spec has {value}");
        }
    }

    private static IEnumerable<(string Path, string Value, ConfigKey? Key)> ResolvedPairs(ExperimentSpec spec)
    {
        // Parse the canonical YAML back into flat pairs through the YAML provider itself.
        var file = YamlConfigFile.FromText(spec.ToYaml(), "resolved.yaml");
        foreach (var (k, v) in file.Values)
        {
            var path = k.Replace(':', '.');
            yield return (path, v ?? "", ConfigKeyTable.Find(path));
        }
    }

    [Fact]
    public void Yaml_provider_flattens_and_records_lines()
    {
        var file = YamlConfigFile.FromText("""
            a:
              b: 1
              list: [x, y]
              empty: []
              gone: ~
              quoted: ""
            """, "t.yaml");
        Assert.Empty(file.Errors);
        Assert.Equal("1", file.Values["a:b"]);
        Assert.Equal("x", file.Values["a:list:0"]);
        Assert.Equal("y", file.Values["a:list:1"]);
        Assert.Equal(YamlConfigFile.EmptyListMarker, file.Values["a:empty"]);
        Assert.Null(file.Values["a:gone"]);
        Assert.Equal("", file.Values["a:quoted"]);
        Assert.Equal(2, file.Origins["a:b"].Line); // hand-counted: "b: 1" is on the second line
        Assert.Equal(3, file.Origins["a:list:1"].Line);
    }

    [Fact]
    public void Precedence_is_file_then_environment_then_set()
    {
        var file = _dir.Write("p.yaml", Minimal + """

            trainer:
              dqn:
                learning_rate: 0.1
                gamma: 0.5
                batch_size: 8
                warmup_steps: 100
            """);
        var env = new Dictionary<string, string>
        {
            ["HYBRIDRL_TRAINER__DQN__LEARNING_RATE"] = "0.01",
            ["HYBRIDRL_TRAINER__DQN__GAMMA"] = "0.6",
            ["HYBRIDRL_LOG_LEVEL"] = "debug", // no "__": not a configuration key, ignored
            ["OTHER__THING"] = "x",
        };
        var spec = Load(file, ["trainer.dqn.learning_rate=0.001"], env);
        Assert.Equal(0.001, spec.Trainer.Dqn!.LearningRate); // --set beats environment and file
        Assert.Equal(0.6, spec.Trainer.Dqn.Gamma);           // environment beats file
        Assert.Equal(8, spec.Trainer.Dqn.BatchSize);         // file beats default
    }

    [Fact]
    public void Later_set_option_wins_and_tilde_restores_the_default()
    {
        var file = _dir.Write("s.yaml", Minimal + "\ntrainer:\n  dqn:\n    gamma: 0.5\n");
        var spec = Load(file, ["trainer.dqn.batch_size=16", "trainer.dqn.batch_size=64", "trainer.dqn.gamma=~"]);
        Assert.Equal(64, spec.Trainer.Dqn!.BatchSize);
        Assert.Equal(0.99, spec.Trainer.Dqn.Gamma);
    }

    [Fact]
    public void Lists_are_replaced_whole_by_a_higher_layer()
    {
        var baseFile = _dir.Write("base.yaml", Minimal + "\nmodel:\n  kind: classical\n  classical:\n    hidden_sizes: [64, 64, 64]\n");
        var derived = _dir.Write("derived.yaml", "extends: base.yaml\nmodel:\n  classical:\n    hidden_sizes: [16]\n");
        Assert.Equal([16], Load(derived).Model.Classical!.HiddenSizes);
        Assert.Equal([64, 64, 64], Load(baseFile).Model.Classical!.HiddenSizes);
        Assert.Equal([8, 4], Load(derived, ["model.classical.hidden_sizes=[8, 4]"]).Model.Classical!.HiddenSizes);
        Assert.Equal([RotationAxis.Rx], Load(_dir.Write("r.yaml", Minimal), [], new() { ["HYBRIDRL_MODEL__CIRCUIT__ROTATIONS"] = "rx" }).Model.Circuit!.Rotations);
    }

    [Fact]
    public void Extends_chains_resolve_relative_to_each_file_and_later_files_win()
    {
        _dir.Write("shared/root.yaml", "experiment:\n  seed: 11\n  budget:\n    env_steps: 100\nenvironment:\n  kind: cart-pole\ntrainer:\n  dqn:\n    gamma: 0.9\n");
        _dir.Write("shared/middle.yaml", "extends: root.yaml\ntrainer:\n  dqn:\n    gamma: 0.8\n    batch_size: 16\n");
        var top = _dir.Write("runs/top.yaml", "extends: ../shared/middle.yaml\ntrainer:\n  dqn:\n    batch_size: 8\n");
        var extra = _dir.Write("extra.yaml", "experiment:\n  seed: 12\n");
        var spec = Load(top);
        Assert.Equal(11UL, spec.Experiment.Seed);
        Assert.Equal(0.8, spec.Trainer.Dqn!.Gamma);
        Assert.Equal(8, spec.Trainer.Dqn.BatchSize);
        Assert.Equal("top", spec.Experiment.Name);
        var both = ExperimentSpecLoader.Load([top, extra], [], NoEnv(), null);
        Assert.Equal(12UL, both.Experiment.Seed);
        Assert.Equal("extra", both.Experiment.Name); // default name comes from the last file given
    }

    [Fact]
    public void Missing_base_and_cycles_name_the_file()
    {
        var missing = _dir.Write("m.yaml", "extends: nowhere/base.yaml\n" + Minimal);
        var ex = Assert.Throws<ConfigException>(() => Load(missing));
        var error = Assert.Single(ex.Errors);
        Assert.EndsWith("m.yaml", error.File);
        Assert.Equal(1, error.Line);
        Assert.Contains("nowhere/base.yaml", error.Message);

        _dir.Write("c1.yaml", "extends: c2.yaml\n" + Minimal);
        _dir.Write("c2.yaml", "extends: c3.yaml\n");
        var c3 = _dir.Write("c3.yaml", "extends: c1.yaml\n");
        ex = Assert.Throws<ConfigException>(() => Load(c3));
        var cycle = Assert.Single(ex.Errors);
        Assert.EndsWith("c2.yaml", cycle.File); // c2 names c3, which closes the loop c3 → c1 → c2 → c3
        Assert.Matches("base-file cycle: .*c3\\.yaml → .*c1\\.yaml → .*c2\\.yaml → .*c3\\.yaml", cycle.Message);
    }

    [Fact]
    public void Unreadable_inputs_are_reported_with_the_path()
    {
        var ex = Assert.Throws<ConfigException>(() => Load(Path.Combine(_dir.Path, "absent.yaml")));
        Assert.Contains("file not found", Assert.Single(ex.Errors).Message);
        ex = Assert.Throws<ConfigException>(() => Load(_dir.Path));
        Assert.Contains("it is a folder", Assert.Single(ex.Errors).Message);
    }

    [Fact]
    public void A_zero_byte_file_is_reported_as_empty()
    {
        var ex = Assert.Throws<ConfigException>(() => Load(_dir.Write("zero.yaml", "")));
        Assert.Contains("is empty", Assert.Single(ex.Errors).Message);
    }

    [Fact]
    public void All_errors_are_reported_together_with_file_and_line()
    {
        var file = _dir.Write("many.yaml", """
            experiment:
              budget:
                env_steps: 100
            environment:
              kind: cart-pole
            model:
              circuit:
                qubits: 0
                layerz: 3
            trainer:
              dqn:
                gamma: 2
            """);
        var ex = Assert.Throws<ConfigException>(() => Load(file, ["logging.keep_checkpoints=none"]));
        Assert.Equal(4, ex.Errors.Count);
        Assert.Contains(ex.Errors, e => e.Key == "model.circuit.qubits" && e.Line == 8);
        Assert.Contains(ex.Errors, e => e.Key == "model.circuit.layerz" && e.Line == 9 && e.Message.Contains("did you mean 'model.circuit.layers'"));
        Assert.Contains(ex.Errors, e => e.Key == "trainer.dqn.gamma" && e.Line == 12);
        Assert.Contains(ex.Errors, e => e.Key == "logging.keep_checkpoints" && e.File == "--set" && e.Line is null);
        Assert.Contains("many.yaml:8", ex.Message);
    }

    [Fact]
    public void Environment_variable_errors_name_the_variable()
    {
        var ex = Assert.Throws<ConfigException>(() => Load(_dir.Write("e.yaml", Minimal), [], new() { ["HYBRIDRL_MODEL__CIRCUIT__QUBITS"] = "-1" }));
        var e = Assert.Single(ex.Errors);
        Assert.Equal("environment variable HYBRIDRL_MODEL__CIRCUIT__QUBITS", e.File);
        Assert.Contains("at least 1", e.Message);
    }

    [Fact]
    public void Environment_parameters_pass_through_as_strings_merged_across_layers()
    {
        var baseFile = _dir.Write("envbase.yaml", """
            experiment:
              budget:
                env_steps: 10
            environment:
              kind: slippery-warehouse
              slip_probability: 0.2
              step_cost: 0.01
              map: ["A.", ".D"]
              rewards:
                dock: 1
                crash: -1
            """);
        var top = _dir.Write("envtop.yaml", "extends: envbase.yaml\nenvironment:\n  map: [\"AD\"]\n  rewards:\n    crash: -5\n");
        var spec = Load(top, ["environment.max_steps=40"], new() { ["HYBRIDRL_ENVIRONMENT__STEP_COST"] = "0.05" });
        var p = spec.Environment.Parameters;
        Assert.Equal("slippery-warehouse", spec.Environment.Kind);
        Assert.Equal("0.2", p["slip_probability"]);
        Assert.Equal("0.05", p["step_cost"]);
        Assert.Equal("40", p["max_steps"]);
        Assert.Equal("AD", p["map:0"]);
        Assert.False(p.ContainsKey("map:1")); // the list is replaced whole
        Assert.Equal("1", p["rewards:dock"]);  // mappings merge key by key
        Assert.Equal("-5", p["rewards:crash"]);
        Assert.Equal(6, p.Count);
    }

    [Fact]
    public void Hardware_profile_is_read_relative_to_the_naming_file_and_inline_keys_override_it()
    {
        _dir.Write("profiles/dev.yaml", "name: test-device\nseconds_per_shot: 0.001\ncircuits_per_job: 10\n");
        var file = _dir.Write("hw.yaml", Minimal + "\nhardware:\n  profile: profiles/dev.yaml\n  circuits_per_job: 20\n");
        var hw = Load(file).Hardware!;
        Assert.Equal("test-device", hw.Name);
        Assert.Equal(0.001, hw.SecondsPerShot);
        Assert.Equal(20, hw.CircuitsPerJob);
        Assert.Null(hw.PricePerShot);

        _dir.Write("profiles/bad.yaml", "name: x\nseconds_per_shot: 0.001\nsecond_per_shot: 1\n");
        var bad = _dir.Write("hwbad.yaml", Minimal + "\nhardware:\n  profile: profiles/bad.yaml\n");
        var ex = Assert.Throws<ConfigException>(() => Load(bad));
        var e = Assert.Single(ex.Errors);
        Assert.EndsWith("bad.yaml", e.File);
        Assert.Equal(3, e.Line);
        Assert.Contains("did you mean 'hardware.seconds_per_shot'", e.Message);
    }

    [Fact]
    public void Compressor_output_size_zero_resolves_to_the_encoding_capacity()
    {
        var angle = Load(_dir.Write("a.yaml", Minimal + "\nmodel:\n  compressor:\n    kind: mps\n  circuit:\n    qubits: 5\n"));
        Assert.Equal(5, angle.Model.Compressor!.OutputSize);
        var amplitude = Load(_dir.Write("b.yaml", Minimal + "\nmodel:\n  compressor:\n    kind: dense\n  circuit:\n    qubits: 5\n    encoding: amplitude\n"));
        Assert.Equal(32, amplitude.Model.Compressor!.OutputSize); // 2^5
    }

    [Fact]
    public void Evolution_trainer_and_a_null_section_override_work_with_a_dqn_base()
    {
        _dir.Write("dqnbase.yaml", Minimal + "\ntrainer:\n  dqn:\n    batch_size: 16\n    warmup_steps: 100\n");
        var evo = _dir.Write("evo.yaml", "extends: dqnbase.yaml\ntrainer:\n  kind: genetic\n  dqn: ~\nexperiment:\n  budget:\n    generations: 3\n");
        // "dqn: ~" removes the base's whole trainer.dqn section, so its keys no longer count as given.
        var spec = Load(evo);
        Assert.Null(spec.Trainer.Dqn);
        // Without the mask the base's DQN keys clash with the genetic trainer.
        var clash = _dir.Write("evo2.yaml", "extends: dqnbase.yaml\ntrainer:\n  kind: genetic\nexperiment:\n  budget:\n    generations: 3\n");
        var ex = Assert.Throws<ConfigException>(() => Load(clash));
        Assert.Contains("apply only when trainer.kind is dqn", Assert.Single(ex.Errors).Message);
        Assert.Equal(TrainerKind.Genetic, spec.Trainer.Kind);
        Assert.Null(spec.Trainer.Dqn);
        Assert.Equal(50, spec.Trainer.Genetic!.Population);
    }
}
