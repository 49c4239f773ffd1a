using System.Globalization;

namespace HybridRL.Checkpoints;

/// <summary>
/// The checkpoints directory of a run: listing, the <c>latest</c> and <c>best</c> pointer files,
/// retention, and finding the checkpoint to resume from.
/// </summary>
public static class CheckpointStore
{
    /// <summary>Checkpoint files (temporary files excluded), newest step first.</summary>
    public static IReadOnlyList<(long Step, string Path)> List(string checkpointsDir)
    {
        if (!Directory.Exists(checkpointsDir)) return [];
        var list = new List<(long, string)>();
        foreach (string f in Directory.EnumerateFiles(checkpointsDir, "ckpt-*" + CheckpointFormat.Extension))
            if (CheckpointFormat.TryParseStep(f, out long step))
                list.Add((step, Path.GetFullPath(f)));
        list.Sort((a, b) => b.Item1.CompareTo(a.Item1));
        return list;
    }

    /// <summary>
    /// Walks the checkpoints newest → oldest and returns the path of the first one that validates completely,
    /// or null if none does. Every skipped file is reported in <paramref name="rejected"/> with its reason
    /// (the <see cref="CheckpointCorruptException"/> message, which names the file and the failing section).
    /// Files are found by name, not through the <c>latest</c> pointer, so a damaged pointer cannot hide a good checkpoint.
    /// </summary>
    public static string? FindNewestValid(string checkpointsDir, out IReadOnlyList<string> rejected)
    {
        var reasons = new List<string>();
        rejected = reasons;
        foreach (var (_, path) in List(checkpointsDir))
        {
            try
            {
                using var reader = CheckpointReader.Open(path);
                return path;
            }
            catch (CheckpointCorruptException ex)
            {
                reasons.Add(ex.Message);
            }
            catch (IOException ex)
            {
                reasons.Add($"checkpoint '{path}' could not be read: {ex.Message}");
            }
            catch (UnauthorizedAccessException ex)
            {
                reasons.Add($"checkpoint '{path}' could not be read: {ex.Message}");
            }
        }
        return null;
    }

    /// <summary>Opens the newest valid checkpoint (see <see cref="FindNewestValid"/>), or returns null.</summary>
    public static CheckpointReader? OpenNewestValid(string checkpointsDir, out IReadOnlyList<string> rejected)
    {
        string? path = FindNewestValid(checkpointsDir, out rejected);
        return path is null ? null : CheckpointReader.Open(path);
    }

    /// <summary>The file name recorded in the <c>latest</c> pointer, or null when there is none.</summary>
    public static string? ReadLatestPointer(string checkpointsDir)
    {
        string p = Path.Combine(checkpointsDir, CheckpointFormat.LatestPointerName);
        if (!File.Exists(p)) return null;
        string name = File.ReadAllText(p).Trim();
        return name.Length == 0 ? null : name;
    }

    /// <summary>The <c>best</c> pointer, or null when there is none or it cannot be parsed.</summary>
    public static BestCheckpointPointer? ReadBestPointer(string checkpointsDir)
    {
        string p = Path.Combine(checkpointsDir, CheckpointFormat.BestPointerName);
        if (!File.Exists(p)) return null;
        string[] lines = File.ReadAllText(p).Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
        if (lines.Length < 2 || !CheckpointFormat.TryParseStep(lines[0], out _)) return null;
        if (!double.TryParse(lines[1], NumberStyles.Float, CultureInfo.InvariantCulture, out double score)) return null;
        return new BestCheckpointPointer(lines[0], score);
    }

    internal static void WriteLatestPointer(string dir, string fileName) =>
        AtomicFile.WriteAllText(Path.Combine(dir, CheckpointFormat.LatestPointerName), fileName + "\n");

    internal static void WriteBestPointer(string dir, string fileName, double score) =>
        AtomicFile.WriteAllText(Path.Combine(dir, CheckpointFormat.BestPointerName),
            fileName + "\n" + score.ToString("R", CultureInfo.InvariantCulture) + "\n");

    /// <summary>
    /// Deletes checkpoints beyond the newest <paramref name="keep"/> at or below <paramref name="currentStep"/>
    /// (the best one is always kept), checkpoints with a step above <paramref name="currentStep"/> (left over
    /// from before a resume from an older checkpoint) and leftover temporary files of interrupted writes.
    /// Called only after the new checkpoint is durable.
    /// </summary>
    internal static void ApplyRetention(string dir, int keep, long currentStep)
    {
        string? best = ReadBestPointer(dir)?.FileName;
        int kept = 0;
        foreach (var (step, path) in List(dir))
        {
            string name = Path.GetFileName(path);
            bool keepIt = name == best || (step <= currentStep && kept < keep);
            if (step <= currentStep && kept < keep) kept++;
            if (!keepIt) AtomicFile.TryDelete(path);
        }
        foreach (string f in Directory.EnumerateFiles(dir, ".*"))
            if (CheckpointFormat.IsTemporaryName(f))
                AtomicFile.TryDelete(f);
    }
}
