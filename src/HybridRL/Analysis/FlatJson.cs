using System.Globalization;
using System.Text.Json;

namespace HybridRL.Analysis;

/// <summary>Flattens a JSON document into dotted keys (objects by property name, arrays by index) with their raw scalar text.</summary>
public static class FlatJson
{
    public static IReadOnlyDictionary<string, string> Load(string path)
    {
        if (!File.Exists(path)) throw new FileNotFoundException($"JSON file not found: {path}", path);
        try
        {
            using var doc = JsonDocument.Parse(File.ReadAllText(path));
            var result = new SortedDictionary<string, string>(StringComparer.Ordinal);
            Flatten(doc.RootElement, "", result);
            return result;
        }
        catch (JsonException e)
        {
            throw new InvalidDataException($"{path}: invalid JSON: {e.Message}", e);
        }
    }

    private static void Flatten(JsonElement e, string prefix, IDictionary<string, string> into)
    {
        switch (e.ValueKind)
        {
            case JsonValueKind.Object:
                foreach (var p in e.EnumerateObject()) Flatten(p.Value, prefix.Length == 0 ? p.Name : prefix + "." + p.Name, into);
                break;
            case JsonValueKind.Array:
                int i = 0;
                foreach (var item in e.EnumerateArray()) Flatten(item, prefix + "." + (i++).ToString(CultureInfo.InvariantCulture), into);
                break;
            case JsonValueKind.String:
                into[prefix] = e.GetString() ?? "";
                break;
            case JsonValueKind.Null:
                into[prefix] = "";
                break;
            default:
                into[prefix] = e.GetRawText();
                break;
        }
    }

    /// <summary>Parses a flattened value as an invariant-culture number, or NaN.</summary>
    public static double Number(IReadOnlyDictionary<string, string> flat, string key) =>
        flat.TryGetValue(key, out var s) && double.TryParse(s, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) ? v : double.NaN;
}
