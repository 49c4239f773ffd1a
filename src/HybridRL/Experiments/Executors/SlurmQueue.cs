using System.Globalization;

namespace HybridRL.Experiments.Executors;

/// <summary>
/// Reads the Slurm queue with <c>squeue -h -o "%i %T"</c> (accounting may be off, so no sacct). Array elements appear as
/// <c>123_4 RUNNING</c>; elements not yet started are grouped as <c>123_[5-9,12%2] PENDING</c> and are expanded here.
/// </summary>
public static class SlurmQueue
{
    /// <summary>Parses squeue output; unreadable lines are skipped.</summary>
    public static IReadOnlyList<SlurmQueueEntry> Parse(string squeueOutput)
    {
        var entries = new List<SlurmQueueEntry>();
        foreach (var raw in squeueOutput.Split('\n'))
        {
            var parts = raw.Trim().Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
            if (parts.Length < 2) continue;
            string id = parts[0], state = parts[1];
            int us = id.IndexOf('_');
            if (us < 0)
            {
                if (IsDigits(id)) entries.Add(new SlurmQueueEntry(id, null, state));
                continue;
            }
            string job = id[..us], rest = id[(us + 1)..];
            if (!IsDigits(job)) continue;
            if (rest.StartsWith('[') && rest.EndsWith(']'))
            {
                string spec = rest[1..^1];
                int pct = spec.IndexOf('%');
                if (pct >= 0) spec = spec[..pct];
                foreach (var piece in spec.Split(',', StringSplitOptions.RemoveEmptyEntries))
                {
                    var range = piece.Split('-');
                    if (range.Length == 1 && Int(range[0]) is int single) entries.Add(new SlurmQueueEntry(job, single, state));
                    else if (range.Length == 2 && Int(range[0]) is int a && Int(range[1]) is int b)
                        for (int i = a; i <= b; i++) entries.Add(new SlurmQueueEntry(job, i, state));
                }
            }
            else if (Int(rest) is int index) entries.Add(new SlurmQueueEntry(job, index, state));
        }
        return entries;
    }

    /// <summary>Runs squeue; null when squeue is not on PATH or fails (then no Slurm state is shown).</summary>
    public static IReadOnlyList<SlurmQueueEntry>? Query(ICommandRunner? runner = null)
    {
        runner ??= ProcessCommandRunner.Instance;
        if (!runner.IsAvailable("squeue")) return null;
        try
        {
            var r = runner.Run("squeue", ["-h", "-o", "%i %T"], TimeSpan.FromSeconds(30));
            return r.ExitCode == 0 ? Parse(r.StandardOutput) : null;
        }
        catch (ExecutorException)
        {
            return null;
        }
    }

    private static bool IsDigits(string s) => s.Length > 0 && s.All(char.IsAsciiDigit);

    private static int? Int(string s) => int.TryParse(s, NumberStyles.None, CultureInfo.InvariantCulture, out int v) ? v : null;
}
