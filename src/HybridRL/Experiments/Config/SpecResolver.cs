using System.Globalization;
using Microsoft.Extensions.Configuration;

namespace HybridRL.Experiments.Config;

/// <summary>One run of <see cref="ExperimentSpecLoader.Load(IReadOnlyList{string}, IReadOnlyList{string}, IDictionary{string, string}, IEnvironmentKeyValidator?)"/>:
/// layers → keys → types and ranges → combinations → spec.</summary>
internal sealed class SpecResolver
{
    private readonly IReadOnlyList<string> _files;
    private readonly IReadOnlyList<string> _sets;
    private readonly IDictionary<string, string> _environment;
    private readonly IEnvironmentKeyValidator? _validator;
    private readonly List<ConfigError> _errors = new();
    private readonly List<IConfigurationSource> _sources = new();
    private readonly HashSet<string> _included = new(StringComparer.Ordinal);
    private ConfigOrigin? _lastFile;
    private ResolvedValues? _values;

    public SpecResolver(IReadOnlyList<string> files, IReadOnlyList<string> sets, IDictionary<string, string> environment, IEnvironmentKeyValidator? validator)
    {
        _files = files;
        _sets = sets;
        _environment = environment;
        _validator = validator;
    }

    public ExperimentSpec Resolve()
    {
        // 1. Layers.
        foreach (var file in _files) AddFile(file, file, [], null, null);
        _sources.Add(OverrideLayers.FromEnvironment(_environment));
        _sources.Add(OverrideLayers.FromSetOptions(_sets, _errors));
        ThrowIfErrors();

        AddHardwareProfile();
        ThrowIfErrors();

        var builder = new ConfigurationBuilder();
        foreach (var source in _sources) builder.Add(source);
        var layers = new LayeredConfiguration(builder.Build());

        // 2. Keys, types, ranges.
        var values = _values = new ResolvedValues(_errors, _lastFile);
        CheckKeys(layers);
        foreach (var key in ConfigKeyTable.All) ResolveKey(key, layers, values);
        var parameters = layers.ResolveTree("environment", new HashSet<string>(StringComparer.OrdinalIgnoreCase) { "environment:kind" });

        // 3. Applicability and combinations.
        CheckApplicability(values);
        SpecRules.Check(values);
        ThrowIfErrors();

        // 4. Spec, then the environment layer's own checks.
        var spec = SpecFactory.Create(values, DefaultName(), parameters);
        CheckEnvironment(spec, parameters);
        ThrowIfErrors();
        return spec;
    }

    private void ThrowIfErrors()
    {
        if (_errors.Count > 0) throw new ConfigException(_errors.ToList());
    }

    private string DefaultName()
    {
        if (_files.Count == 0) return "experiment";
        var stem = Path.GetFileNameWithoutExtension(_files[^1]);
        return string.IsNullOrEmpty(stem) ? "experiment" : stem;
    }

    private void AddFile(string path, string shownName, IReadOnlyList<string> chain, YamlConfigFile? from, int? fromLine)
    {
        var full = Path.GetFullPath(path);
        if (chain.Contains(full, StringComparer.Ordinal))
        {
            var cycle = string.Join(" → ", chain.SkipWhile(c => c != full).Append(full).Select(YamlConfigFile.DisplayPathFor));
            _errors.Add(new ConfigError("extends", from!.DisplayPath, fromLine, $"base-file cycle: {cycle}; a file may not extend itself directly or through its bases"));
            return;
        }
        if (_included.Contains(full)) return; // shared base already included below an earlier file
        if (from is not null && !File.Exists(full))
        {
            _errors.Add(new ConfigError("extends", from.DisplayPath, fromLine,
                $"base file '{shownName}' named by extends was not found (looked for {full}; extends paths are relative to the file that names them)"));
            return;
        }
        var file = YamlConfigFile.Read(full);
        if (file.Errors.Count > 0)
        {
            _errors.AddRange(file.Errors);
            return;
        }
        if (file.Extends is { } baseName)
        {
            var basePath = Path.Combine(Path.GetDirectoryName(full)!, baseName);
            AddFile(basePath, baseName, chain.Append(full).ToList(), file, file.ExtendsLine);
        }
        _included.Add(full);
        _sources.Add(new YamlConfigurationSource(file));
        if (chain.Count == 0) _lastFile = new ConfigOrigin(file.DisplayPath, null);
    }

