namespace HybridRL.Experiments.Executors;

/// <summary>The Slurm job ids submitted for a sweep, one per line in <c>&lt;sweep folder&gt;/slurm-jobs.txt</c> (append-only; shared-filesystem friendly).</summary>
public static class SubmittedJobs
{
    public const string FileName = "slurm-jobs.txt";

    public static void Append(string sweepDir, string jobId)
    {
        Directory.CreateDirectory(sweepDir);
        File.AppendAllText(Path.Combine(sweepDir, FileName), jobId + "\n");
    }

    /// <summary>Job ids in submission order (oldest first); empty when none were recorded.</summary>
    public static IReadOnlyList<string> Read(string sweepDir)
    {
        string path = Path.Combine(sweepDir, FileName);
        if (!File.Exists(path)) return [];
        return File.ReadAllLines(path).Select(l => l.Trim()).Where(l => l.Length > 0).ToArray();
    }
}
