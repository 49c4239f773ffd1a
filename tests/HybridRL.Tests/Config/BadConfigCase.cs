using System.Text;

namespace HybridRL.Tests.Config;

/// <summary>One malformed configuration from the bad/ folder with its header (see bad/README.md).</summary>
public sealed record BadConfigCase(string File, string Expect, string? Key, int? Line, IReadOnlyList<string> Sets, IReadOnlyDictionary<string, string> Environment)
{
    public static IReadOnlyList<BadConfigCase> All() =>
        Directory.GetFiles(ConfigTestPaths.BadCasesFolder, "*.yaml").OrderBy(f => f, StringComparer.Ordinal).Select(Parse).ToList();

    public static BadConfigCase Parse(string file)
    {
        var text = Encoding.Latin1.GetString(System.IO.File.ReadAllBytes(file));
        string? expect = null, key = null;
        int? line = null;
        var sets = new List<string>();
        var env = new Dictionary<string, string>();
        foreach (var raw in text.Split('\n'))
        {
            var l = raw.TrimEnd('\r');
            if (!l.StartsWith('#')) continue;
            var body = l[1..].Trim();
            static string After(string s) => s[(s.IndexOf(':') + 1)..].Trim();
            if (body.StartsWith("expect:", StringComparison.Ordinal)) expect = After(body);
            else if (body.StartsWith("key:", StringComparison.Ordinal)) key = After(body);
            else if (body.StartsWith("line:", StringComparison.Ordinal)) line = int.Parse(After(body), System.Globalization.CultureInfo.InvariantCulture);
            else if (body.StartsWith("set:", StringComparison.Ordinal)) sets.Add(After(body));
            else if (body.StartsWith("env:", StringComparison.Ordinal))
            {
                var kv = After(body);
                env[kv[..kv.IndexOf('=')]] = kv[(kv.IndexOf('=') + 1)..];
            }
        }
        return new BadConfigCase(file, expect ?? throw new InvalidOperationException($"{file} has no '# expect:' header"), key, line, sets, env);
    }

    public override string ToString() => Path.GetFileName(File);
}
