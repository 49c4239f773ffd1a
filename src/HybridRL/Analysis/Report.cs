using HybridRL.Checkpoints;
using System.Text;
using HybridRL.Analysis.Ledger;
using HybridRL.Analysis.Plots;

namespace HybridRL.Analysis;

/// <summary>
/// Writes a self-contained report.md (plots beside it) for a run folder or a sweep folder: config summary,
/// model and circuit resources, learning curve, evaluation results, hardware ledger, and for a sweep the comparison.
/// </summary>
public static class Report
{
    private static readonly string[] CurveColumns = ["train_return", "eval_return", "fitness_mean", "fitness_best"];

    /// <summary>Writes the report for <paramref name="runOrSweep"/> and returns the path of report.md.</summary>
    public static string Write(string runOrSweep, ReportOptions? options = null)
    {
        options ??= new ReportOptions();
        string full = Path.GetFullPath(runOrSweep);
        if (!Directory.Exists(full)) throw new DirectoryNotFoundException($"not a folder: {runOrSweep}");
        string outDir = options.OutDir is null ? full : Path.GetFullPath(options.OutDir);
        Directory.CreateDirectory(outDir);
        HardwareProfile? profile = options.HardwareProfilePath is null ? null : HardwareProfile.Load(options.HardwareProfilePath);
        string text = RunFolder.IsRunFolder(full)
            ? RunReport(RunFolder.Load(full), options, profile, outDir)
            : SweepReport(full, options, profile, outDir);
        string path = Path.Combine(outDir, "report.md");
        AtomicFile.WriteAllText(path, text);
        return path;
    }

    private static string RunReport(RunFolder run, ReportOptions o, HardwareProfile? profile, string outDir)
    {
        var sb = new StringBuilder();
        sb.AppendLine($"# Run report: {run.Id}").AppendLine();
        sb.AppendLine($"Folder: `{run.Path}`; status: **{run.Status}**.").AppendLine();
        if (run.HasSummary)
        {
            sb.AppendLine("## Summary").AppendLine();
            Table(sb, ["key", "value"], run.Summary.Where(kv => !kv.Key.StartsWith("parameter_counts.", StringComparison.Ordinal) && !kv.Key.StartsWith("ledger.", StringComparison.Ordinal))
                .Select(kv => new[] { kv.Key, kv.Value }));
        }
        sb.AppendLine("## Configuration").AppendLine();
        if (run.Config.Count == 0) sb.AppendLine("No config.yaml in the run folder.").AppendLine();
        else Table(sb, ["key", "value"], run.Config.Select(kv => new[] { kv.Key, kv.Value }));
        Resources(sb, run);

        sb.AppendLine("## Learning curve").AppendLine();
        string axisColumn = CurveAxes.Column(o.Axis);
        if (run.Metrics.HasValues(axisColumn) && CurveColumns.Any(run.Metrics.HasValues))
        {
            LearningCurvePlot.WriteRun(run, o.Axis, CurveColumns, Path.Combine(outDir, "learning-curve"));
            sb.AppendLine("![Learning curve](learning-curve.png)").AppendLine();
            var rows = new List<string[]>();
            foreach (var c in CurveColumns.Where(run.Metrics.HasValues))
            {
                var curve = LearningCurve.FromMetrics(run.Id, run.Metrics, axisColumn, c);
                rows.Add([c, curve.Count.ToString(System.Globalization.CultureInfo.InvariantCulture), ComparisonWriter.Num(curve.Final), ComparisonWriter.Num(curve.Best), ComparisonWriter.Num(curve.LastX)]);
            }
            Table(sb, ["column", "logged points", "last", "best", $"last {axisColumn}"], rows);
        }
        else sb.AppendLine($"metrics.csv has no rows with `{axisColumn}` and a return column.").AppendLine();

        Evaluations(sb, run);
        sb.AppendLine("## Hardware ledger").AppendLine();
        LedgerSection(sb, [run], o, profile);
        return sb.ToString();
    }

