using System.Globalization;
using YamlDotNet.RepresentationModel;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// A simple budget resolver for <see cref="SweepPlanTable"/>: each budget key's value is taken from the run's overrides, else from the
/// base experiment YAML by dotted path (nested mappings). Non-numeric or missing values are left out. The application may instead
/// resolve budgets through its full config system (defaults, includes).
/// </summary>
public sealed class YamlBudgetResolver
{
    private readonly IReadOnlyList<string> _keys;
    private readonly Dictionary<string, double> _base = new(StringComparer.Ordinal);

    public YamlBudgetResolver(string baseYamlPath, IReadOnlyList<string> budgetKeys)
    {
        _keys = budgetKeys;
        var stream = new YamlStream();
        using (var reader = File.OpenText(baseYamlPath)) stream.Load(reader);
        if (stream.Documents.Count > 0)
            foreach (var key in budgetKeys)
                if (Lookup(stream.Documents[0].RootNode, key) is { } text && TryNumber(text, out double v))
                    _base[key] = v;
    }

    /// <summary>The budget keys and their values for one run.</summary>
    public IReadOnlyDictionary<string, double> Resolve(SweepRun run)
    {
        var result = new Dictionary<string, double>(StringComparer.Ordinal);
        foreach (var key in _keys)
        {
            if (run.ValueOf(key) is { } text)
            {
                if (TryNumber(text, out double v)) result[key] = v;
            }
            else if (_base.TryGetValue(key, out double b)) result[key] = b;
        }
        return result;
    }

    private static string? Lookup(YamlNode node, string dotted)
    {
        foreach (var part in dotted.Split('.'))
        {
            if (node is not YamlMappingNode m) return null;
            YamlNode? next = null;
            foreach (var (k, v) in m.Children)
                if (k is YamlScalarNode s && s.Value == part) { next = v; break; }
            if (next is null) return null;
            node = next;
        }
        return node is YamlScalarNode sc ? sc.Value : null;
    }

    private static bool TryNumber(string text, out double value) =>
        double.TryParse(text.Replace("_", ""), NumberStyles.Float, CultureInfo.InvariantCulture, out value);
}
