using System.Globalization;
using HybridRL.Experiments.Sweeps;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Tests.Sweeps;

public class SweepExpansionTests
{
    private static SweepPlan LoadTestSweep() => SweepPlan.Load(SweepTestFiles.DataPath("test-sweep.yaml"), Path.GetTempPath());

    [Fact]
    public void Test_sweep_expands_to_the_product_of_all_axes_in_order()
    {
        var plan = LoadTestSweep();
        // hand count: grid 2 x 2, one zip group of 2, 2 random samples, 2 seeds = 32 runs
        Assert.Equal(32, plan.Runs.Count);
        Assert.Equal("unit-sweep", plan.Name);
        Assert.Equal(Path.GetFullPath(SweepTestFiles.DataPath("base-experiment.yaml")), plan.BasePath);
        Assert.Equal(Enumerable.Range(0, 32), plan.Runs.Select(r => r.Index));

        var first = plan.Runs[0];
        Assert.Equal(["trainer.kind", "model.circuit.layers", "env.size", "env.horizon", "trainer.learning_rate", "trainer.discount", "model.read_out", "experiment.seed"],
            first.Overrides.Select(o => o.Key));
        Assert.Equal("dqn", first.ValueOf("trainer.kind"));
        Assert.Equal("1", first.ValueOf("model.circuit.layers"));
        Assert.Equal("1", first.ValueOf("experiment.seed"));
        // seeds are the innermost (fastest) factor
        Assert.Equal("2", plan.Runs[1].ValueOf("experiment.seed"));
        Assert.Equal(first.ValueOf("trainer.learning_rate"), plan.Runs[1].ValueOf("trainer.learning_rate"));
        // grid's first key is the slowest: the second half is all "evolution"
        Assert.All(plan.Runs.Take(16), r => Assert.Equal("dqn", r.ValueOf("trainer.kind")));
        Assert.All(plan.Runs.Skip(16), r => Assert.Equal("evolution", r.ValueOf("trainer.kind")));
        // zipped keys advance together
        Assert.All(plan.Runs, r => Assert.Equal(r.ValueOf("env.size") == "4" ? "20" : "60", r.ValueOf("env.horizon")));
        Assert.Equal(32, plan.Runs.Select(r => r.Id).Distinct().Count());
        Assert.Equal(Path.Combine(Path.GetTempPath(), "unit-sweep", first.Id), plan.RunDir(first));
    }

    [Fact]
    public void Same_file_gives_same_ids_and_values()
    {
        var a = LoadTestSweep();
        var b = LoadTestSweep();
        Assert.Equal(a.Runs.Select(r => r.Id), b.Runs.Select(r => r.Id));
        Assert.Equal(a.Runs.Select(r => string.Join(" ", r.OverrideStrings)), b.Runs.Select(r => string.Join(" ", r.OverrideStrings)));
    }

    [Fact]
    public void Random_samples_follow_their_distributions_from_seeded_streams()
    {
        var plan = LoadTestSweep();
        var def = plan.Definition;
        var lr = def.Random!.Keys.Single(k => k.Key == "trainer.learning_rate");
        var samples = plan.Runs.Select(r => r.ValueOf("trainer.learning_rate")!).Distinct().ToArray();
        Assert.Equal(2, samples.Length); // count: 2
        for (int i = 0; i < 2; i++)
        {
            // hand-worked: log-uniform sample = exp(ln a + u (ln b - ln a)), u the first NextDouble of stream SeedFor(42, "sweep.random.<key>", i)
            double u = new RandomStream(RandomStream.SeedFor(42, "sweep.random.trainer.learning_rate", i)).NextDouble();
            double expected = Math.Exp(Math.Log(1e-4) + u * (Math.Log(1e-2) - Math.Log(1e-4)));
            double got = double.Parse(SweepExpander.Sample(42, lr, i), CultureInfo.InvariantCulture);
            Assert.Equal(expected, got, 15);
            Assert.InRange(got, 1e-4, 1e-2);
        }
        Assert.All(plan.Runs, r => Assert.InRange(double.Parse(r.ValueOf("trainer.discount")!, CultureInfo.InvariantCulture), 0.9, 0.99));
        Assert.All(plan.Runs, r => Assert.Contains(r.ValueOf("model.read_out"), new[] { "linear", "affine" }));
    }

    [Fact]
    public void Random_choice_covers_all_options_roughly_evenly()
    {
        var key = new RandomKeySpec("k", RandomDistribution.Choice, 0, 0, ["a", "b", "c"]);
        var counts = Enumerable.Range(0, 3000).Select(i => SweepExpander.Sample(7, key, i)).GroupBy(v => v).ToDictionary(g => g.Key, g => g.Count());
        // binomial(3000, 1/3): mean 1000, sd about 26; 850..1150 is a > 5 sd band (textbook binomial variance n p (1-p))
        Assert.All(new[] { "a", "b", "c" }, v => Assert.InRange(counts[v], 850, 1150));
    }

