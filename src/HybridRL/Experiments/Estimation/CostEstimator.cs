using System.Diagnostics;
using System.Globalization;
using HybridRL.Experiments.Config;
using HybridRL.Experiments.Sweeps;
using HybridRL.Native;
using HybridRL.Training;
using HybridRL.Training.DeepQ;
using YamlDotNet.RepresentationModel;

namespace HybridRL.Experiments.Estimation;

/// <summary>
/// Predicts wall time, peak memory and checkpoint size of a run (or of every run of a sweep) on this node by
/// training the real components for a few seconds and extrapolating linearly: each phase's measured seconds per unit
/// of work (deep Q: one environment step, in warm-up and in learning; evolution: one generation) and its counter
/// increments per unit give the units the budget needs and their time. Deep-Q steps get dearer while the replay
/// buffer fills and evaluations recur; a linear extrapolation from the start of training does not see that, which is
/// why the Slurm suggestion carries a margin.
/// </summary>
public static class CostEstimator
{
    private const int MinimumMainUnits = 3;

    /// <summary>Whether <paramref name="path"/> is a sweep file (a YAML mapping with a top-level <c>base</c> key) rather than an experiment file.</summary>
    public static bool IsSweepFile(string path)
    {
        if (!File.Exists(path)) throw new FileNotFoundException($"file not found: {path}", path);
        var stream = new YamlStream();
        try { using var reader = new StreamReader(path); stream.Load(reader); }
        catch (YamlDotNet.Core.YamlException) { return false; }   // the experiment loader reports the YAML error with its line
        return stream.Documents.Count > 0 && stream.Documents[0].RootNode is YamlMappingNode map
            && map.Children.Keys.OfType<YamlScalarNode>().Any(k => k.Value == "base");
    }

    /// <summary>Calibrates and predicts one run of <paramref name="spec"/>.</summary>
    public static RunCostEstimate EstimateRun(ExperimentSpec spec, string label, EstimationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(spec);
        options ??= new EstimationOptions();
        options.Validate();
        TorchRuntime.EnsureLoaded();
        string scratch = options.ScratchDir ?? Path.Combine(Path.GetTempPath(), "hybridrl-estimate-" + Guid.NewGuid().ToString("N")[..12]);
        bool ownScratch = options.ScratchDir is null;
        try
        {
            return Calibrate(spec, label, options, scratch);
        }
        finally
        {
            if (ownScratch) try { Directory.Delete(scratch, recursive: true); } catch (IOException) { } catch (UnauthorizedAccessException) { }
        }
    }

    /// <summary>
    /// Estimates every run of <paramref name="plan"/> (base experiment plus each run's overrides and <paramref name="extraSets"/>).
    /// Runs whose resolved configs differ only in <c>experiment.seed</c> share one calibration.
    /// </summary>
    public static SweepCostEstimate EstimateSweep(SweepPlan plan, IReadOnlyList<string> extraSets, IDictionary<string, string> environment, EstimationOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(plan);
        options ??= new EstimationOptions();
        options.Validate();
        var byConfig = new Dictionary<string, RunCostEstimate>(StringComparer.Ordinal);
        var runs = new List<RunCostEstimate>(plan.Runs.Count);
        foreach (var run in plan.Runs)
        {
            var spec = ExperimentSpecLoader.Load([plan.BasePath], [.. run.OverrideStrings, .. extraSets], environment);
            string key = (spec with { Experiment = spec.Experiment with { Seed = 0 } }).Hash();
            if (!byConfig.TryGetValue(key, out var estimate))
            {
                estimate = EstimateRun(spec, run.Id, options);
                byConfig[key] = estimate;
            }
            runs.Add(estimate with { Label = run.Id });
        }
        double max = runs.Count == 0 ? 0 : runs.Max(r => r.PredictedWallSeconds);
        return new SweepCostEstimate(plan.Name, runs, byConfig.Count, SlurmTime.Suggest(max, options.TimeFactor, options.TimeMarginMinutes));
    }

