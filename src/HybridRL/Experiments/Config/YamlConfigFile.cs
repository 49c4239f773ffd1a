using System.Text;
using System.Text.RegularExpressions;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace HybridRL.Experiments.Config;

/// <summary>
/// One YAML configuration file flattened into "a:b:c" keys, with the file and line of every scalar.
/// Sequences become indexed keys ("a:0", "a:1"); an empty sequence is stored as the value "[]";
/// a plain null scalar (<c>~</c>, <c>null</c> or nothing) is stored as a null value, which masks
/// the same key in lower layers (the key falls back to its default).
/// The top-level key <c>extends</c> is not stored as a value: it names a base file (see <see cref="Extends"/>).
/// </summary>
public sealed partial class YamlConfigFile
{
    /// <summary>Value stored for an empty YAML sequence.</summary>
    public const string EmptyListMarker = "[]";

    private readonly Dictionary<string, string?> _values = new(StringComparer.OrdinalIgnoreCase);
    private readonly Dictionary<string, ConfigOrigin> _origins = new(StringComparer.OrdinalIgnoreCase);
    private readonly List<ConfigError> _errors = new();

    private YamlConfigFile(string fullPath, string displayPath)
    {
        FullPath = fullPath;
        DisplayPath = displayPath;
    }

    /// <summary>Absolute, normalised path (identity for cycle detection).</summary>
    public string FullPath { get; }

    /// <summary>Path as shown in messages (relative to the current directory when below it).</summary>
    public string DisplayPath { get; }

    /// <summary>Flattened values (keys with ':' separators).</summary>
    public IReadOnlyDictionary<string, string?> Values => _values;

    /// <summary>Origins for every flattened value and for every section/list prefix.</summary>
    public IReadOnlyDictionary<string, ConfigOrigin> Origins => _origins;

    /// <summary>The raw <c>extends</c> value (relative to this file's folder), or null.</summary>
    public string? Extends { get; private set; }

    /// <summary>Line of the <c>extends</c> key.</summary>
    public int? ExtendsLine { get; private set; }

    /// <summary>Problems reading or parsing the file (the file is unusable when non-empty).</summary>
    public IReadOnlyList<ConfigError> Errors => _errors;

    [GeneratedRegex("^[a-z][a-z0-9_]*$")]
    private static partial Regex KeyPattern();

    /// <summary>Shows a path relative to the current directory when it lies below it.</summary>
    public static string DisplayPathFor(string fullPath)
    {
        var relative = Path.GetRelativePath(Directory.GetCurrentDirectory(), fullPath);
        return relative.StartsWith("..", StringComparison.Ordinal) || Path.IsPathRooted(relative) ? fullPath : relative;
    }

    /// <summary>Reads and flattens a file. Never throws for bad input: problems land in <see cref="Errors"/>.</summary>
    /// <param name="path">File to read.</param>
    /// <param name="keyPrefix">Optional prefix (e.g. "hardware") put in front of every key.</param>
    /// <param name="allowExtends">Whether a top-level <c>extends</c> key is allowed.</param>
    public static YamlConfigFile Read(string path, string? keyPrefix = null, bool allowExtends = true)
    {
        var full = Path.GetFullPath(path);
        var file = new YamlConfigFile(full, DisplayPathFor(full));
        string text;
        try
        {
            if (Directory.Exists(full))
            {
                file.Fail(null, $"cannot read '{file.DisplayPath}': it is a folder, not a file");
                return file;
            }
            if (!File.Exists(full))
            {
                file.Fail(null, $"cannot read '{file.DisplayPath}': file not found");
                return file;
            }
            var bytes = File.ReadAllBytes(full);
            text = new UTF8Encoding(encoderShouldEmitUTF8Identifier: false, throwOnInvalidBytes: true).GetString(bytes);
            if (text.Length > 0 && text[0] == '\uFEFF') text = text[1..];
        }
        catch (DecoderFallbackException)
        {
            file.Fail(null, $"cannot read '{file.DisplayPath}': it is not valid UTF-8 text");
            return file;
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException)
        {
            file.Fail(null, $"cannot read '{file.DisplayPath}': {ex.Message}");
            return file;
        }
        file.Parse(text, keyPrefix, allowExtends);
        return file;
    }

    /// <summary>Parses YAML text as if it were the file <paramref name="displayPath"/> (used by tests and in-memory specs).</summary>
    public static YamlConfigFile FromText(string text, string displayPath, string? keyPrefix = null, bool allowExtends = true)
    {
        var file = new YamlConfigFile(Path.GetFullPath(displayPath), displayPath);
        file.Parse(text, keyPrefix, allowExtends);
        return file;
    }

    private void Fail(int? line, string message, string key = "") => _errors.Add(new ConfigError(key, DisplayPath, line, message));

    private static int LineOf(YamlNode node) => checked((int)node.Start.Line);