    private static string SweepReport(string dir, ReportOptions o, HardwareProfile? profile, string outDir)
    {
        var runs = RunFolder.Discover([dir]);
        var sb = new StringBuilder();
        sb.AppendLine($"# Sweep report: {Path.GetFileName(dir)}").AppendLine();
        sb.AppendLine($"Folder: `{dir}`; {runs.Count} run(s).").AppendLine();

        sb.AppendLine("## Configuration").AppendLine();
        var keys = runs.SelectMany(r => r.Config.Keys).Distinct().OrderBy(k => k, StringComparer.Ordinal).ToArray();
        var shared = keys.Where(k => runs.Select(r => r.ConfigValue(k)).Distinct().Count() == 1).ToArray();
        var varying = keys.Except(shared).ToArray();
        sb.AppendLine("Settings shared by every run:").AppendLine();
        Table(sb, ["key", "value"], shared.Select(k => new[] { k, runs[0].ConfigValue(k) ?? "" }));
        if (varying.Length > 0)
        {
            sb.AppendLine("Settings that differ between runs:").AppendLine();
            Table(sb, ["run", .. varying], runs.Select(r => new[] { r.Id }.Concat(varying.Select(k => r.ConfigValue(k) ?? "–")).ToArray()));
        }

        sb.AppendLine("## Resources").AppendLine();
        var comps = runs.SelectMany(r => r.ParameterCounts.Select(p => p.Key)).Distinct().OrderBy(k => k, StringComparer.Ordinal).ToArray();
        Table(sb, ["run", "parameters", .. comps], runs.Select(r => new[] { r.Id, ComparisonWriter.Num(r.ParameterCount) }
            .Concat(comps.Select(c => ComparisonWriter.Num(r.ParameterCounts.FirstOrDefault(p => p.Key == c).Value is var v && r.ParameterCounts.Any(p => p.Key == c) ? v : double.NaN))).ToArray()));

        var comparison = Comparison.Compute(runs, new ComparisonOptions
        {
            Inputs = [dir], By = o.By, Axis = o.Axis, Threshold = o.Threshold, Resamples = o.Resamples, Seed = o.Seed,
            HardwareProfilePath = o.HardwareProfilePath, ShotsPerExecution = o.ShotsPerExecution, OutDir = outDir,
        });
        Comparison.Write(comparison, outDir);
        sb.AppendLine(ComparisonWriter.Markdown(comparison, headingLevel: 2));

        var evals = runs.Where(r => r.Evaluations.Count > 0).ToArray();
        if (evals.Length > 0)
        {
            sb.AppendLine("## Evaluation results").AppendLine();
            foreach (var r in evals) EvaluationTables(sb, r, $"### {r.Id}: ");
        }
        sb.AppendLine("## Hardware ledger").AppendLine();
        LedgerSection(sb, runs, o, profile);
        return sb.ToString();
    }

    private static void Resources(StringBuilder sb, RunFolder run)
    {
        sb.AppendLine("## Model and circuit resources").AppendLine();
        sb.AppendLine($"Trainable parameters: {ComparisonWriter.Num(run.ParameterCount)}.").AppendLine();
        if (run.ParameterCounts.Count > 0)
            Table(sb, ["component", "parameters"], run.ParameterCounts.Select(p => new[] { p.Key, ComparisonWriter.Num(p.Value) }));
        if (run.Resources.Count > 0)
        {
            sb.AppendLine("From resources.json:").AppendLine();
            Table(sb, ["resource", "value"], run.Resources.Select(kv => new[] { kv.Key, kv.Value }));
        }
    }

    private static void Evaluations(StringBuilder sb, RunFolder run)
    {
        sb.AppendLine("## Evaluation results").AppendLine();
        if (run.Evaluations.Count == 0) { sb.AppendLine("No eval-*.json files.").AppendLine(); return; }
        EvaluationTables(sb, run, "### ");
    }

