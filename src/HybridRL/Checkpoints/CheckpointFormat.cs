using System.Globalization;

namespace HybridRL.Checkpoints;

/// <summary>
/// Constants of the HybridRL checkpoint container (".hrlc"). The byte layout is documented in
/// docs/checkpoint-format.md; every multi-byte number is little-endian.
/// </summary>
public static class CheckpointFormat
{
    /// <summary>The eight magic bytes at offset 0, as ASCII text.</summary>
    public const string MagicText = "HRL-CKPT";

    /// <summary>The format version this program writes and the newest it can read.</summary>
    public const int CurrentVersion = 2;

    /// <summary>File extension of a checkpoint file, with the dot.</summary>
    public const string Extension = ".hrlc";

    /// <summary>Name of the pointer file holding the newest checkpoint's file name.</summary>
    public const string LatestPointerName = "latest";

    /// <summary>Name of the pointer file holding the best-scoring checkpoint's file name and score.</summary>
    public const string BestPointerName = "best";

    internal static ReadOnlySpan<byte> Magic => "HRL-CKPT"u8;
    internal static ReadOnlySpan<byte> SectionMarker => "SECT"u8;
    internal static ReadOnlySpan<byte> FooterMarker => "HEND"u8;

    /// <summary>Fixed prefix: magic (8) + version (4) + header body length (4).</summary>
    internal const int PrefixSize = 16;
    /// <summary>Footer: marker (4) + section count (4) + footer offset (8) + checksum (8).</summary>
    internal const int FooterSize = 24;
    /// <summary>Largest header body accepted by the reader (guards against a corrupt length).</summary>
    internal const int MaxHeaderBodySize = 64 * 1024;
    /// <summary>Largest section name in UTF-8 bytes.</summary>
    public const int MaxSectionNameBytes = 256;

    private const string Prefix = "ckpt-";

    /// <summary>File name of the checkpoint for a step: <c>ckpt-&lt;step:D12&gt;.hrlc</c>.</summary>
    public static string FileNameFor(long step)
    {
        if (step < 0) throw new ArgumentOutOfRangeException(nameof(step), step, "checkpoint step must be non-negative");
        return Prefix + step.ToString("D12", CultureInfo.InvariantCulture) + Extension;
    }

    /// <summary>
    /// Parses the step out of a checkpoint file name (<c>ckpt-000000001234.hrlc</c>). Temporary files
    /// (which start with a dot and carry a ".tmp-" suffix) and any other names return false.
    /// </summary>
    public static bool TryParseStep(string fileName, out long step)
    {
        step = 0;
        string name = Path.GetFileName(fileName);
        if (!name.StartsWith(Prefix, StringComparison.Ordinal) || !name.EndsWith(Extension, StringComparison.Ordinal))
            return false;
        ReadOnlySpan<char> digits = name.AsSpan(Prefix.Length, name.Length - Prefix.Length - Extension.Length);
        if (digits.Length == 0) return false;
        foreach (char c in digits)
            if (c < '0' || c > '9') return false;
        return long.TryParse(digits, NumberStyles.None, CultureInfo.InvariantCulture, out step);
    }

    internal static bool IsTemporaryName(string fileName)
    {
        string name = Path.GetFileName(fileName);
        return name.StartsWith('.') && name.Contains(".tmp-", StringComparison.Ordinal);
    }
}
