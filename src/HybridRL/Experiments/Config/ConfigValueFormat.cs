using System.Globalization;
using System.Text;

namespace HybridRL.Experiments.Config;

/// <summary>Canonical YAML text of configuration values (invariant culture, round-trip doubles).</summary>
public static class ConfigValueFormat
{
    public static string Format(ConfigValueKind kind, object value) => (kind, value) switch
    {
        (ConfigValueKind.Integer, long l) => l.ToString(CultureInfo.InvariantCulture),
        (ConfigValueKind.Integer, ulong u) => u.ToString(CultureInfo.InvariantCulture),
        (ConfigValueKind.Number, double d) => FormatDouble(d),
        (ConfigValueKind.Boolean, bool b) => b ? "true" : "false",
        (ConfigValueKind.Text, string s) => Quote(s),
        (ConfigValueKind.Choice, string s) => s,
        (ConfigValueKind.IntegerList, EquatableList<long> list) => "[" + string.Join(", ", list.Select(x => x.ToString(CultureInfo.InvariantCulture))) + "]",
        (ConfigValueKind.ChoiceList, EquatableList<string> list) => "[" + string.Join(", ", list) + "]",
        _ => throw new ArgumentException($"Value {value} ({value.GetType().Name}) does not match kind {kind}."),
    };

    /// <summary>Round-trip double text that YAML and the loader read back as the same double.</summary>
    public static string FormatDouble(double d)
    {
        var s = d.ToString("R", CultureInfo.InvariantCulture);
        return s;
    }

    /// <summary>Double-quoted YAML string with escapes.</summary>
    public static string Quote(string s)
    {
        var sb = new StringBuilder(s.Length + 2).Append('"');
        foreach (var c in s)
        {
            switch (c)
            {
                case '"': sb.Append("\\\""); break;
                case '\\': sb.Append("\\\\"); break;
                case '\n': sb.Append("\\n"); break;
                case '\r': sb.Append("\\r"); break;
                case '\t': sb.Append("\\t"); break;
                default:
                    if (char.IsControl(c)) sb.Append("\\u").Append(((int)c).ToString("x4", CultureInfo.InvariantCulture));
                    else sb.Append(c);
                    break;
            }
        }
        return sb.Append('"').ToString();
    }
}