    private void AddHardwareProfile()
    {
        var probe = new ConfigurationBuilder();
        foreach (var source in _sources) probe.Add(source);
        var found = new LayeredConfiguration(probe.Build()).Find("hardware:profile");
        if (found is null || !found.HasScalar || string.IsNullOrWhiteSpace(found.Scalar)) return;
        var origin = found.Origin;
        var baseDirectory = origin is not null && _sources.OfType<YamlConfigurationSource>().FirstOrDefault(s => s.File.DisplayPath == origin.Source) is { } owner
            ? Path.GetDirectoryName(owner.File.FullPath)!
            : Directory.GetCurrentDirectory();
        var full = Path.GetFullPath(Path.Combine(baseDirectory, found.Scalar));
        if (!File.Exists(full))
        {
            _errors.Add(new ConfigError("hardware.profile", origin?.Source, origin?.Line,
                $"hardware profile '{found.Scalar}' was not found (looked for {full}; the path is relative to the file that names it)"));
            return;
        }
        var profile = YamlConfigFile.Read(full, keyPrefix: "hardware", allowExtends: false);
        if (profile.Errors.Count > 0)
        {
            _errors.AddRange(profile.Errors);
            return;
        }
        if (profile.Values.ContainsKey("hardware:profile"))
        {
            _errors.Add(new ConfigError("hardware.profile", profile.DisplayPath, profile.Origins["hardware:profile"].Line,
                "a hardware profile may not name another profile"));
            return;
        }
        _sources.Insert(0, new YamlConfigurationSource(profile));
    }

    private static readonly HashSet<string> KnownScalarKeys =
        ConfigKeyTable.All.Where(k => k.Kind is not (ConfigValueKind.IntegerList or ConfigValueKind.ChoiceList)).Select(k => k.ConfigurationKey).ToHashSet(StringComparer.OrdinalIgnoreCase);

    private static readonly HashSet<string> KnownListKeys =
        ConfigKeyTable.All.Where(k => k.Kind is ConfigValueKind.IntegerList or ConfigValueKind.ChoiceList).Select(k => k.ConfigurationKey).ToHashSet(StringComparer.OrdinalIgnoreCase);

    private static readonly HashSet<string> KnownSections = ConfigKeyTable.All
        .SelectMany(k => Prefixes(k.ConfigurationKey)).Append("environment").ToHashSet(StringComparer.OrdinalIgnoreCase);

    private static IEnumerable<string> Prefixes(string key)
    {
        for (var cut = key.IndexOf(':'); cut > 0; cut = key.IndexOf(':', cut + 1)) yield return key[..cut];
    }

    private void CheckKeys(LayeredConfiguration layers)
    {
        var reportedParents = new HashSet<string>(StringComparer.OrdinalIgnoreCase);
        foreach (var (key, value, origin) in layers.AllKeys().OrderBy(k => k.Key, StringComparer.Ordinal))
        {
            if (KnownScalarKeys.Contains(key) || KnownListKeys.Contains(key)) continue;
            if (key.StartsWith("environment:", StringComparison.OrdinalIgnoreCase)) continue; // free-form parameters
            var dotted = key.Replace(':', '.');
            if (Prefixes(key).FirstOrDefault(p => KnownListKeys.Contains(p)) is { } listKey)
            {
                var rest = key[(listKey.Length + 1)..];
                if (!rest.Contains(':') && int.TryParse(rest, NumberStyles.None, CultureInfo.InvariantCulture, out _)) continue; // list item
                if (reportedParents.Add(listKey))
                    Add(listKey.Replace(':', '.'), origin, $"{listKey.Replace(':', '.')} expects a list of single values, e.g. [a, b]");
                continue;
            }
            if (Prefixes(key).FirstOrDefault(p => KnownScalarKeys.Contains(p)) is { } scalarKey)
            {
                if (reportedParents.Add(scalarKey))
                    Add(scalarKey.Replace(':', '.'), origin, $"{scalarKey.Replace(':', '.')} takes a single value, not a mapping or list");
                continue;
            }
            if (KnownSections.Contains(key))
            {
                if (value is null) continue; // "section:" left empty
                var kindKey = dotted + ".kind";
                var hint = ConfigKeyTable.Find(kindKey) is not null ? $"; did you mean '{kindKey}: {value}'?" : "";
                Add(dotted, origin, $"'{dotted}' is a section, not a value{hint}");
                continue;
            }
            var suggestion = KeySuggester.Suggest(dotted, ConfigKeyTable.All.Select(k => k.Path));
            Add(dotted, origin, suggestion is null
                ? $"unknown key '{dotted}' (sections are experiment, environment, model, trainer, logging, hardware)"
                : $"unknown key '{dotted}'; did you mean '{suggestion}'?");
        }
    }