    [Fact]
    public void Adding_a_random_key_leaves_other_samples_unchanged()
    {
        var a = new RandomKeySpec("trainer.discount", RandomDistribution.Uniform, 0.9, 0.99, []);
        string before = SweepExpander.Sample(5, a, 3);
        using var files = new SweepTestFiles();
        string one = files.Write("one.yaml", "base: base-experiment.yaml\nrandom: {count: 4, seed: 5, keys: {trainer.discount: {uniform: [0.9, 0.99]}}}\n");
        string two = files.Write("two.yaml", "base: base-experiment.yaml\nrandom: {count: 4, seed: 5, keys: {trainer.discount: {uniform: [0.9, 0.99]}, model.width: {choice: [2, 4]}}}\n");
        Assert.Equal(before, SweepPlan.Load(one).Runs[3].ValueOf("trainer.discount"));
        Assert.Equal(before, SweepPlan.Load(two).Runs[3].ValueOf("trainer.discount"));
    }

    [Fact]
    public void Run_id_is_slug_plus_xxhash64_of_sorted_overrides()
    {
        // XXH64 of the empty input with seed 0 is 0xEF46DB3751D8E999 (xxHash reference test vector, from memory)
        Assert.Equal("base-ef46db3751", SweepRunId.For([]));
        var ab = new[] { new SweepOverride("trainer.kind", "dqn"), new SweepOverride("experiment.seed", "3") };
        var ba = ab.Reverse().ToArray();
        Assert.Equal("experiment.seed=3\ntrainer.kind=dqn\n", SweepRunId.Canonical(ab));
        Assert.Equal(SweepRunId.Hash(ab), SweepRunId.Hash(ba));
        Assert.Equal("kind-dqn_seed-3", SweepRunId.Slug(ab));
        Assert.StartsWith("kind-dqn_seed-3-", SweepRunId.For(ab));
        Assert.NotEqual(SweepRunId.Hash(ab), SweepRunId.Hash([new SweepOverride("trainer.kind", "dqn"), new SweepOverride("experiment.seed", "4")]));
    }

    [Fact]
    public void Reordering_axes_in_the_file_keeps_the_hash_part_of_ids()
    {
        using var files = new SweepTestFiles();
        string a = files.Write("a.yaml", "base: base-experiment.yaml\ngrid:\n  x.a: [1, 2]\n  x.b: [p, q]\n");
        string b = files.Write("b.yaml", "base: base-experiment.yaml\ngrid:\n  x.b: [p, q]\n  x.a: [1, 2]\n");
        static string HashOf(SweepRun r) => r.Id[(r.Id.LastIndexOf('-') + 1)..];
        var ha = SweepPlan.Load(a).Runs.Select(HashOf).Order().ToArray();
        var hb = SweepPlan.Load(b).Runs.Select(HashOf).Order().ToArray();
        Assert.Equal(ha, hb);
    }

    [Fact]
    public void Defaults_name_from_file_stem_and_runs_dir_relative_to_sweep_file()
    {
        using var files = new SweepTestFiles();
        string path = files.Write("sub/my-study.yaml", "base: ../base-experiment.yaml\nruns_dir: out\nseeds: [3]\n");
        var plan = SweepPlan.Load(path, defaultRunsDir: "/nowhere");
        Assert.Equal("my-study", plan.Name);
        Assert.Equal(Path.Combine(files.Dir, "sub", "out"), plan.RunsDir);
        Assert.Equal(Path.Combine(files.Dir, "sub", "out", "my-study"), plan.SweepDir);
        Assert.Single(plan.Runs);
        Assert.Equal("experiment.seed=3", plan.Runs[0].OverrideStrings.Single());
    }

    [Fact]
    public void Sweep_without_axes_is_one_run_of_the_base()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("plain.yaml", "base: base-experiment.yaml\n"));
        Assert.Single(plan.Runs);
        Assert.Empty(plan.Runs[0].Overrides);
        Assert.Equal("base-ef46db3751", plan.Runs[0].Id);
    }

    [Fact]
    public void Sequence_values_become_flow_yaml_overrides_and_several_zip_groups_multiply()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("z.yaml",
            "base: base-experiment.yaml\ngrid:\n  model.widths: [[4, 4], [8, 2]]\nzip:\n  - {a.x: [1, 2], a.y: [3, 4]}\n  - {b.x: [5, 6, 7]}\n"));
        Assert.Equal(2 * 2 * 3, plan.Runs.Count);
        Assert.Equal("model.widths=[4, 4]", plan.Runs[0].OverrideStrings[0]);
        Assert.Equal("b.x=6", plan.Runs[1].OverrideStrings[3]);
    }
}
