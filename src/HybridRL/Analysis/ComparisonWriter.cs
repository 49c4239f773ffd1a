using HybridRL.Checkpoints;
using System.Globalization;
using System.Text;
using HybridRL.Analysis.Ledger;
using HybridRL.Analysis.Statistics;

namespace HybridRL.Analysis;

/// <summary>Formats a <see cref="ComparisonResult"/> as a terminal table, comparison.md and CSV files.</summary>
public static class ComparisonWriter
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Short display number (4 significant digits, invariant culture); "–" for NaN.</summary>
    public static string Num(double v) => double.IsNaN(v) ? "–" : double.IsInfinity(v) ? (v > 0 ? "inf" : "-inf") : v.ToString("G4", Inv);

    /// <summary>Round-trip number for CSV; empty for NaN.</summary>
    public static string Csv(double v) => double.IsNaN(v) ? "" : v.ToString("R", Inv);

    public static string Interval(ConfidenceInterval ci) => double.IsNaN(ci.Estimate) ? "–" : $"{Num(ci.Estimate)} [{Num(ci.Lower)}, {Num(ci.Upper)}]";

    private static string Pct(double share) => double.IsNaN(share) ? "–" : (100 * share).ToString("0.#", Inv) + "%";

    private static string AxisName(ComparisonResult r) => CurveAxes.Column(r.Options.Axis);

    /// <summary>Plain-text table of groups and pairs, with warnings.</summary>
    public static string FormatTable(ComparisonResult r)
    {
        var sb = new StringBuilder();
        int level = (int)Math.Round(100 * r.Options.Confidence);
        sb.AppendLine($"Comparison by {r.Options.By} on {AxisName(r)}, return = {r.MetricColumn}, {level}% bootstrap intervals ({r.Options.Resamples} resamples, seed {r.Options.Seed})");
        var header = new List<string> { "group", "runs", "final mean [CI]", "final IQM [CI]", "best mean", $"AUC {Num(r.AreaWindow.From)}..{Num(r.AreaWindow.To)}", "params" };
        if (r.Options.Threshold is not null) { header.Add($"median {AxisName(r)} to {Num(r.Options.Threshold.Value)}"); header.Add("never reached"); }
        var rows = new List<List<string>> { header };
        foreach (var g in r.Groups)
        {
            var row = new List<string> { g.Label, g.RunCount.ToString(Inv), Interval(g.FinalMean), Interval(g.FinalIqm), Num(g.BestMean.Estimate), Num(g.AreaMean.Estimate), Num(Descriptive.Median(g.ParameterCounts)) };
            if (r.Options.Threshold is not null) { row.Add(Num(g.MedianToThreshold)); row.Add(Pct(g.NeverReachedShare)); }
            rows.Add(row);
        }
        AppendAligned(sb, rows);
        if (r.Pairs.Count > 0)
        {
            sb.AppendLine();
            sb.AppendLine("Final returns, A vs B:");
            var prow = new List<List<string>> { new() { "A", "B", "P(A>B) [CI]", "Welch t", "df", "p", "Mann-Whitney U", "p", "Cohen d", "Hedges g", "CL" } };
            foreach (var p in r.Pairs)
                prow.Add([p.A, p.B, Interval(p.ProbabilityOfImprovement), Num(p.Welch.T), Num(p.Welch.DegreesOfFreedom), Num(p.Welch.PValue),
                    Num(p.MannWhitney.U), Num(p.MannWhitney.PValue) + (p.MannWhitney.Exact ? " (exact)" : ""), Num(p.Effect.CohensD), Num(p.Effect.HedgesG), Num(p.Effect.CommonLanguage)]);
            AppendAligned(sb, prow);
        }
        if (r.Profile is not null && r.HardwareTotal is not null)
        {
            sb.AppendLine();
            sb.AppendLine($"Estimated device time for all runs on profile '{r.Profile.Name}': {Num(r.HardwareTotal.DeviceSeconds)} s" +
                (r.HardwareTotal.Cost is double c ? $", cost {Num(c)} {r.HardwareTotal.Currency}" : ""));
            sb.AppendLine(HardwareLedger.Disclaimer);
        }
        foreach (var w in r.Warnings) sb.AppendLine("warning: " + w);
        return sb.ToString();
    }

    private static void AppendAligned(StringBuilder sb, List<List<string>> rows)
    {
        int cols = rows.Max(x => x.Count);
        var width = new int[cols];
        foreach (var row in rows) for (int i = 0; i < row.Count; i++) width[i] = Math.Max(width[i], row[i].Length);
        for (int k = 0; k < rows.Count; k++)
        {
            sb.AppendLine(string.Join("  ", rows[k].Select((c, i) => c.PadRight(width[i]))).TrimEnd());
            if (k == 0) sb.AppendLine(string.Join("  ", width.Select(w => new string('-', w))));
        }
    }

    /// <summary>Markdown body (no plots' file check); <paramref name="plotPrefix"/> is prepended to image links.</summary>
    public static string Markdown(ComparisonResult r, string plotPrefix = "", int headingLevel = 1)
    {
        string h = new('#', headingLevel);
        var sb = new StringBuilder();
        int level = (int)Math.Round(100 * r.Options.Confidence);
        sb.AppendLine($"{h} Comparison by `{r.Options.By}`").AppendLine();
        sb.AppendLine($"Axis: `{AxisName(r)}`; return column: `{r.MetricColumn}`; {level}% stratified bootstrap intervals " +
            $"({r.Options.Method}, {r.Options.Resamples} resamples, seed {r.Options.Seed}) after Agarwal et al. 2021. " +
            "Curves are interpolated onto a common grid; a run contributes no value beyond its last logged point (censored), " +
            "and the number of runs observed at each point is in comparison-curves.csv.").AppendLine();
        if (r.Warnings.Count > 0)
        {
            sb.AppendLine($"{h}# Warnings").AppendLine();
            foreach (var w in r.Warnings) sb.AppendLine("- " + w);
            sb.AppendLine();
        }
        sb.AppendLine($"{h}# Groups").AppendLine();
        var head = "| group | runs | final mean [CI] | final IQM [CI] | best mean [CI] | AUC mean [CI] | parameters (median) |";
        var sep = "|---|---|---|---|---|---|---|";
        if (r.Options.Threshold is not null) { head += $" median `{AxisName(r)}` to {Num(r.Options.Threshold.Value)} | never reached |"; sep += "---|---|"; }
        sb.AppendLine(head).AppendLine(sep);
        foreach (var g in r.Groups)
        {
            sb.Append($"| {g.Label} | {g.RunCount} | {Interval(g.FinalMean)} | {Interval(g.FinalIqm)} | {Interval(g.BestMean)} | {Interval(g.AreaMean)} | {Num(Descriptive.Median(g.ParameterCounts))} |");
            if (r.Options.Threshold is not null) sb.Append($" {Num(g.MedianToThreshold)} | {Pct(g.NeverReachedShare)} |");
            sb.AppendLine();
        }
        sb.AppendLine().AppendLine($"Area under the curve is taken over the window shared by all runs, {AxisName(r)} ∈ [{Num(r.AreaWindow.From)}, {Num(r.AreaWindow.To)}].").AppendLine();
        if (r.Pairs.Count > 0)
        {
            sb.AppendLine($"{h}# Pairwise comparison of final returns").AppendLine();
            sb.AppendLine("| A | B | P(A>B) [CI] | Welch t (df), p | Mann–Whitney U, p | Cohen's d | Hedges' g | common-language |");
            sb.AppendLine("|---|---|---|---|---|---|---|---|");
            foreach (var p in r.Pairs)
                sb.AppendLine($"| {p.A} | {p.B} | {Interval(p.ProbabilityOfImprovement)} | {Num(p.Welch.T)} ({Num(p.Welch.DegreesOfFreedom)}), {Num(p.Welch.PValue)} | " +
                    $"{Num(p.MannWhitney.U)}, {Num(p.MannWhitney.PValue)}{(p.MannWhitney.Exact ? " (exact)" : "")} | {Num(p.Effect.CohensD)} | {Num(p.Effect.HedgesG)} | {Num(p.Effect.CommonLanguage)} |");
            sb.AppendLine().AppendLine("P(A>B): probability of improvement (Agarwal et al. 2021) with a percentile bootstrap interval; " +
                "common-language effect size Φ(Δ/√(s₁²+s₂²)) (McGraw & Wong 1992).").AppendLine();
        }
        if (r.Profile is not null)
        {
            sb.AppendLine($"{h}# Hardware-cost estimate").AppendLine();
            sb.AppendLine($"Profile `{r.Profile.Name}`{(r.Profile.Note.Length > 0 ? ": " + r.Profile.Note : "")}. **{HardwareLedger.Disclaimer}**").AppendLine();
            sb.AppendLine("| group | hardware executions | hardware shots | jobs | device seconds | cost |").AppendLine("|---|---|---|---|---|---|");
            foreach (var g in r.Groups)
                if (g.Hardware is { } e)
                    sb.AppendLine($"| {g.Label} | {Num(e.HardwareExecutions)} | {Num(e.HardwareShots)} | {Num(e.Jobs)} | {Num(e.DeviceSeconds)} | {(e.Cost is double c ? Num(c) + " " + e.Currency : "–")} |");
            if (r.HardwareTotal is { } t)
                sb.AppendLine($"| **all** | {Num(t.HardwareExecutions)} | {Num(t.HardwareShots)} | {Num(t.Jobs)} | {Num(t.DeviceSeconds)} | {(t.Cost is double c ? Num(c) + " " + t.Currency : "–")} |");
            sb.AppendLine();
        }
        var plots = new List<(string, string)> { ("learning-curves", "Learning curves (mean, shaded: confidence band)"), ("final-returns", "Final returns per run (box: quartiles)") };
        if (r.Options.Threshold is not null) plots.Add(("threshold-reaching", "Share of runs that reached the threshold"));
        plots.Add(("return-vs-parameters", "Final return against parameter count"));
        if (r.Options.WritePlots)
        {
            sb.AppendLine($"{h}# Plots").AppendLine();
            foreach (var (f, t) in plots) sb.AppendLine($"![{t}]({plotPrefix}{f}.png)").AppendLine();
        }
        sb.AppendLine($"{h}# Runs").AppendLine();
        sb.AppendLine($"| run | group | status | last {AxisName(r)} | final | best |").AppendLine("|---|---|---|---|---|---|");
        foreach (var g in r.Groups)
            for (int i = 0; i < g.RunCount; i++)
                sb.AppendLine($"| {g.Runs[i].Id} | {g.Label} | {g.Runs[i].Status} | {Num(g.Curves[i].LastX)} | {Num(g.FinalReturns[i])} | {Num(g.BestReturns[i])} |");
        return sb.ToString();
    }

    /// <summary>One row per group: counts and the summary statistics.</summary>
    public static string GroupsCsv(ComparisonResult r)
    {
        var sb = new StringBuilder();
        sb.AppendLine("group,runs,final_mean,final_mean_lower,final_mean_upper,final_iqm,final_iqm_lower,final_iqm_upper,best_mean,best_mean_lower,best_mean_upper," +
            "auc_mean,auc_mean_lower,auc_mean_upper,auc_from,auc_to,threshold,median_to_threshold,never_reached_share,parameter_count_median,confidence,axis,metric," +
            "hardware_executions,hardware_shots,device_seconds,cost,currency");
        foreach (var g in r.Groups)
        {
            var f = new List<string> { Quote(g.Label), g.RunCount.ToString(Inv) };
            foreach (var ci in new[] { g.FinalMean, g.FinalIqm, g.BestMean, g.AreaMean }) { f.Add(Csv(ci.Estimate)); f.Add(Csv(ci.Lower)); f.Add(Csv(ci.Upper)); }
            f.Add(Csv(r.AreaWindow.From)); f.Add(Csv(r.AreaWindow.To));
            f.Add(r.Options.Threshold is double t ? Csv(t) : ""); f.Add(Csv(g.MedianToThreshold)); f.Add(Csv(g.NeverReachedShare));
            f.Add(Csv(Descriptive.Median(g.ParameterCounts))); f.Add(Csv(r.Options.Confidence)); f.Add(AxisName(r)); f.Add(r.MetricColumn);
            f.Add(g.Hardware is { } e ? Csv(e.HardwareExecutions) : ""); f.Add(g.Hardware is { } e2 ? Csv(e2.HardwareShots) : "");
            f.Add(g.Hardware is { } e3 ? Csv(e3.DeviceSeconds) : ""); f.Add(g.Hardware?.Cost is double c ? Csv(c) : ""); f.Add(g.Hardware?.Currency ?? "");
            sb.AppendLine(string.Join(',', f));
        }
        return sb.ToString();
    }

    /// <summary>Per group and grid point: runs observed, mean and IQM with intervals, share that reached the threshold.</summary>
    public static string CurvesCsv(ComparisonResult r)
    {
        var sb = new StringBuilder();
        sb.AppendLine($"group,{AxisName(r)},observed_runs,mean,mean_lower,mean_upper,iqm,iqm_lower,iqm_upper,reached_share");
        foreach (var g in r.Groups)
            for (int i = 0; i < g.Curve.Grid.Length; i++)
                sb.AppendLine(string.Join(',', Quote(g.Label), Csv(g.Curve.Grid[i]), g.Curve.Observed[i].ToString(Inv),
                    Csv(g.Curve.Mean[i].Estimate), Csv(g.Curve.Mean[i].Lower), Csv(g.Curve.Mean[i].Upper),
                    Csv(g.Curve.Iqm[i].Estimate), Csv(g.Curve.Iqm[i].Lower), Csv(g.Curve.Iqm[i].Upper),
                    g.Curve.ReachedShare is null ? "" : Csv(g.Curve.ReachedShare[i])));
        return sb.ToString();
    }

    public static string PairsCsv(ComparisonResult r)
    {
        var sb = new StringBuilder();
        sb.AppendLine("group_a,group_b,probability_of_improvement,poi_lower,poi_upper,welch_t,welch_df,welch_p,mann_whitney_u,mann_whitney_z,mann_whitney_p,mann_whitney_exact,cohens_d,hedges_g,common_language");
        foreach (var p in r.Pairs)
            sb.AppendLine(string.Join(',', Quote(p.A), Quote(p.B), Csv(p.ProbabilityOfImprovement.Estimate), Csv(p.ProbabilityOfImprovement.Lower), Csv(p.ProbabilityOfImprovement.Upper),
                Csv(p.Welch.T), Csv(p.Welch.DegreesOfFreedom), Csv(p.Welch.PValue), Csv(p.MannWhitney.U), Csv(p.MannWhitney.Z), Csv(p.MannWhitney.PValue),
                p.MannWhitney.Exact ? "true" : "false", Csv(p.Effect.CohensD), Csv(p.Effect.HedgesG), Csv(p.Effect.CommonLanguage)));
        return sb.ToString();
    }

    /// <summary>Writes comparison.md, comparison.csv, comparison-curves.csv, comparison-pairs.csv (atomically); returns their paths.</summary>
    public static IReadOnlyList<string> WriteFiles(ComparisonResult r, string outDir)
    {
        Directory.CreateDirectory(outDir);
        var files = new (string Name, string Text)[]
        {
            ("comparison.md", Markdown(r)),
            ("comparison.csv", GroupsCsv(r)),
            ("comparison-curves.csv", CurvesCsv(r)),
            ("comparison-pairs.csv", PairsCsv(r)),
        };
        var paths = new List<string>();
        foreach (var (name, text) in files)
        {
            string p = Path.Combine(outDir, name);
            AtomicFile.WriteAllText(p, text);
            paths.Add(p);
        }
        return paths;
    }

    private static string Quote(string s) => s.IndexOfAny([',', '"', '\n']) >= 0 ? "\"" + s.Replace("\"", "\"\"") + "\"" : s;
}
