using HybridRL.Analysis.Ledger;
using HybridRL.Analysis.Plots;
using HybridRL.Analysis.Statistics;
using HybridRL.Quantum.Randomness;

namespace HybridRL.Analysis;

/// <summary>
/// The compare pipeline: discover runs, group them by a config key, align learning curves on a common axis
/// (censoring runs that stop early), compute per-group statistics with stratified bootstrap intervals
/// (Agarwal et al. 2021) and pairwise tests on final returns, then write comparison.md/.csv and plots.
/// </summary>
public static class Comparison
{
    /// <summary>Discovers the runs named by <see cref="ComparisonOptions.Inputs"/>, compares them and writes outputs to OutDir if set.</summary>
    public static ComparisonResult Run(ComparisonOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (options.Inputs.Count == 0) throw new ArgumentException("compare needs at least one run or sweep folder", nameof(options));
        var runs = RunFolder.Discover(options.Inputs);
        var result = Compute(runs, options);
        if (options.OutDir is not null) Write(result, options.OutDir);
        return result;
    }

    /// <summary>Writes comparison.md, comparison.csv, comparison-curves.csv, comparison-pairs.csv and plots into <paramref name="outDir"/>.</summary>
    public static void Write(ComparisonResult result, string outDir)
    {
        Directory.CreateDirectory(outDir);
        if (result.Options.WritePlots)
        {
            result.Files.AddRange(LearningCurvePlot.Write(result, Path.Combine(outDir, "learning-curves")));
            result.Files.AddRange(FinalReturnPlot.Write(result, Path.Combine(outDir, "final-returns")));
            if (result.Options.Threshold is not null)
                result.Files.AddRange(ThresholdReachingPlot.Write(result, Path.Combine(outDir, "threshold-reaching")));
            result.Files.AddRange(ReturnVersusParametersPlot.Write(result, Path.Combine(outDir, "return-vs-parameters")));
        }
        result.Files.AddRange(ComparisonWriter.WriteFiles(result, outDir));
    }

