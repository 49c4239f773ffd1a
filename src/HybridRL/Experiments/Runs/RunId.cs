using System.IO.Hashing;
using System.Text;

namespace HybridRL.Experiments.Runs;

/// <summary>
/// Run identifiers: <c>&lt;name&gt;-&lt;8 hex digits of the spec hash&gt;</c>, lower case, filesystem-safe
/// (letters, digits, '.', '_' and '-'), stable for a given resolved config.
/// </summary>
public static class RunId
{
    private const int MaxNameLength = 48;

    /// <summary>From a 64-bit spec hash: its high 32 bits as 8 hex digits.</summary>
    public static string Create(string name, ulong specHash) => $"{Sanitize(name)}-{(uint)(specHash >> 32):x8}";

    /// <summary>
    /// From a textual spec hash: if it starts with at least 8 hex digits those are used (lower-cased);
    /// otherwise the text is hashed (XxHash3-64) and treated as <see cref="Create(string, ulong)"/>.
    /// </summary>
    public static string Create(string name, string specHash)
    {
        ArgumentNullException.ThrowIfNull(specHash);
        if (specHash.Length >= 8 && specHash.AsSpan(0, 8).ContainsAnyExcept("0123456789abcdefABCDEF") == false)
            return $"{Sanitize(name)}-{specHash[..8].ToLowerInvariant()}";
        return Create(name, XxHash3.HashToUInt64(Encoding.UTF8.GetBytes(specHash)));
    }

    /// <summary>Lower-cases, maps every other character to '-', collapses runs of '-', trims, and limits the length.</summary>
    public static string Sanitize(string name)
    {
        ArgumentNullException.ThrowIfNull(name);
        var sb = new StringBuilder(Math.Min(name.Length, MaxNameLength));
        foreach (char c0 in name.Trim())
        {
            char c = char.ToLowerInvariant(c0);
            bool ok = c is >= 'a' and <= 'z' or >= '0' and <= '9' or '.' or '_' or '-';
            char o = ok ? c : '-';
            if (o == '-' && sb.Length > 0 && sb[^1] == '-') continue;
            sb.Append(o);
            if (sb.Length >= MaxNameLength) break;
        }
        string s = sb.ToString().Trim('-', '.');
        return s.Length == 0 ? "run" : s;
    }

    /// <summary>True for a non-empty folder name made of letters, digits, '.', '_' and '-' that is not "." or "..".</summary>
    public static bool IsSafeSegment(string? segment)
    {
        if (string.IsNullOrEmpty(segment) || segment is "." or ".." || segment.Length > 200) return false;
        foreach (char c in segment)
            if (!(char.IsAsciiLetterOrDigit(c) || c is '.' or '_' or '-')) return false;
        return true;
    }
}
