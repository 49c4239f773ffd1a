using System.Globalization;
using YamlDotNet.RepresentationModel;

namespace HybridRL.Analysis.Ledger;

/// <summary>
/// A user-supplied description of a quantum device's timing and price, used only to turn execution and shot
/// counts into estimated device time and cost. All numbers come from the user; nothing here is a vendor figure.
/// YAML keys: name, note (optional), seconds_per_shot, per_circuit_overhead_seconds, circuits_per_job,
/// queue_latency_seconds, price_per_shot (optional), currency (required with price_per_shot).
/// </summary>
public sealed record HardwareProfile(
    string Name,
    string Note,
    double SecondsPerShot,
    double PerCircuitOverheadSeconds,
    int CircuitsPerJob,
    double QueueLatencySeconds,
    double? PricePerShot = null,
    string? Currency = null)
{
    private static readonly string[] Known =
        ["name", "note", "seconds_per_shot", "per_circuit_overhead_seconds", "circuits_per_job", "queue_latency_seconds", "price_per_shot", "currency"];

    public static HardwareProfile Load(string path)
    {
        if (!File.Exists(path)) throw new FileNotFoundException($"hardware profile not found: {path}", path);
        using var reader = new StreamReader(path);
        return Parse(reader, path);
    }

    public static HardwareProfile Parse(TextReader reader, string source)
    {
        var stream = new YamlStream();
        try { stream.Load(reader); }
        catch (YamlDotNet.Core.YamlException e) { throw new InvalidDataException($"{source}: invalid YAML at line {e.Start.Line}: {e.Message}", e); }
        if (stream.Documents.Count == 0 || stream.Documents[0].RootNode is not YamlMappingNode map)
            throw new InvalidDataException($"{source}: a hardware profile must be a YAML mapping of keys {string.Join(", ", Known)}");

        var values = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var (k, v) in map.Children)
        {
            string key = (k as YamlScalarNode)?.Value ?? k.ToString();
            if (!Known.Contains(key)) throw new InvalidDataException($"{source}: unknown key '{key}'; known keys: {string.Join(", ", Known)}");
            if (v is not YamlScalarNode s) throw new InvalidDataException($"{source}: key '{key}' must be a single value");
            values[key] = s.Value ?? "";
        }

        string name = Required(values, "name", source);
        if (name.Trim().Length == 0) throw new InvalidDataException($"{source}: key 'name' must not be empty");
        double sps = NonNegative(values, "seconds_per_shot", source);
        double overhead = NonNegative(values, "per_circuit_overhead_seconds", source);
        double cpjValue = NonNegative(values, "circuits_per_job", source);
        if (cpjValue < 1 || cpjValue != Math.Floor(cpjValue) || cpjValue > int.MaxValue)
            throw new InvalidDataException($"{source}: key 'circuits_per_job' must be a whole number ≥ 1, got '{values["circuits_per_job"]}'");
        double queue = NonNegative(values, "queue_latency_seconds", source);
        double? price = values.ContainsKey("price_per_shot") ? NonNegative(values, "price_per_shot", source) : null;
        string? currency = values.TryGetValue("currency", out var c) ? c.Trim() : null;
        if (price is not null && string.IsNullOrEmpty(currency))
            throw new InvalidDataException($"{source}: key 'currency' is required when 'price_per_shot' is given");
        return new HardwareProfile(name.Trim(), values.TryGetValue("note", out var note) ? note : "", sps, overhead, (int)cpjValue, queue, price, currency);
    }

    private static string Required(Dictionary<string, string> values, string key, string source) =>
        values.TryGetValue(key, out var v) ? v : throw new InvalidDataException($"{source}: missing required key '{key}'");

    private static double NonNegative(Dictionary<string, string> values, string key, string source)
    {
        string text = Required(values, key, source);
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || double.IsNaN(v) || double.IsInfinity(v))
            throw new InvalidDataException($"{source}: key '{key}' must be a number, got '{text}'");
        if (v < 0) throw new InvalidDataException($"{source}: key '{key}' must be ≥ 0, got {text}");
        return v;
    }
}