    /// <summary>Computes the comparison of already loaded runs (no files written).</summary>
    public static ComparisonResult Compute(IReadOnlyList<RunFolder> runs, ComparisonOptions options)
    {
        ArgumentNullException.ThrowIfNull(runs);
        ArgumentNullException.ThrowIfNull(options);
        if (runs.Count == 0) throw new ArgumentException("no runs to compare", nameof(runs));
        if (options.GridPoints < 2) throw new ArgumentOutOfRangeException(nameof(options), options.GridPoints, "GridPoints must be ≥ 2");
        if (options.Resamples < 10) throw new ArgumentOutOfRangeException(nameof(options), options.Resamples, "Resamples must be ≥ 10");
        var warnings = new List<string>();
        string metric = ResolveMetric(runs, options.Metric);
        string axisColumn = CurveAxes.Column(options.Axis);
        foreach (var run in runs)
            if (!run.Metrics.HasValues(axisColumn))
                throw new InvalidDataException($"{run.Path}: metrics.csv has no values in column '{axisColumn}' (axis '{axisColumn}' unavailable for this run)");

        var curves = runs.Select(r => LearningCurve.FromMetrics(r.Id, r.Metrics, axisColumn, metric)).ToArray();
        for (int i = 0; i < runs.Count; i++)
        {
            if (curves[i].Count == 0) throw new InvalidDataException($"{runs[i].Path}: no rows with both '{axisColumn}' and '{metric}'");
            if (runs[i].Status != "done") warnings.Add($"run {runs[i].Id} has status '{runs[i].Status}': its curve ends at {Fmt(curves[i].LastX)} and is treated as censored beyond.");
        }

        var grid = CurveAlignment.CommonGrid(curves, options.GridPoints);
        double aucFrom = curves.Max(c => c.FirstX), aucTo = curves.Min(c => c.LastX);
        if (aucTo < aucFrom) warnings.Add("the runs share no common axis range; area under the curve is not computed.");

        HardwareProfile? profile = options.HardwareProfilePath is null ? null : HardwareProfile.Load(options.HardwareProfilePath);

        var byLabel = new SortedDictionary<string, List<int>>(StringComparer.Ordinal);
        for (int i = 0; i < runs.Count; i++)
        {
            string label = runs[i].ConfigValue(options.By) ?? "(no " + options.By + ")";
            if (!byLabel.TryGetValue(label, out var list)) byLabel[label] = list = [];
            list.Add(i);
        }

        var groups = new List<GroupResult>();
        var perRunEstimates = new List<HardwareEstimate>();
        foreach (var (label, idx) in byLabel)
        {
            var gRuns = idx.Select(i => runs[i]).ToArray();
            var gCurves = idx.Select(i => curves[i]).ToArray();
            if (gRuns.Length < options.MinimumSeeds)
                warnings.Add($"group '{label}' has {gRuns.Length} run(s); fewer than {options.MinimumSeeds} seeds make intervals and tests unreliable (Henderson et al. 2018 recommend more).");
            var strataKeys = gRuns.Select(r => options.StratifyBy is null ? "" : r.ConfigValue(options.StratifyBy) ?? "").ToArray();
            var rng = RandomStream.FromRoot(options.Seed, "compare/" + label);

            var curveStats = CurveStatistics(gCurves, strataKeys, grid, options, rng);
            var finals = gCurves.Select(c => c.Final).ToArray();
            var bests = gCurves.Select(c => c.Best).ToArray();
            var areas = aucTo >= aucFrom ? gCurves.Select(c => c.AreaUnder(aucFrom, aucTo)).ToArray() : [];
            var finalMean = Stratified(finals, strataKeys, Descriptive.MeanStatistic, options, rng);
            var finalIqm = Stratified(finals, strataKeys, Descriptive.IqmStatistic, options, rng);
            var bestMean = Stratified(bests, strataKeys, Descriptive.MeanStatistic, options, rng);
            var areaMean = areas.Length > 0 ? Stratified(areas, strataKeys, Descriptive.MeanStatistic, options, rng) : ConfidenceInterval.Missing(options.Confidence);

            double[] reachX = [];
            double never = double.NaN, median = double.NaN;
            if (options.Threshold is double thr)
            {
                reachX = gCurves.Select(c => c.FirstReaching(thr)).ToArray();
                never = reachX.Count(double.IsNaN) / (double)reachX.Length;
                var reached = reachX.Where(x => !double.IsNaN(x)).ToArray();
                median = reached.Length > 0 ? Descriptive.Median(reached) : double.NaN;
            }

            HardwareEstimate? groupHardware = null;
            if (profile is not null)
            {
                var estimates = new List<HardwareEstimate>();
                foreach (var r in gRuns)
                {
                    var ledger = HardwareLedger.FromRun(r, options.ShotsPerExecution);
                    if (double.IsNaN(ledger.HardwareExecutions) || double.IsNaN(ledger.ShotsPerExecution) || ledger.ShotsPerExecution <= 0)
                    {
                        warnings.Add($"run {r.Id}: hardware_executions or shots per execution unknown; left out of the device-time estimate (give shots per execution explicitly).");
                        continue;
                    }
                    estimates.Add(ledger.Estimate(profile));
                }
                if (estimates.Count > 0) groupHardware = HardwareLedger.Total(estimates, profile);
                perRunEstimates.AddRange(estimates);
            }

            groups.Add(new GroupResult(label, gRuns, gCurves, curveStats, finals, finalMean, finalIqm, bests, bestMean,
                areas, areaMean, reachX, never, median, gRuns.Select(r => r.ParameterCount).ToArray(), groupHardware));
        }

        var pairs = new List<PairResult>();
        for (int a = 0; a < groups.Count; a++)
            for (int b = a + 1; b < groups.Count; b++)
            {
                var x = groups[a].FinalReturns;
                var y = groups[b].FinalReturns;
                var rng = RandomStream.FromRoot(options.Seed, $"compare/pair/{groups[a].Label}/{groups[b].Label}");
                var poi = Bootstrap.TwoSample(x, y, ProbabilityOfImprovement.Compute, options.Resamples, options.Confidence, rng, BootstrapMethod.Percentile);
                pairs.Add(new PairResult(groups[a].Label, groups[b].Label, poi, WelchTest.Compute(x, y), MannWhitneyTest.Compute(x, y), EffectSize.Compute(x, y)));
            }

        var total = profile is not null && perRunEstimates.Count > 0 ? HardwareLedger.Total(perRunEstimates, profile) : null;
        return new ComparisonResult(options, metric, grid, groups, pairs, (aucFrom, aucTo), profile, total, warnings);
    }

