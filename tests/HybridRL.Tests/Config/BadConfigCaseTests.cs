using HybridRL.Experiments;
using HybridRL.Experiments.Config;

namespace HybridRL.Tests.Config;

public sealed class BadConfigCaseTests
{
    public static TheoryData<string> CaseNames()
    {
        var data = new TheoryData<string>();
        foreach (var c in BadConfigCase.All()) data.Add(Path.GetFileName(c.File));
        return data;
    }

    [Theory]
    [MemberData(nameof(CaseNames))]
    public void Each_malformed_file_fails_with_its_specific_message(string name)
    {
        var c = BadConfigCase.Parse(Path.Combine(ConfigTestPaths.BadCasesFolder, name));
        // With the environment layer's validator, as the CLI plugs it in (CommandRunner), so cases that depend on the
        // environment's parameters or shape (e.g. its observation size) fail here too.
        var ex = Assert.Throws<ConfigException>(() => ExperimentSpecLoader.Load([c.File], c.Sets, new Dictionary<string, string>(c.Environment), new EnvironmentKeyValidator()));
        var match = ex.Errors.FirstOrDefault(e => e.Message.Contains(c.Expect, StringComparison.Ordinal));
        Assert.True(match is not null, $"{name}: no error contains \"{c.Expect}\"; got:{Environment.NewLine}{ex.Message}");
        if (c.Key is not null) Assert.Equal(c.Key, match!.Key);
        if (c.Line is not null)
        {
            Assert.Equal(c.Line, match!.Line);
            Assert.EndsWith(Path.GetFileName(c.File), match.File);
        }
    }

    [Fact]
    public void There_are_at_least_25_cases_with_distinct_messages()
    {
        var cases = BadConfigCase.All();
        Assert.True(cases.Count >= 25, $"only {cases.Count} cases");
        Assert.Equal(cases.Count, cases.Select(c => c.Expect).Distinct(StringComparer.Ordinal).Count());
    }
}
