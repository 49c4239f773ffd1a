using System.Diagnostics;
using System.Text.Json;
using HybridRL.Tests.Support;

namespace HybridRL.Tests.Sweeps;

/// <summary>Helpers for the sweep tests that run the real CLI: a temp folder with a real base experiment, CLI calls, run-folder comparisons.</summary>
public sealed class SweepEndToEnd : IDisposable
{
    public SweepEndToEnd(string? root = null)
    {
        Files = new SweepTestFiles(root);
        BasePath = Path.Combine(Files.Dir, "tiny.yaml");
        File.Copy(SweepTestFiles.DataPath("tiny-warehouse.yaml"), BasePath);
    }

    public SweepTestFiles Files { get; }
    public string Dir => Files.Dir;

    /// <summary>Absolute path of the base experiment (tiny-warehouse.yaml) in the temp folder.</summary>
    public string BasePath { get; }

    /// <summary>Writes a sweep file with absolute <c>base</c> and <c>runs_dir</c> paths.</summary>
    public string WriteSweep(string file, string name, string runsDir, string axes) =>
        Files.Write(file, $"base: {BasePath}\nname: {name}\nruns_dir: {Path.Combine(Dir, runsDir)}\n{axes}");

    /// <summary>Runs <c>hybridrl ARGS</c> in the temp folder.</summary>
    public (int ExitCode, string Stdout, string Stderr) Cli(params string[] args) =>
        CliProcess.Run(args, TimeSpan.FromMinutes(3), workingDirectory: Dir);

    /// <summary>The state word (pending, running, ...) of each row of <c>sweep status</c> output, by index.</summary>
    public static IReadOnlyDictionary<int, string> States(string statusOutput)
    {
        var d = new Dictionary<int, string>();
        foreach (var line in statusOutput.Split('\n'))
        {
            var parts = line.Split(' ', StringSplitOptions.RemoveEmptyEntries);
            if (parts.Length >= 3 && parts[1] != "runs:" && int.TryParse(parts[0], out int i)) d[i] = parts[2]; // not the "N runs: ..." total line
        }
        return d;
    }

    /// <summary>metrics.csv without the wall_seconds column (the only column that may differ between two runs of one seed).</summary>
    public static string[] MetricsWithoutWallTime(string runDir)
    {
        var lines = File.ReadAllLines(Path.Combine(runDir, "metrics.csv"));
        int wall = Array.IndexOf(lines[0].Split(','), "wall_seconds");
        Assert.True(wall >= 0, "metrics.csv has no wall_seconds column");
        return lines.Select(l => string.Join(",", l.Split(',').Where((_, i) => i != wall))).ToArray();
    }

    /// <summary>A number or string property of summary.json, as raw JSON text.</summary>
    public static string Summary(string runDir, string property)
    {
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(runDir, "summary.json")));
        return doc.RootElement.GetProperty(property).GetRawText();
    }

    public static async Task<bool> Until(Func<bool> condition, TimeSpan timeout)
    {
        var sw = Stopwatch.StartNew();
        while (sw.Elapsed < timeout)
        {
            if (condition()) return true;
            await Task.Delay(200);
        }
        return condition();
    }

    public void Dispose() => Files.Dispose();
}
