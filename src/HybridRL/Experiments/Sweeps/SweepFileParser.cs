using System.Globalization;
using System.Text;
using System.Text.RegularExpressions;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// Reads a sweep file (YAML) into a <see cref="SweepDefinition"/>. Top-level keys: <c>base</c> (required), <c>name</c>,
/// <c>runs_dir</c>, <c>grid</c>, <c>zip</c>, <c>random</c>, <c>seeds</c>. Every error names the file, the key and the line.
/// </summary>
public static partial class SweepFileParser
{
    private static readonly string[] TopLevelKeys = ["base", "name", "runs_dir", "grid", "zip", "random", "seeds"];

    [GeneratedRegex(@"^[A-Za-z_][A-Za-z0-9_]*(\.[A-Za-z_][A-Za-z0-9_]*)*$")]
    private static partial Regex DottedKey();

    [GeneratedRegex(@"^[A-Za-z0-9][A-Za-z0-9._-]*$")]
    private static partial Regex SafeName();

    /// <summary>Reads and validates the sweep file at <paramref name="path"/>.</summary>
    public static SweepDefinition Load(string path)
    {
        string full = Path.GetFullPath(path);
        if (!File.Exists(full)) throw new SweepFileException($"sweep file '{full}' does not exist") { FilePath = full };
        return Parse(File.ReadAllText(full), full);
    }

    /// <summary>Parses sweep YAML; <paramref name="sourcePath"/> anchors relative paths and names the file in errors.</summary>
    public static SweepDefinition Parse(string yaml, string sourcePath)
    {
        string file = Path.GetFullPath(sourcePath);
        var ctx = new Context(file);
        YamlMappingNode root;
        try
        {
            var stream = new YamlStream();
            stream.Load(new StringReader(yaml));
            if (stream.Documents.Count == 0 || stream.Documents[0].RootNode is not YamlMappingNode m)
                throw ctx.Error(null, null, "the sweep file must be a YAML mapping with at least a 'base' key");
            root = m;
        }
        catch (YamlException e)
        {
            throw new SweepFileException($"{file}:{e.Start.Line}: invalid YAML: {e.Message}", e) { FilePath = file };
        }

        var seen = new HashSet<string>(StringComparer.Ordinal);
        foreach (var (k, _) in root.Children)
        {
            string key = ctx.ScalarText(k, "top-level key");
            if (!TopLevelKeys.Contains(key))
                throw ctx.Error(k, key, $"unknown top-level key '{key}' (expected one of: {string.Join(", ", TopLevelKeys)})");
            if (!seen.Add(key)) throw ctx.Error(k, key, $"key '{key}' appears twice");
        }

        string dir = Path.GetDirectoryName(file)!;
        var baseNode = Get(root, "base") ?? throw ctx.Error(root, "base", "missing required key 'base' (path of the base experiment file, relative to the sweep file)");
        string baseRel = ctx.ScalarText(baseNode, "base");
        if (baseRel.Length == 0) throw ctx.Error(baseNode, "base", "'base' is empty");
        string basePath = Path.GetFullPath(Path.Combine(dir, baseRel));
        if (!File.Exists(basePath)) throw ctx.Error(baseNode, "base", $"base experiment file '{basePath}' does not exist");

        string name = Path.GetFileNameWithoutExtension(file);
        if (Get(root, "name") is { } nameNode)
        {
            name = ctx.ScalarText(nameNode, "name");
            if (!SafeName().IsMatch(name))
                throw ctx.Error(nameNode, "name", $"sweep name '{name}' must start with a letter or digit and hold only letters, digits, '.', '_' and '-' (it names a folder)");
        }
        else if (!SafeName().IsMatch(name))
            throw ctx.Error(root, "name", $"the file stem '{name}' is not a usable sweep name; set 'name:' (letters, digits, '.', '_', '-')");

        string? runsDir = null;
        if (Get(root, "runs_dir") is { } rdNode)
        {
            string rd = ctx.ScalarText(rdNode, "runs_dir");
            if (rd.Length == 0) throw ctx.Error(rdNode, "runs_dir", "'runs_dir' is empty");
            runsDir = Path.GetFullPath(Path.Combine(dir, rd));
        }

        var usedKeys = new Dictionary<string, string>(StringComparer.Ordinal); // key -> section that set it
        var grid = new List<SweepAxis>();
        if (Get(root, "grid") is { } gridNode)
        {
            foreach (var (k, v) in ctx.Mapping(gridNode, "grid").Children)
            {
                string key = ctx.ConfigKey(k, "grid", usedKeys);
                grid.Add(new SweepAxis(key, ctx.ValueList(v, $"grid.{key}")));
            }
        }

        var zips = new List<IReadOnlyList<SweepAxis>>();
        if (Get(root, "zip") is { } zipNode)
        {
            IEnumerable<YamlNode> groups = zipNode is YamlSequenceNode seq ? seq.Children : [zipNode];
            int gi = 0;
            foreach (var g in groups)
            {
                string section = zipNode is YamlSequenceNode ? $"zip[{gi}]" : "zip";
                var group = new List<SweepAxis>();
                foreach (var (k, v) in ctx.Mapping(g, section).Children)
                {
                    string key = ctx.ConfigKey(k, section, usedKeys);
                    group.Add(new SweepAxis(key, ctx.ValueList(v, $"{section}.{key}")));
                }
                if (group.Count == 0) throw ctx.Error(g, section, $"'{section}' has no keys");
                int n = group[0].Values.Count;
                foreach (var a in group)
                    if (a.Values.Count != n)
                        throw ctx.Error(g, $"{section}.{a.Key}",
                            $"zipped lists must have equal length: '{section}.{group[0].Key}' has {n} values but '{section}.{a.Key}' has {a.Values.Count}");
                zips.Add(group);
                gi++;
            }
        }

        RandomSampling? random = null;
        if (Get(root, "random") is { } randomNode) random = ParseRandom(ctx, randomNode, usedKeys);

        var seeds = new List<long>();
        if (Get(root, "seeds") is { } seedsNode)
        {
            if (usedKeys.TryGetValue(SweepDefinition.SeedKey, out var where))
                throw ctx.Error(seedsNode, "seeds", $"'seeds' sets '{SweepDefinition.SeedKey}', which '{where}' already sets");
            if (seedsNode is not YamlSequenceNode ss || ss.Children.Count == 0)
                throw ctx.Error(seedsNode, "seeds", "'seeds' must be a non-empty list of integers, e.g. [1, 2, 3]");
            var distinct = new HashSet<long>();
            foreach (var s in ss.Children)
            {
                string t = ctx.ScalarText(s, "seeds");
                if (!long.TryParse(t, NumberStyles.Integer, CultureInfo.InvariantCulture, out long v) || v < 0)
                    throw ctx.Error(s, "seeds", $"seed '{t}' is not a non-negative integer");
                if (!distinct.Add(v)) throw ctx.Error(s, "seeds", $"seed {v} is listed twice");
                seeds.Add(v);
            }
        }

        return new SweepDefinition(file, name, basePath, runsDir, grid, zips, random, seeds);
    }

