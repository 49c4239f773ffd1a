using System.Globalization;
using System.Text;

namespace HybridRL.Experiments.Config;

/// <summary>Writes a spec as canonical YAML: every applicable key of <see cref="ConfigKeyTable"/> in table order, then nothing else.</summary>
internal static class SpecYamlWriter
{
    private sealed class Node
    {
        public required string Name { get; init; }
        public string? Value { get; set; }
        public string? Description { get; set; }
        public List<Node> Children { get; } = new();

        public Node Child(string name)
        {
            var existing = Children.FirstOrDefault(c => c.Name == name);
            if (existing is not null) return existing;
            var node = new Node { Name = name };
            Children.Add(node);
            return node;
        }
    }

    /// <summary>Applicable keys of a spec as (dotted path, canonical value text, key) in table order; environment parameters follow environment.kind.</summary>
    public static List<(string Path, string Value, ConfigKey? Key)> Flatten(ExperimentSpec spec)
    {
        var result = new List<(string, string, ConfigKey?)>();
        var applies = new Dictionary<string, bool>(StringComparer.Ordinal);
        bool Applies(ConfigKey key)
        {
            if (applies.TryGetValue(key.Path, out var known)) return known;
            var ok = key.AppliesWhen.All(c =>
            {
                var target = ConfigKeyTable.Find(c.Key)!;
                return Applies(target) && target.Read(spec) is string v && c.Values.Contains(v);
            });
            applies[key.Path] = ok;
            return ok;
        }
        foreach (var key in ConfigKeyTable.All)
        {
            if (!Applies(key)) continue;
            var value = key.Read(spec);
            if (value is null) continue;
            result.Add((key.Path, ConfigValueFormat.Format(key.Kind, value), key));
            if (key.Path == "environment.kind")
            {
                foreach (var (param, text) in spec.Environment.Parameters)
                    result.Add(("environment." + param.Replace(':', '.'), text == YamlConfigFile.EmptyListMarker ? "[]" : ConfigValueFormat.Quote(text), null));
            }
        }
        return result;
    }

    public static string Write(ExperimentSpec spec, bool withDescriptions)
    {
        var root = new Node { Name = "" };
        foreach (var (path, value, key) in Flatten(spec))
        {
            var node = root;
            foreach (var segment in path.Split('.')) node = node.Child(segment);
            node.Value = value;
            node.Description = key?.Description;
        }
        var sb = new StringBuilder();
        if (withDescriptions)
        {
            sb.Append("# Resolved HybridRL experiment: every key with its value (defaults filled in).\n");
            sb.Append("# config_hash: ").Append(spec.Hash()).Append('\n');
        }
        foreach (var section in root.Children)
        {
            if (withDescriptions) sb.Append('\n');
            Emit(sb, section, 0, withDescriptions);
        }
        return sb.ToString();
    }

    private static bool IsSequence(Node node) =>
        node.Children.Count > 0 && node.Children.Select((c, i) => c.Name == i.ToString(CultureInfo.InvariantCulture)).All(b => b);

    private static void Emit(StringBuilder sb, Node node, int indent, bool withDescriptions)
    {
        var pad = new string(' ', indent);
        if (withDescriptions && node.Description is not null) sb.Append(pad).Append("# ").Append(node.Description).Append('\n');
        if (node.Children.Count == 0)
        {
            sb.Append(pad).Append(node.Name).Append(": ").Append(node.Value).Append('\n');
            return;
        }
        sb.Append(pad).Append(node.Name).Append(":\n");
        EmitChildren(sb, node, indent + 2, withDescriptions);
    }

    private static void EmitChildren(StringBuilder sb, Node node, int indent, bool withDescriptions)
    {
        var pad = new string(' ', indent);
        if (IsSequence(node))
        {
            foreach (var item in node.Children)
            {
                if (item.Children.Count == 0) sb.Append(pad).Append("- ").Append(item.Value).Append('\n');
                else
                {
                    sb.Append(pad).Append("-\n");
                    EmitChildren(sb, item, indent + 2, withDescriptions);
                }
            }
            return;
        }
        foreach (var child in node.Children) Emit(sb, child, indent, withDescriptions);
    }
}
