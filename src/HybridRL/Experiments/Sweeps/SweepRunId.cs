using System.Globalization;
using System.IO.Hashing;
using System.Text;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// Stable run ids: <c>&lt;slug&gt;-&lt;hash&gt;</c>, where hash is the first <see cref="HashHexDigits"/> hex digits of the
/// xxHash64 (seed 0) of the canonical override list — the overrides sorted by key (ordinal), one <c>key=value\n</c> line each,
/// UTF-8 — and slug is a readable, length-limited rendering of the values. The same overrides always give the same id,
/// whatever order the axes were written in.
/// </summary>
public static class SweepRunId
{
    /// <summary>Hex digits kept from the 64-bit hash (40 bits: a collision among 10 000 runs has odds of about 5e-5).</summary>
    public const int HashHexDigits = 10;

    /// <summary>Longest slug kept (the hash keeps ids unique after truncation).</summary>
    public const int MaxSlugLength = 48;

    /// <summary>The canonical text hashed for an override list.</summary>
    public static string Canonical(IEnumerable<SweepOverride> overrides)
    {
        var sb = new StringBuilder();
        foreach (var o in overrides.OrderBy(o => o.Key, StringComparer.Ordinal))
            sb.Append(o.Key).Append('=').Append(o.Value).Append('\n');
        return sb.ToString();
    }

    /// <summary>Hex digest (<see cref="HashHexDigits"/> lower-case digits) of the canonical override list.</summary>
    public static string Hash(IEnumerable<SweepOverride> overrides)
    {
        ulong h = XxHash64.HashToUInt64(Encoding.UTF8.GetBytes(Canonical(overrides)));
        return h.ToString("x16", CultureInfo.InvariantCulture)[..HashHexDigits];
    }

    /// <summary>Readable slug: <c>lastkeysegment-value</c> pairs joined by <c>_</c>, in the given order; <c>base</c> when empty.</summary>
    public static string Slug(IReadOnlyList<SweepOverride> overrides)
    {
        if (overrides.Count == 0) return "base";
        var sb = new StringBuilder();
        foreach (var o in overrides)
        {
            if (sb.Length > 0) sb.Append('_');
            int dot = o.Key.LastIndexOf('.');
            Append(sb, dot >= 0 ? o.Key[(dot + 1)..] : o.Key);
            sb.Append('-');
            Append(sb, ShortValue(o.Value));
        }
        string s = sb.ToString();
        if (s.Length > MaxSlugLength) s = s[..MaxSlugLength].TrimEnd('_', '-', '.');
        return s;
    }

    /// <summary>Id for an override list: slug, a dash, and the hash.</summary>
    public static string For(IReadOnlyList<SweepOverride> overrides) => $"{Slug(overrides)}-{Hash(overrides)}";

    private static string ShortValue(string value)
    {
        // Long round-trip doubles from random sampling read better rounded; the hash keeps the exact value.
        if (value.Length > 8 && double.TryParse(value, NumberStyles.Float, CultureInfo.InvariantCulture, out double d))
            return d.ToString("G4", CultureInfo.InvariantCulture);
        return value;
    }

    private static void Append(StringBuilder sb, string text)
    {
        foreach (char c in text)
        {
            char l = char.ToLowerInvariant(c);
            if (l is >= 'a' and <= 'z' or >= '0' and <= '9' or '.' or '-' or '+') sb.Append(l);
            else if (sb.Length > 0 && sb[^1] != '_') sb.Append('_');
        }
    }
}
