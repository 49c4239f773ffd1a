using HybridRL.Experiments.Sweeps;

namespace HybridRL.Tests.Sweeps;

public class SweepFileErrorTests
{
    private static SweepFileException Fails(string yaml)
    {
        using var files = new SweepTestFiles();
        string path = files.Write("bad.yaml", yaml);
        var e = Assert.Throws<SweepFileException>(() => SweepPlan.Load(path));
        Assert.Contains("bad.yaml", e.Message);
        return e;
    }

    [Theory]
    [InlineData("grid:\n  a.b: [1]\n", "base", "missing required key 'base'")]
    [InlineData("base: nope.yaml\n", "base", "does not exist")]
    [InlineData("base: base-experiment.yaml\ngird:\n  a: [1]\n", "gird", "unknown top-level key 'gird'")]
    [InlineData("base: base-experiment.yaml\ngrid:\n  trainer.kind: dqn\n", "grid.trainer.kind", "must be a list")]
    [InlineData("base: base-experiment.yaml\ngrid:\n  trainer.kind: []\n", "grid.trainer.kind", "empty list")]
    [InlineData("base: base-experiment.yaml\ngrid:\n  trainer.kind: [dqn, dqn]\n", "grid.trainer.kind", "twice")]
    [InlineData("base: base-experiment.yaml\ngrid:\n  'trainer..kind': [a]\n", "grid.trainer..kind", "not a dotted config key")]
    [InlineData("base: base-experiment.yaml\nzip:\n  a.x: [1, 2]\n  a.y: [1, 2, 3]\n", "zip.a.y", "equal length")]
    [InlineData("base: base-experiment.yaml\ngrid:\n  a.x: [1]\nzip:\n  a.x: [1]\n", "a.x", "swept twice")]
    [InlineData("base: base-experiment.yaml\nrandom: {seed: 1, keys: {a.x: {uniform: [0, 1]}}}\n", "random.count", "missing 'random.count'")]
    [InlineData("base: base-experiment.yaml\nrandom: {count: 0, seed: 1, keys: {a.x: {uniform: [0, 1]}}}\n", "random.count", "positive integer")]
    [InlineData("base: base-experiment.yaml\nrandom: {count: 2, seed: -1, keys: {a.x: {uniform: [0, 1]}}}\n", "random.seed", "non-negative integer")]
    [InlineData("base: base-experiment.yaml\nrandom: {count: 2, seed: 1, keys: {a.x: {log_uniform: [0, 1]}}}\n", "random.keys.a.x", "positive bounds")]
    [InlineData("base: base-experiment.yaml\nrandom: {count: 2, seed: 1, keys: {a.x: {uniform: [2, 1]}}}\n", "random.keys.a.x", "low < high")]
    [InlineData("base: base-experiment.yaml\nrandom: {count: 2, seed: 1, keys: {a.x: {uniform: [0, big]}}}\n", "random.keys.a.x", "not a finite number")]
    [InlineData("base: base-experiment.yaml\nrandom: {count: 2, seed: 1, keys: {a.x: {normal: [0, 1]}}}\n", "random.keys.a.x", "unknown distribution 'normal'")]
    [InlineData("base: base-experiment.yaml\ngrid:\n  experiment.seed: [1]\nseeds: [1, 2]\n", "seeds", "already sets")]
    [InlineData("base: base-experiment.yaml\nseeds: [1, x]\n", "seeds", "'x' is not a non-negative integer")]
    [InlineData("base: base-experiment.yaml\nname: 'a b'\n", "name", "sweep name 'a b'")]
    public void Bad_sweep_files_name_the_key(string yaml, string key, string fragment)
    {
        var e = Fails(yaml);
        Assert.Equal(key, e.Key);
        Assert.Contains(fragment, e.Message);
    }

    [Fact]
    public void Invalid_yaml_reports_file_and_line()
    {
        var e = Fails("base: base-experiment.yaml\ngrid: [unclosed\n");
        Assert.Contains("invalid YAML", e.Message);
    }

    [Fact]
    public void Out_of_range_index_names_the_range()
    {
        using var files = new SweepTestFiles();
        var plan = SweepPlan.Load(files.Write("s.yaml", "base: base-experiment.yaml\nseeds: [1, 2]\n"));
        var e = Assert.Throws<SweepFileException>(() => plan.Run(2));
        Assert.Contains("0..1", e.Message);
    }
}