    private static RunCostEstimate Calibrate(ExperimentSpec spec, string label, EstimationOptions options, string scratch)
    {
        using var components = ExperimentComponents.Build(spec);
        var trainer = components.Trainer;
        var budget = components.Budget;
        if (budget.IsUnlimited)
            throw new ArgumentException("experiment.budget: no limit is set (env_steps, episodes, generations, circuit_executions or wall_seconds); nothing to estimate");
        bool dqn = spec.Trainer.Kind == TrainerKind.Dqn;
        // Deep Q learns from the step that takes EnvSteps past warmup_steps once the buffer holds a batch (DeepQTrainer.RunUnit).
        long learnFrom = dqn ? Math.Max(spec.Trainer.Dqn!.WarmupSteps, spec.Trainer.Dqn.BatchSize - 1) : 0;
        string[] names = dqn ? ["warm-up", "learning"] : ["generations"];
        var acc = new long[names.Length, 6];
        var seconds = new double[names.Length];
        var c = trainer.Counters;
        var clock = Stopwatch.StartNew();
        double target = options.CalibrationSeconds, cap = 4 * options.CalibrationSeconds;
        int main = names.Length - 1;
        while (budget.ReachedBy(c) is null)
        {
            double elapsed = clock.Elapsed.TotalSeconds;
            if (elapsed >= target && acc[main, 0] >= MinimumMainUnits) break;
            if (elapsed >= cap) break;
            int phase = dqn && c.EnvSteps < learnFrom ? 0 : main;
            long s0 = c.EnvSteps, e0 = c.Episodes, g0 = c.Generations, x0 = c.CircuitExecutions, h0 = c.HardwareExecutions;
            trainer.RunUnit(budget);
            double now = clock.Elapsed.TotalSeconds;
            c.WallSeconds = now;
            acc[phase, 0]++;
            acc[phase, 1] += c.EnvSteps - s0;
            acc[phase, 2] += c.Episodes - e0;
            acc[phase, 3] += c.Generations - g0;
            acc[phase, 4] += c.CircuitExecutions - x0;
            acc[phase, 5] += c.HardwareExecutions - h0;
            seconds[phase] += now - elapsed;
        }
        double calibration = clock.Elapsed.TotalSeconds;
        var phases = Enumerable.Range(0, names.Length)
            .Select(p => new CalibrationPhase(names[p], acc[p, 0], seconds[p], acc[p, 1], acc[p, 2], acc[p, 3], acc[p, 4], acc[p, 5])).ToArray();

        // One real checkpoint, written exactly as a training session writes it (the loop state is two step counters).
        Directory.CreateDirectory(scratch);
        var ckClock = Stopwatch.StartNew();
        string ckPath = RunCheckpoint.Save(trainer, w => { w.Write(0L); w.Write(0L); }, spec, scratch, trainer.LatestEvaluation);
        double ckSeconds = ckClock.Elapsed.TotalSeconds;
        long ckBytes = new FileInfo(ckPath).Length;
        using var self = Process.GetCurrentProcess();
        self.Refresh();
        long peak = Math.Max(self.PeakWorkingSet64, self.WorkingSet64);

        bool covered = budget.ReachedBy(c) is not null;
        bool lowerBound = false;
        string limitedBy;
        double units, steps, executions, hardware, trainingSeconds;
        if (covered)
        {
            limitedBy = budget.ReachedBy(c)!;
            units = phases.Sum(p => p.Units);
            (steps, executions, hardware, trainingSeconds) = (c.EnvSteps, c.CircuitExecutions, c.HardwareExecutions, calibration);
        }
        else
        {
            var m = phases[main];
            if (m.Units == 0) { m = phases[0]; lowerBound = true; }
            var w = phases[0];
            // Rest of the warm-up at the warm-up rate.
            double warmLeft = dqn ? Math.Max(0, learnFrom - c.EnvSteps) : 0;
            var wp = w.Units > 0 ? w : m;
            double ps = c.EnvSteps + warmLeft * wp.EnvStepsPerUnit, pe = c.Episodes + warmLeft * wp.EpisodesPerUnit,
                pg = c.Generations + warmLeft * wp.GenerationsPerUnit, px = c.CircuitExecutions + warmLeft * wp.CircuitExecutionsPerUnit,
                ph = c.HardwareExecutions + warmLeft * wp.HardwareExecutionsPerUnit;
            double need = double.PositiveInfinity;
            limitedBy = "";
            void Limit(string name, long limit, double current, double perUnit)
            {
                if (limit <= 0 || !(perUnit > 0)) return;
                double u = Math.Max(0, Math.Ceiling((limit - current) / perUnit));
                if (u < need) { need = u; limitedBy = name; }
            }
            Limit("env_steps", budget.EnvSteps, ps, m.EnvStepsPerUnit);
            Limit("episodes", budget.Episodes, pe, m.EpisodesPerUnit);
            Limit("generations", budget.Generations, pg, m.GenerationsPerUnit);
            Limit("circuit_executions", budget.CircuitExecutions, px, m.CircuitExecutionsPerUnit);
            double sec = calibration + warmLeft * wp.SecondsPerUnit;
            if (double.IsPositiveInfinity(need))
            {
                if (budget.WallSeconds <= 0)
                    throw new InvalidOperationException($"{label}: the calibration advanced none of the budget's measures ({DescribeBudget(budget)}); give a longer calibration");
                need = Math.Max(0, (budget.WallSeconds - sec) / m.SecondsPerUnit);
                limitedBy = "wall_seconds";
            }
            trainingSeconds = sec + need * m.SecondsPerUnit;
            if (budget.WallSeconds > 0 && trainingSeconds > budget.WallSeconds)
            {
                need = Math.Max(0, (budget.WallSeconds - sec) / m.SecondsPerUnit);
                trainingSeconds = budget.WallSeconds;
                limitedBy = "wall_seconds";
            }
            units = phases.Sum(p => p.Units) + warmLeft + need;
            steps = ps + need * m.EnvStepsPerUnit;
            executions = px + need * m.CircuitExecutionsPerUnit;
            hardware = ph + need * m.HardwareExecutionsPerUnit;
        }

        long every = spec.Logging.CheckpointEverySteps;
        long checkpoints = every > 0 ? (long)Math.Floor(steps / every) + 1 : 1;
        long replayGrowth = 0;
        if (dqn)
        {
            long capacity = spec.Trainer.Dqn!.ReplayCapacity;
            var env = components.CreateEnvironment();
            long perTransition = ReplayBuffer.BytesPerTransition(env.ObservationSize, env.ObservationIsBinary);
            long filledNow = Math.Min(capacity, c.EnvSteps), filledEnd = Math.Min(capacity, (long)Math.Ceiling(steps));
            replayGrowth = Math.Max(0, filledEnd - filledNow) * perTransition;
        }
        var estimate = new RunCostEstimate
        {
            Label = label,
            TrainerKind = trainer.Kind,
            Budget = DescribeBudget(budget),
            LimitedBy = limitedBy,
            Phases = phases,
            CalibrationSeconds = calibration,
            CoveredWholeBudget = covered,
            LowerBound = lowerBound,
            PredictedEnvSteps = steps,
            PredictedUnits = units,
            PredictedCircuitExecutions = executions,
            PredictedHardwareExecutions = hardware,
            PredictedTrainingSeconds = trainingSeconds,
            Checkpoints = checkpoints,
            CheckpointWriteSeconds = ckSeconds,
            MeasuredPeakMemoryBytes = peak,
            PredictedPeakMemoryBytes = peak + replayGrowth,
            MeasuredCheckpointBytes = ckBytes,
            PredictedCheckpointBytes = ckBytes + replayGrowth,
            KeptCheckpoints = spec.Logging.KeepCheckpoints,
            SuggestedTime = "",
            Method = Method(dqn, covered, lowerBound, options),
        };
        return estimate with { SuggestedTime = SlurmTime.Suggest(estimate.PredictedWallSeconds, options.TimeFactor, options.TimeMarginMinutes) };
    }