    private static void EvaluationTables(StringBuilder sb, RunFolder run, string headingPrefix)
    {
        foreach (var (name, values) in run.Evaluations)
        {
            sb.AppendLine(headingPrefix + name).AppendLine();
            Table(sb, ["key", "value"], values.Select(kv => new[] { kv.Key, kv.Value }));
        }
    }

    private static void LedgerSection(StringBuilder sb, IReadOnlyList<RunFolder> runs, ReportOptions o, HardwareProfile? profile)
    {
        sb.AppendLine("Counts of what was simulated, and the hardware-equivalent executions a device would have needed " +
            "(parameter-shift gradients: 2 evaluations per Pauli-rotation parameter, 4 per controlled rotation; finite shots per expectation).").AppendLine();
        var estimates = new List<HardwareEstimate>();
        var rows = new List<string[]>();
        foreach (var r in runs)
        {
            var ledger = HardwareLedger.FromRun(r, o.ShotsPerExecution);
            HardwareEstimate? e = null;
            if (profile is not null && !double.IsNaN(ledger.HardwareExecutions) && ledger.ShotsPerExecution > 0)
            {
                e = ledger.Estimate(profile);
                estimates.Add(e);
            }
            rows.Add([r.Id, ComparisonWriter.Num(ledger.CircuitExecutions), ComparisonWriter.Num(ledger.Shots), ComparisonWriter.Num(ledger.HardwareExecutions),
                ComparisonWriter.Num(ledger.ShotsPerExecution), e is null ? "–" : ComparisonWriter.Num(e.DeviceSeconds),
                e?.Cost is double c ? ComparisonWriter.Num(c) + " " + e.Currency : "–"]);
        }
        Table(sb, ["run", "circuit executions (simulated)", "shots (simulated)", "hardware-equivalent executions", "shots per execution", "est. device seconds", "est. cost"], rows);
        if (profile is null)
        {
            sb.AppendLine("No hardware profile given, so no device-time or cost estimate.").AppendLine();
            return;
        }
        sb.AppendLine($"Profile `{profile.Name}`{(profile.Note.Length > 0 ? ": " + profile.Note : "")}: {profile.SecondsPerShot} s per shot, " +
            $"{profile.PerCircuitOverheadSeconds} s per circuit, {profile.CircuitsPerJob} circuits per job, {profile.QueueLatencySeconds} s queue latency per job" +
            (profile.PricePerShot is double p ? $", {p} {profile.Currency} per shot" : "") + ".").AppendLine();
        if (estimates.Count > 0)
        {
            var t = HardwareLedger.Total(estimates, profile);
            sb.AppendLine($"Total over {estimates.Count} run(s): {ComparisonWriter.Num(t.HardwareExecutions)} executions, {ComparisonWriter.Num(t.HardwareShots)} shots, " +
                $"{ComparisonWriter.Num(t.Jobs)} jobs, {ComparisonWriter.Num(t.DeviceSeconds)} s of device time ({ComparisonWriter.Num(t.DeviceSeconds / 3600)} h)" +
                (t.Cost is double c ? $", {ComparisonWriter.Num(c)} {t.Currency}" : "") + ".").AppendLine();
        }
        sb.AppendLine($"**{HardwareLedger.Disclaimer}**").AppendLine();
    }

    private static void Table(StringBuilder sb, string[] header, IEnumerable<string[]> rows)
    {
        static string Cell(string s) => s.Replace("|", "\\|").Replace("\n", " ");
        sb.AppendLine("| " + string.Join(" | ", header.Select(Cell)) + " |");
        sb.AppendLine("|" + string.Concat(header.Select(_ => "---|")));
        foreach (var r in rows) sb.AppendLine("| " + string.Join(" | ", r.Select(Cell)) + " |");
        sb.AppendLine();
    }
}