    private static RandomSampling ParseRandom(Context ctx, YamlNode node, Dictionary<string, string> usedKeys)
    {
        var m = ctx.Mapping(node, "random");
        foreach (var (k, _) in m.Children)
        {
            string key = ctx.ScalarText(k, "random");
            if (key is not ("count" or "seed" or "keys"))
                throw ctx.Error(k, $"random.{key}", $"unknown key 'random.{key}' (expected count, seed, keys)");
        }
        var countNode = Get(m, "count") ?? throw ctx.Error(node, "random.count", "missing 'random.count' (number of samples)");
        string ct = ctx.ScalarText(countNode, "random.count");
        if (!int.TryParse(ct, NumberStyles.Integer, CultureInfo.InvariantCulture, out int count) || count <= 0)
            throw ctx.Error(countNode, "random.count", $"'random.count' must be a positive integer, got '{ct}'");
        var seedNode = Get(m, "seed") ?? throw ctx.Error(node, "random.seed", "missing 'random.seed' (seed of the sampling streams)");
        string st = ctx.ScalarText(seedNode, "random.seed");
        if (!ulong.TryParse(st, NumberStyles.Integer, CultureInfo.InvariantCulture, out ulong seed))
            throw ctx.Error(seedNode, "random.seed", $"'random.seed' must be a non-negative integer, got '{st}'");
        var keysNode = Get(m, "keys") ?? throw ctx.Error(node, "random.keys", "missing 'random.keys' (key: {uniform|log_uniform|choice: ...})");
        var keys = new List<RandomKeySpec>();
        foreach (var (k, v) in ctx.Mapping(keysNode, "random.keys").Children)
        {
            string key = ctx.ConfigKey(k, "random.keys", usedKeys);
            string where = $"random.keys.{key}";
            if (v is not YamlMappingNode spec || spec.Children.Count != 1)
                throw ctx.Error(v, where, $"'{where}' must be exactly one of {{uniform: [a, b]}}, {{log_uniform: [a, b]}}, {{choice: [...]}}");
            var (kindNode, arg) = spec.Children.First();
            string kind = ctx.ScalarText(kindNode, where);
            switch (kind)
            {
                case "uniform":
                case "log_uniform":
                {
                    var list = ctx.ValueList(arg, $"{where}.{kind}");
                    if (list.Count != 2) throw ctx.Error(arg, where, $"'{where}.{kind}' needs two bounds [low, high], got {list.Count} values");
                    double lo = ctx.Number(arg, where, list[0]), hi = ctx.Number(arg, where, list[1]);
                    if (!(lo < hi)) throw ctx.Error(arg, where, $"'{where}.{kind}' needs low < high, got [{list[0]}, {list[1]}]");
                    if (kind == "log_uniform" && lo <= 0)
                        throw ctx.Error(arg, where, $"'{where}.log_uniform' needs positive bounds, got low = {list[0]}");
                    keys.Add(new RandomKeySpec(key, kind == "uniform" ? RandomDistribution.Uniform : RandomDistribution.LogUniform, lo, hi, []));
                    break;
                }
                case "choice":
                    keys.Add(new RandomKeySpec(key, RandomDistribution.Choice, 0, 0, ctx.ValueList(arg, $"{where}.choice")));
                    break;
                default:
                    throw ctx.Error(kindNode, where, $"unknown distribution '{kind}' for '{where}' (expected uniform, log_uniform or choice)");
            }
        }
        if (keys.Count == 0) throw ctx.Error(keysNode, "random.keys", "'random.keys' has no keys");
        return new RandomSampling(count, seed, keys);
    }