    private void Parse(string text, string? keyPrefix, bool allowExtends)
    {
        var stream = new YamlStream();
        try
        {
            stream.Load(new StringReader(text));
        }
        catch (YamlException ex)
        {
            var message = ex.Message.Contains("Duplicate key", StringComparison.OrdinalIgnoreCase)
                ? "duplicate key in a mapping (each key may appear once)"
                : "YAML syntax error: " + Describe(ex);
            Fail(checked((int)ex.Start.Line), message);
            return;
        }

        if (stream.Documents.Count == 0 || stream.Documents[0].RootNode is YamlScalarNode { Value: null or "" } && stream.Documents.Count == 1)
        {
            Fail(null, $"'{DisplayPath}' is empty (it has no settings); an experiment file needs at least an environment and a budget");
            return;
        }
        if (stream.Documents.Count > 1)
        {
            Fail(LineOf(stream.Documents[1].RootNode), $"'{DisplayPath}' holds {stream.Documents.Count} YAML documents; an experiment file holds exactly one");
            return;
        }
        if (stream.Documents[0].RootNode is not YamlMappingNode root)
        {
            Fail(LineOf(stream.Documents[0].RootNode), "the top level of an experiment file must be a mapping of sections (experiment:, environment:, model:, ...)");
            return;
        }

        foreach (var (keyNode, valueNode) in root.Children)
        {
            if (keyNode is YamlScalarNode { Value: "extends" } && keyPrefix is null)
            {
                if (!allowExtends)
                {
                    Fail(LineOf(keyNode), "'extends' is not allowed in this file", "extends");
                }
                else if (valueNode is YamlScalarNode extendsScalar && !IsNull(extendsScalar) && !string.IsNullOrWhiteSpace(extendsScalar.Value))
                {
                    Extends = extendsScalar.Value;
                    ExtendsLine = LineOf(keyNode);
                }
                else
                {
                    Fail(LineOf(keyNode), "'extends' must be a single relative file path, e.g. extends: base.yaml", "extends");
                }
                continue;
            }
            AddEntry(keyPrefix, keyNode, valueNode);
        }
    }

    private static string Describe(YamlException ex)
    {
        var message = ex.Message;
        // YamlDotNet prefixes messages with "(Line: a, Col: b, Idx: c) - (Line: ...): "; keep the readable part.
        var cut = message.LastIndexOf("): ", StringComparison.Ordinal);
        return cut >= 0 ? message[(cut + 3)..] : message;
    }

    private static bool IsNull(YamlScalarNode scalar) =>
        scalar.Style == YamlDotNet.Core.ScalarStyle.Plain && scalar.Value is null or "" or "~" or "null" or "Null" or "NULL";

    private void AddEntry(string? prefix, YamlNode keyNode, YamlNode valueNode)
    {
        if (keyNode is not YamlScalarNode { Value: { } name })
        {
            Fail(LineOf(keyNode), "mapping keys must be plain names", prefix?.Replace(':', '.') ?? "");
            return;
        }
        var dotted = prefix is null ? name : prefix.Replace(':', '.') + "." + name;
        if (!KeyPattern().IsMatch(name))
        {
            var hint = name.ToLowerInvariant().Replace('-', '_').Replace(' ', '_');
            Fail(LineOf(keyNode), KeyPattern().IsMatch(hint)
                ? $"key '{name}' must be lower-case snake_case; did you mean '{hint}'?"
                : $"key '{name}' must be lower-case snake_case (letters, digits, underscores)", dotted);
            return;
        }
        var key = prefix is null ? name : prefix + ":" + name;
        AddNode(key, keyNode, valueNode);
    }

    private void AddNode(string key, YamlNode keyNode, YamlNode valueNode)
    {
        switch (valueNode)
        {
            case YamlScalarNode scalar:
                _values[key] = IsNull(scalar) ? null : scalar.Value ?? "";
                _origins[key] = new ConfigOrigin(DisplayPath, LineOf(scalar));
                break;
            case YamlMappingNode mapping:
                _origins.TryAdd(key, new ConfigOrigin(DisplayPath, LineOf(keyNode)));
                foreach (var (childKey, childValue) in mapping.Children)
                    AddEntry(key, childKey, childValue);
                break;
            case YamlSequenceNode sequence:
                _origins.TryAdd(key, new ConfigOrigin(DisplayPath, LineOf(keyNode)));
                if (sequence.Children.Count == 0)
                {
                    _values[key] = EmptyListMarker;
                    break;
                }
                for (var i = 0; i < sequence.Children.Count; i++)
                    AddNode(key + ":" + i.ToString(System.Globalization.CultureInfo.InvariantCulture), sequence.Children[i], sequence.Children[i]);
                break;
            default:
                Fail(LineOf(valueNode), "unsupported YAML node", key.Replace(':', '.'));
                break;
        }
    }
}
