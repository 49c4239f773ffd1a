using HybridRL.Experiments.Config;

namespace HybridRL.Tests.Config;

public sealed class ConfigKeyTableTests
{
    [Fact]
    public void Every_key_is_snake_case_unique_described_and_its_default_is_in_range()
    {
        Assert.Equal(ConfigKeyTable.All.Count, ConfigKeyTable.All.Select(k => k.Path).Distinct().Count());
        foreach (var key in ConfigKeyTable.All)
        {
            Assert.Matches("^[a-z][a-z0-9_]*(\\.[a-z][a-z0-9_]*)+$", key.Path);
            Assert.False(string.IsNullOrWhiteSpace(key.Description), key.Path);
            foreach (var c in key.AppliesWhen)
            {
                var target = ConfigKeyTable.Find(c.Key);
                Assert.True(target is { Kind: ConfigValueKind.Choice }, $"{key.Path} depends on {c.Key}");
                Assert.All(c.Values, v => Assert.Contains(v, target!.Choices));
            }
            switch (key.Default)
            {
                case long l: AssertInRange(key, l); break;
                case double d: AssertInRange(key, d); break;
                case EquatableList<long> list: Assert.All(list, x => AssertInRange(key, x)); break;
                case string s when key.Kind == ConfigValueKind.Choice: Assert.Contains(s, key.Choices); break;
                case EquatableList<string> names: Assert.All(names, n => Assert.Contains(n, key.Choices)); break;
            }
        }
    }

    private static void AssertInRange(ConfigKey key, double v)
    {
        if (key.Minimum is { } min) Assert.True(key.MinimumExclusive ? v > min : v >= min, key.Path);
        if (key.Maximum is { } max) Assert.True(v <= max, key.Path);
    }

    [Fact]
    public void Markdown_lists_every_key()
    {
        var md = ConfigKeyTable.ToMarkdown();
        Assert.All(ConfigKeyTable.All, k => Assert.Contains("`" + k.Path + "`", md));
    }

    [Fact]
    public void Choice_names_are_snake_case_of_the_members()
    {
        Assert.Equal("product_zz", ChoiceNames.ToName(EncodingKind.ProductZz));
        Assert.Equal("evolution_strategies", ChoiceNames.ToName(TrainerKind.EvolutionStrategies));
        Assert.Equal(EntanglerLayout.AllToAll, ChoiceNames.Parse<EntanglerLayout>("all_to_all"));
        Assert.False(ChoiceNames.TryParse<EntanglerLayout>("AllToAll", out _));
    }

    [Fact]
    public void Levenshtein_distance_matches_hand_worked_cases()
    {
        // kitten → sitting: substitute k→s, e→i, insert g = 3 (the standard worked example, checked by hand).
        Assert.Equal(3, KeySuggester.Distance("kitten", "sitting"));
        Assert.Equal(0, KeySuggester.Distance("gamma", "gamma"));
        Assert.Equal(5, KeySuggester.Distance("", "gamma"));
        Assert.Equal(1, KeySuggester.Distance("gama", "gamma"));
        Assert.Equal(2, KeySuggester.Distance("ab", "ba")); // no transpositions in plain Levenshtein
    }

    [Fact]
    public void Suggestions_prefer_the_same_leaf_and_give_up_when_nothing_is_close()
    {
        var keys = ConfigKeyTable.All.Select(k => k.Path).ToList();
        Assert.Equal("trainer.dqn.batch_size", KeySuggester.Suggest("trainer.batch_size", keys));
        Assert.Equal("model.circuit.qubits", KeySuggester.Suggest("model.circuit.qbits", keys));
        Assert.Null(KeySuggester.Suggest("completely.unrelated_thing", keys));
    }

    [Fact]
    public void Cma_es_default_population_follows_hansen()
    {
        var cma = new CmaEsSettings { Population = 0, Sigma0 = 0.5, EpisodesPerMember = 1, EvalEvery = 0, EvalEpisodes = 1 };
        // Hansen (2016), "The CMA Evolution Strategy: A Tutorial", Table 1: λ = 4 + ⌊3 ln n⌋. n = 10: 3 ln 10 = 6.907… → 10.
        Assert.Equal(10, cma.ResolvePopulation(10));
        // n = 100: 3 ln 100 = 13.815… → 17.
        Assert.Equal(17, cma.ResolvePopulation(100));
        Assert.Equal(4, cma.ResolvePopulation(1)); // ln 1 = 0
        Assert.Equal(12, (cma with { Population = 12 }).ResolvePopulation(100));
    }
}
