using System.Globalization;

namespace HybridRL.Experiments.Estimation;

/// <summary>
/// Turns a predicted wall time into a Slurm <c>--time</c> limit: factor × prediction + margin, rounded up to whole
/// minutes, written as HH:MM:SS (D-HH:MM:SS from one day on; both are formats <c>sbatch --time</c> accepts).
/// </summary>
public static class SlurmTime
{
    /// <summary>Seconds of the suggested limit: ⌈(factor·seconds + 60·marginMinutes) / 60⌉ · 60, at least one minute.</summary>
    public static long SuggestSeconds(double predictedSeconds, double factor, double marginMinutes)
    {
        if (!(predictedSeconds >= 0) || double.IsInfinity(predictedSeconds)) throw new ArgumentOutOfRangeException(nameof(predictedSeconds), predictedSeconds, "predicted seconds must be finite and ≥ 0");
        if (!(factor >= 1)) throw new ArgumentOutOfRangeException(nameof(factor), factor, "factor must be ≥ 1");
        if (!(marginMinutes >= 0)) throw new ArgumentOutOfRangeException(nameof(marginMinutes), marginMinutes, "margin must be ≥ 0");
        double s = factor * predictedSeconds + 60 * marginMinutes;
        long minutes = Math.Max(1, (long)Math.Ceiling(s / 60 - 1e-9));
        return checked(minutes * 60);
    }

    /// <summary>HH:MM:SS, or D-HH:MM:SS for a day or more.</summary>
    public static string Format(long seconds)
    {
        if (seconds < 0) throw new ArgumentOutOfRangeException(nameof(seconds), seconds, "must be ≥ 0");
        long days = seconds / 86400, rest = seconds % 86400;
        string hms = string.Create(CultureInfo.InvariantCulture, $"{rest / 3600:00}:{rest % 3600 / 60:00}:{rest % 60:00}");
        return days > 0 ? string.Create(CultureInfo.InvariantCulture, $"{days}-{hms}") : hms;
    }

    /// <summary>The formatted suggestion for <paramref name="predictedSeconds"/>.</summary>
    public static string Suggest(double predictedSeconds, double factor, double marginMinutes) =>
        Format(SuggestSeconds(predictedSeconds, factor, marginMinutes));
}