    private static string Method(bool dqn, bool covered, bool lowerBound, EstimationOptions o)
    {
        string inv(double v) => v.ToString("0.##", CultureInfo.InvariantCulture);
        if (covered)
            return "the calibration trained the whole budget, so the times are measured, not extrapolated.";
        string s = dqn
            ? "linear extrapolation from the calibration: the measured seconds per environment step of the warm-up and of the learning phase " +
              "times the steps each phase needs to reach the budget. Deep-Q steps grow dearer as the replay buffer fills and periodic evaluations recur; " +
              "the calibration saw only the start of training, so treat the time as a lower-end estimate."
            : "linear extrapolation from the calibration: the measured seconds per generation times the generations the budget needs " +
              "(from the measured environment steps, episodes and circuit executions per generation).";
        if (lowerBound) s += " The calibration never left the warm-up, so the learning phase's cost is unknown and the prediction is a lower bound.";
        s += " Memory: peak working set of this process during calibration" + (dqn ? ", plus the part of the replay buffer not yet filled" : "") +
             ". Checkpoint: size of one real checkpoint" + (dqn ? ", plus the replay transitions still to be stored" : "") +
             $". Slurm time = {inv(o.TimeFactor)} × prediction + {inv(o.TimeMarginMinutes)} min, rounded up to whole minutes (common practice).";
        return s;
    }

    private static string DescribeBudget(TrainingBudget b)
    {
        var parts = new List<string>();
        if (b.EnvSteps > 0) parts.Add($"env_steps {b.EnvSteps}");
        if (b.Episodes > 0) parts.Add($"episodes {b.Episodes}");
        if (b.Generations > 0) parts.Add($"generations {b.Generations}");
        if (b.CircuitExecutions > 0) parts.Add($"circuit_executions {b.CircuitExecutions}");
        if (b.WallSeconds > 0) parts.Add("wall_seconds " + b.WallSeconds.ToString(CultureInfo.InvariantCulture));
        return parts.Count == 0 ? "none" : string.Join(", ", parts);
    }
}
