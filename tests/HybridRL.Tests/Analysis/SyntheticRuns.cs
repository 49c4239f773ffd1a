using System.Globalization;
using System.Text;

namespace HybridRL.Tests.Analysis;

/// <summary>Writes invented run folders (synthetic test data, not results of any training) into a temp directory.</summary>
internal sealed class SyntheticRuns : IDisposable
{
    public SyntheticRuns()
    {
        Root = Path.Combine(Path.GetTempPath(), "hybridrl-analysis-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(Root);
    }

    public string Root { get; }

    /// <summary>One synthetic run: rows of (env_steps, return); other counters derived from the step count.</summary>
    public string AddRun(string sweep, string runId, string trainerKind, IReadOnlyList<(double Steps, double Return)> rows,
        int parameterCount = 12, bool summary = true, double shotsPerExecution = 100)
    {
        string dir = Path.Combine(Root, sweep, runId);
        Directory.CreateDirectory(dir);
        File.WriteAllText(Path.Combine(dir, "config.yaml"),
            $"# synthetic test run (invented data)\nname: {sweep}\nseed: {runId.Length}\ntrainer:\n  kind: {trainerKind}\n  batch: 8\nmodel:\n  layers: [4, 2]\n");
        var sb = new StringBuilder();
        sb.AppendLine("env_steps,episodes,updates,generations,wall_seconds,train_return,eval_return,loss,fitness_mean,fitness_best,fitness_std,epsilon,sigma,circuit_executions,shots,hardware_executions,parameter_count");
        foreach (var (s, r) in rows)
        {
            string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
            sb.AppendLine(string.Join(',', F(s), F(Math.Floor(s / 50)), F(s / 4), "", F(s / 100), F(r), "", "0.5", "", "", "", "0.1", "",
                F(s * 3), F(s * 3 * shotsPerExecution), F(s * 10), parameterCount.ToString(CultureInfo.InvariantCulture)));
        }
        File.WriteAllText(Path.Combine(dir, "metrics.csv"), sb.ToString());
        if (summary)
        {
            var last = rows[^1];
            string F(double v) => v.ToString("R", CultureInfo.InvariantCulture);
            File.WriteAllText(Path.Combine(dir, "summary.json"),
                $$"""
                {"run_id":"{{runId}}","name":"{{sweep}}","trainer":"{{trainerKind}}","status":"done","final_return":{{F(last.Return)}},
                 "best_return":{{F(rows.Max(r => r.Return))}},"env_steps":{{F(last.Steps)}},"episodes":{{F(Math.Floor(last.Steps / 50))}},
                 "updates":{{F(last.Steps / 4)}},"generations":null,"circuit_executions":{{F(last.Steps * 3)}},"shots":{{F(last.Steps * 3 * shotsPerExecution)}},
                 "hardware_executions":{{F(last.Steps * 10)}},"wall_seconds":{{F(last.Steps / 100)}},"parameter_count":{{parameterCount}},
                 "parameter_counts":{"compressor":{{parameterCount - 4}},"circuit":4},"config_hash":"synthetic",
                 "ledger":{"shots_per_execution":{{F(shotsPerExecution)}} } }
                """);
        }
        return dir;
    }

    /// <summary>A linear-rise synthetic curve: return = slope·steps + offset, logged every <paramref name="interval"/> steps.</summary>
    public static (double, double)[] Linear(double interval, double lastStep, double slope, double offset)
    {
        var rows = new List<(double, double)>();
        for (double s = interval; s <= lastStep + 1e-9; s += interval) rows.Add((s, slope * s + offset));
        return rows.ToArray();
    }

    public void Dispose()
    {
        try { Directory.Delete(Root, recursive: true); } catch (IOException) { }
    }
}