    /// <summary>Chooses the return column: explicit name, or eval_return → train_return → fitness_mean when every run has values.</summary>
    public static string ResolveMetric(IReadOnlyList<RunFolder> runs, string metric)
    {
        if (metric != "auto")
        {
            if (!MetricsTable.ContractColumns.Contains(metric) && !runs.All(r => r.Metrics.HasColumn(metric)))
                throw new ArgumentException($"unknown metric column '{metric}'");
            var lacking = runs.FirstOrDefault(r => !r.Metrics.HasValues(metric));
            if (lacking is not null) throw new InvalidDataException($"{lacking.Path}: metrics.csv has no values in column '{metric}'");
            return metric;
        }
        foreach (var c in new[] { "eval_return", "train_return", "fitness_mean" })
            if (runs.All(r => r.Metrics.HasValues(c))) return c;
        throw new InvalidDataException("no return column (eval_return, train_return, fitness_mean) has values in every run; choose a metric explicitly");
    }

    private static GroupCurveStatistics CurveStatistics(LearningCurve[] curves, string[] strataKeys, double[] grid, ComparisonOptions o, RandomStream rng)
    {
        var aligned = CurveAlignment.Align(curves, grid);
        var mean = new ConfidenceInterval[grid.Length];
        var iqm = new ConfidenceInterval[grid.Length];
        var estimates = new double[o.Resamples];
        var pooled = new double[curves.Length];
        var work = new double[curves.Length];
        var values = new List<double>(curves.Length);
        var keys = new List<string>(curves.Length);
        for (int g = 0; g < grid.Length; g++)
        {
            values.Clear(); keys.Clear();
            for (int r = 0; r < curves.Length; r++)
            {
                double v = aligned.Values[r][g];
                if (!double.IsNaN(v)) { values.Add(v); keys.Add(strataKeys[r]); }
            }
            if (values.Count == 0)
            {
                mean[g] = iqm[g] = ConfidenceInterval.Missing(o.Confidence);
                continue;
            }
            var strata = BuildStrata(values, keys);
            mean[g] = Bootstrap.Stratified(strata, Descriptive.MeanStatistic, o.Confidence, rng, o.Method, estimates, pooled, work);
            iqm[g] = Bootstrap.Stratified(strata, Descriptive.IqmStatistic, o.Confidence, rng, o.Method, estimates, pooled, work);
        }
        double[]? reached = null;
        if (o.Threshold is double thr)
        {
            var reachX = curves.Select(c => c.FirstReaching(thr)).ToArray();
            reached = new double[grid.Length];
            for (int g = 0; g < grid.Length; g++)
                reached[g] = reachX.Count(x => !double.IsNaN(x) && x <= grid[g]) / (double)curves.Length;
        }
        return new GroupCurveStatistics(grid, aligned.Observed, mean, iqm, reached);
    }

    private static ConfidenceInterval Stratified(double[] values, string[] keys, SampleStatistic stat, ComparisonOptions o, RandomStream rng)
    {
        var finite = new List<double>();
        var k = new List<string>();
        for (int i = 0; i < values.Length; i++)
            if (!double.IsNaN(values[i])) { finite.Add(values[i]); k.Add(keys[i]); }
        if (finite.Count == 0) return ConfidenceInterval.Missing(o.Confidence);
        return Bootstrap.Stratified(BuildStrata(finite, k), stat, o.Resamples, o.Confidence, rng, o.Method);
    }

    private static double[][] BuildStrata(List<double> values, List<string> keys)
    {
        var map = new SortedDictionary<string, List<double>>(StringComparer.Ordinal);
        for (int i = 0; i < values.Count; i++)
        {
            if (!map.TryGetValue(keys[i], out var l)) map[keys[i]] = l = [];
            l.Add(values[i]);
        }
        return map.Values.Select(l => l.ToArray()).ToArray();
    }

    internal static string Fmt(double v) => ComparisonWriter.Num(v);
}