    private static YamlNode? Get(YamlMappingNode m, string key)
    {
        foreach (var (k, v) in m.Children)
            if (k is YamlScalarNode s && s.Value == key) return v;
        return null;
    }

    /// <summary>Renders a YAML value as override text: scalars as written, sequences/mappings in flow form.</summary>
    internal static string Render(YamlNode node)
    {
        switch (node)
        {
            case YamlScalarNode s:
                return s.Value ?? "";
            case YamlSequenceNode q:
                return "[" + string.Join(", ", q.Children.Select(Render)) + "]";
            case YamlMappingNode m:
                var sb = new StringBuilder("{");
                bool first = true;
                foreach (var (k, v) in m.Children)
                {
                    if (!first) sb.Append(", ");
                    sb.Append(Render(k)).Append(": ").Append(Render(v));
                    first = false;
                }
                return sb.Append('}').ToString();
            default:
                return node.ToString();
        }
    }

    private sealed class Context(string file)
    {
        public SweepFileException Error(YamlNode? node, string? key, string message)
        {
            string where = node is null ? file : $"{file}:{node.Start.Line}";
            return new SweepFileException($"{where}: {message}") { FilePath = file, Key = key };
        }

        public string ScalarText(YamlNode node, string key)
        {
            if (node is not YamlScalarNode s) throw Error(node, key, $"'{key}' must be a single value, not a list or mapping");
            return s.Value ?? "";
        }

        public YamlMappingNode Mapping(YamlNode node, string key) =>
            node as YamlMappingNode ?? throw Error(node, key, $"'{key}' must be a mapping of dotted config keys to values");

        public string ConfigKey(YamlNode node, string section, Dictionary<string, string> used)
        {
            string key = ScalarText(node, section);
            if (!DottedKey().IsMatch(key))
                throw Error(node, $"{section}.{key}", $"'{key}' under '{section}' is not a dotted config key (e.g. trainer.kind)");
            if (used.TryGetValue(key, out var other))
                throw Error(node, key, $"key '{key}' is swept twice (in '{other}' and '{section}')");
            used[key] = section;
            return key;
        }

        public IReadOnlyList<string> ValueList(YamlNode node, string key)
        {
            if (node is not YamlSequenceNode seq) throw Error(node, key, $"'{key}' must be a list of values, e.g. [a, b]");
            if (seq.Children.Count == 0) throw Error(node, key, $"'{key}' is an empty list");
            var values = seq.Children.Select(Render).ToArray();
            var dup = values.GroupBy(v => v, StringComparer.Ordinal).FirstOrDefault(g => g.Count() > 1);
            if (dup is not null) throw Error(node, key, $"'{key}' lists the value '{dup.Key}' twice");
            return values;
        }

        public double Number(YamlNode node, string key, string text)
        {
            if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double d) || !double.IsFinite(d))
                throw Error(node, key, $"'{key}' bound '{text}' is not a finite number");
            return d;
        }
    }
}
