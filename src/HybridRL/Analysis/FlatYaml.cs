using System.Globalization;
using YamlDotNet.RepresentationModel;

namespace HybridRL.Analysis;

/// <summary>
/// Flattens a YAML document into dotted keys (mapping keys joined by '.', sequence items by index,
/// e.g. <c>trainer.kind</c>, <c>model.layers.0</c>) with scalar string values, using YamlDotNet's representation model.
/// </summary>
public static class FlatYaml
{
    public static IReadOnlyDictionary<string, string> Load(string path)
    {
        if (!File.Exists(path)) throw new FileNotFoundException($"YAML file not found: {path}", path);
        using var reader = new StreamReader(path);
        try
        {
            return Parse(reader);
        }
        catch (YamlDotNet.Core.YamlException e)
        {
            throw new InvalidDataException($"{path}: invalid YAML at line {e.Start.Line}: {e.Message}", e);
        }
    }

    public static IReadOnlyDictionary<string, string> Parse(TextReader reader)
    {
        var stream = new YamlStream();
        stream.Load(reader);
        var result = new SortedDictionary<string, string>(StringComparer.Ordinal);
        if (stream.Documents.Count > 0) Flatten(stream.Documents[0].RootNode, "", result);
        return result;
    }

    private static void Flatten(YamlNode node, string prefix, IDictionary<string, string> into)
    {
        switch (node)
        {
            case YamlMappingNode map:
                foreach (var (k, v) in map.Children)
                {
                    string key = k is YamlScalarNode s ? s.Value ?? "" : k.ToString();
                    Flatten(v, prefix.Length == 0 ? key : prefix + "." + key, into);
                }
                break;
            case YamlSequenceNode seq:
                for (int i = 0; i < seq.Children.Count; i++)
                    Flatten(seq.Children[i], prefix + "." + i.ToString(CultureInfo.InvariantCulture), into);
                break;
            case YamlScalarNode scalar:
                into[prefix] = scalar.Value ?? "";
                break;
        }
    }
}