    private void Add(string key, ConfigOrigin? origin, string message) =>
        _errors.Add(new ConfigError(key, origin?.Source, origin?.Line, message));

    private void ResolveKey(ConfigKey key, LayeredConfiguration layers, ResolvedValues values)
    {
        var found = layers.Find(key.ConfigurationKey);
        var isList = key.Kind is ConfigValueKind.IntegerList or ConfigValueKind.ChoiceList;
        if (found is null || (found.HasScalar && found.Scalar is null) || (!found.HasScalar && !isList))
        {
            values.Set(key.Path, key.Default, null, isExplicit: false);
            return;
        }
        var origin = found.Origin;
        if (isList)
        {
            List<(string Text, ConfigOrigin? Origin)> items;
            if (found.HasScalar)
            {
                items = SplitInlineList(found.Scalar!).Select(t => (t, origin)).ToList();
            }
            else
            {
                if (found.Children.Any(c => c.Nested || !int.TryParse(c.Segment, NumberStyles.None, CultureInfo.InvariantCulture, out _)))
                {
                    values.Set(key.Path, key.Default, origin, isExplicit: true);
                    values.MarkFailed(key.Path);
                    return; // reported by CheckKeys
                }
                items = found.Children.OrderBy(c => int.Parse(c.Segment, CultureInfo.InvariantCulture))
                    .Select(c => (c.Value ?? "", c.Origin ?? origin)).ToList();
            }
            var ok = true;
            var longs = new List<long>();
            var names = new List<string>();
            foreach (var (text, itemOrigin) in items)
            {
                var itemKind = key.Kind == ConfigValueKind.IntegerList ? ConfigValueKind.Integer : ConfigValueKind.Choice;
                if (ParseScalar(key, itemKind, text, itemOrigin, out var parsed))
                {
                    if (parsed is long l) longs.Add(l); else names.Add((string)parsed!);
                }
                else ok = false;
            }
            if (ok && key.NonEmpty && items.Count == 0)
            {
                Add(key.Path, origin, $"{key.Path} needs at least one entry");
                ok = false;
            }
            object listValue = key.Kind == ConfigValueKind.IntegerList ? new EquatableList<long>(longs) : new EquatableList<string>(names);
            values.Set(key.Path, ok ? listValue : key.Default, origin, isExplicit: true);
            if (!ok) values.MarkFailed(key.Path);
            return;
        }
        if (ParseScalar(key, key.Kind, found.Scalar!, origin, out var value))
        {
            values.Set(key.Path, value, origin, isExplicit: true);
        }
        else
        {
            values.Set(key.Path, key.Default, origin, isExplicit: true);
            values.MarkFailed(key.Path);
        }
    }

    private static IEnumerable<string> SplitInlineList(string text)
    {
        var t = text.Trim();
        if (t.StartsWith('[') && t.EndsWith(']')) t = t[1..^1];
        if (t.Trim().Length == 0) return [];
        return t.Split(',').Select(s => s.Trim());
    }

    private bool ParseScalar(ConfigKey key, ConfigValueKind kind, string text, ConfigOrigin? origin, out object? value)
    {
        value = null;
        var shown = text.Length > 60 ? text[..57] + "..." : text;
        switch (kind)
        {
            case ConfigValueKind.Integer:
                if (!long.TryParse(text.Trim(), NumberStyles.AllowLeadingSign, CultureInfo.InvariantCulture, out var l))
                {
                    var hint = double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out _) ? " (a whole number)" : "";
                    Add(key.Path, origin, $"{key.Path} expects an integer{hint}, got '{shown}'");
                    return false;
                }
                if (!InRange(key, l, origin)) return false;
                value = l;
                return true;
            case ConfigValueKind.Number:
                if (!double.TryParse(text.Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out var d) || !double.IsFinite(d))
                {
                    Add(key.Path, origin, $"{key.Path} expects a finite number, got '{shown}'");
                    return false;
                }
                if (!InRange(key, d, origin)) return false;
                value = d;
                return true;
            case ConfigValueKind.Boolean:
                switch (text.Trim().ToLowerInvariant())
                {
                    case "true": value = true; return true;
                    case "false": value = false; return true;
                    default:
                        Add(key.Path, origin, $"{key.Path} expects true or false, got '{shown}'");
                        return false;
                }
            case ConfigValueKind.Text:
                value = text;
                return true;
            case ConfigValueKind.Choice:
                var trimmed = text.Trim();
                if (key.Choices.Contains(trimmed, StringComparer.Ordinal))
                {
                    value = trimmed;
                    return true;
                }
                var near = KeySuggester.SuggestValue(trimmed, key.Choices);
                Add(key.Path, origin, $"{key.Path} expects one of {string.Join(", ", key.Choices)}, got '{shown}'" + (near is null ? "" : $"; did you mean '{near}'?"));
                return false;
            default:
                throw new InvalidOperationException($"Unexpected kind {kind}");
        }
    }

    private bool InRange(ConfigKey key, double v, ConfigOrigin? origin)
    {
        string F(double x) => x.ToString("R", CultureInfo.InvariantCulture);
        var shown = F(v);
        if (key.Minimum is { } min && (key.MinimumExclusive ? v <= min : v < min))
        {
            Add(key.Path, origin, key.MinimumExclusive
                ? $"{key.Path} must be greater than {F(min)}, got {shown}"
                : $"{key.Path} must be at least {F(min)}, got {shown}");
            return false;
        }
        if (key.Maximum is { } max && v > max)
        {
            Add(key.Path, origin, $"{key.Path} must be at most {F(max)}, got {shown}");
            return false;
        }
        return true;
    }

    private static void CheckApplicability(ResolvedValues values)
    {
        var groups = new Dictionary<(string Section, string Condition), List<ConfigKey>>();
        foreach (var key in ConfigKeyTable.All)
        {
            if (!values.IsExplicit(key.Path) || values.Applies(key.Path)) continue;
            var failing = key.AppliesWhen.First(c => !values.Applies(c.Key) || !c.Values.Contains(values.ChoiceText(c.Key)));
            var groupKey = (key.Section, failing.Key);
            if (!groups.TryGetValue(groupKey, out var list)) groups[groupKey] = list = new List<ConfigKey>();
            list.Add(key);
        }
        foreach (var ((_, conditionKey), keys) in groups)
        {
            var condition = keys[0].AppliesWhen.First(c => c.Key == conditionKey);
            var names = string.Join(", ", keys.Select(k => k.Path));
            var verb = keys.Count == 1 ? "applies" : "apply";
            var state = values.Applies(conditionKey) ? $"it is {values.ChoiceText(conditionKey)}" : $"{conditionKey} does not apply here";
            var wanted = string.Join(" or ", condition.Values);
            values.Error(keys[0].Path, $"{names} {verb} only when {conditionKey} is {wanted} ({state}); remove {(keys.Count == 1 ? "it" : "them")} or set {conditionKey}: {condition.Values[0]}");
        }
        var kind = ConfigKeyTable.Find("environment.kind")!;
        if (!values.IsExplicit(kind.Path))
            values.Error(kind.Path, $"environment.kind is required: one of {string.Join(", ", kind.Choices)}");
    }

    private void CheckEnvironment(ExperimentSpec spec, IReadOnlyList<(string RelativeKey, string Value, ConfigOrigin? Origin)> parameters)
    {
        if (_validator is null) return;
        var byKey = parameters.ToDictionary(p => p.RelativeKey, p => p.Origin, StringComparer.Ordinal);
        var problems = _validator.Validate(spec.Environment.Kind, spec.Environment.Parameters);
        foreach (var problem in problems)
        {
            var origin = byKey.GetValueOrDefault(problem.Parameter) ?? _lastFile;
            var key = problem.Parameter.Length == 0 ? "environment" : "environment." + problem.Parameter.Replace(':', '.');
            _errors.Add(new ConfigError(key, origin?.Source, origin?.Line, problem.Message));
        }
        if (problems.Count > 0) return;
        if (_validator.DescribeShape(spec.Environment.Kind, spec.Environment.Parameters) is not { } shape) return;
        foreach (var (key, message) in EncodingCompatibility.Check(spec.Model, spec.Environment.Kind, shape))
        {
            var origin = _values?.Origin(key) ?? _values?.Origin("model.circuit.encoding") ?? _lastFile;
            _errors.Add(new ConfigError(key, origin?.Source, origin?.Line, message));
        }
    }
}
