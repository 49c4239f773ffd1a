using System.Text.Json;
using HybridRL.Analysis.Ledger;
using HybridRL.Checkpoints;
using HybridRL.Environments;
using HybridRL.Experiments.Config;
using HybridRL.Experiments.Inspection;
using HybridRL.Experiments.Runs;
using HybridRL.Logging;
using HybridRL.Native;
using HybridRL.Training;
using Serilog;

namespace HybridRL.Experiments;

/// <summary>
/// One training run in its run folder, from start or from its newest valid checkpoint to the end
/// of its budget: lock, resolved config, resources.json, metrics.csv, JSON log, checkpoints, progress, signals,
/// final greedy evaluation and summary.json.
/// </summary>
public sealed class TrainingSession
{
    private readonly ExperimentSpec _spec;
    private readonly RunFolder _folder;
    private readonly string _runId;
    private readonly string _name;
    private readonly Verbosity _verbosity;
    private readonly TextWriter _out;
    private IReadOnlyList<SpecDifference> _resumeChanges = [];

    private TrainingSession(ExperimentSpec spec, RunFolder folder, string name, string runId, Verbosity verbosity, TextWriter output)
    {
        _spec = spec;
        _folder = folder;
        _name = name;
        _runId = runId;
        _verbosity = verbosity;
        _out = output;
    }

    /// <summary>The run folder this session writes.</summary>
    public RunFolder Folder => _folder;

    /// <summary>
    /// Prepares a run of <paramref name="spec"/> under <c>runsDir/name/runId</c> (run id from the spec hash
    /// unless given). Builds the components once first, so a config that cannot work fails before any file is created.
    /// </summary>
    public static TrainingSession Create(ExperimentSpec spec, string runsDir, string? name, string? runId, Verbosity verbosity, TextWriter output)
    {
        TorchRuntime.EnsureLoaded();
        using (ExperimentComponents.Validate(spec)) { }
        string runName = name ?? spec.Experiment.Name;
        string id = runId ?? RunId.Create(runName, spec.Hash());
        return new TrainingSession(spec, RunFolder.For(runsDir, runName, id), runName, id, verbosity, output);
    }

    /// <summary>A session that continues the run in <paramref name="runDir"/>, optionally with safe config changes.</summary>
    public static TrainingSession ForExisting(string runDir, IReadOnlyList<string> setOverrides, Verbosity verbosity, TextWriter output)
    {
        TorchRuntime.EnsureLoaded();
        var folder = new RunFolder(Path.GetFullPath(runDir));
        if (!File.Exists(folder.ConfigPath))
            throw new ConfigException([new ConfigError("run", folder.Root, null, $"'{folder.Root}' is not a run folder: it has no config.yaml")]);
        var saved = ExperimentSpecLoader.Load([folder.ConfigPath], [], new Dictionary<string, string>());
        var spec = setOverrides.Count == 0 ? saved : ExperimentSpecLoader.Load([folder.ConfigPath], setOverrides, new Dictionary<string, string>());
        var diff = SpecDiff.Compare(saved, spec);
        if (!diff.IsSafeForResume)
        {
            var keys = string.Join(", ", diff.UnsafeDifferences.Select(d => $"{d.Key} ({d.Before} → {d.After})"));
            throw new ConfigException([new ConfigError("--set", null, null, $"cannot resume with a changed config: {keys}; only budgets, logging and similar keys may change on resume — start a new run instead")]);
        }
        string runId = Path.GetFileName(folder.Root);
        string name = Path.GetFileName(Path.GetDirectoryName(folder.Root)!) ?? spec.Experiment.Name;
        using (ExperimentComponents.Validate(spec)) { }
        return new TrainingSession(spec, folder, name, runId, verbosity, output) { _resumeChanges = diff.Differences };
    }

    /// <summary>Runs to the end of the budget (or a signal). Returns the process exit code.</summary>
    public int Run(CancellationToken cancel)
    {
        _out.WriteLine(_folder.Root);
        bool extendsFinishedRun = false;
        if (File.Exists(_folder.SummaryPath) && RunStatus.Detect(_folder).State == RunState.Done)
        {
            if (!BudgetExceedsNewestCheckpoint())
            {
                _out.WriteLine($"run already finished; its summary is {_folder.SummaryPath}");
                return ExitCodes.Done;
            }
            extendsFinishedRun = true;
        }

        _folder.EnsureCreated();
        using var runLock = RunLock.Acquire(_folder);
        using var log = LogSetup.CreateForRun(_verbosity, _folder.LogPath);
        if (runLock.TakeoverNote is not null) log.Warning("{Note}", runLock.TakeoverNote);
        foreach (var change in _resumeChanges)
            log.Information("config changed on resume: {Key} {Before} -> {After}", change.Key, change.Before ?? "(absent)", change.After ?? "(absent)");
        if (extendsFinishedRun)
        {
            log.Information("the run had finished; continuing it to the larger budget");
            File.Delete(_folder.SummaryPath);
        }
        if (File.Exists(_folder.FailedPath)) File.Delete(_folder.FailedPath);
        RefuseChangedConfigOnResume();
        AtomicFile.WriteAllText(_folder.ConfigPath, _spec.ToAnnotatedYaml());

        using var components = ExperimentComponents.Build(_spec);
        AtomicFile.WriteAllText(_folder.ResourcesPath, RunResources.ToJson(ExperimentInspection.Of(_spec, components)));
        var trainer = components.Trainer;
        byte[]? loopState = null;
        double? bestEvaluation = null;

        MetricsCsvWriter metrics;
        var newest = CheckpointStore.OpenNewestValid(_folder.CheckpointsDir, out var rejected);
        foreach (var reason in rejected) log.Warning("skipped checkpoint: {Reason}", reason);
        if (newest is not null)
        {
            using (newest)
            {
                trainer.Load(name => newest.GetSection(name));
                loopState = newest.ReadSectionBytes("loop").ToArray();
                if (newest.HasSection(SessionSection)) bestEvaluation = ReadSessionSection(newest.GetSection(SessionSection));
                log.Information("resumed from {Checkpoint} at step {Step}", newest.FilePath, trainer.Counters.EnvSteps);
            }
            metrics = File.Exists(_folder.MetricsPath)
                ? MetricsCsvWriter.OpenForResume(_folder.MetricsPath, trainer.Counters.MetricsRows)
                : throw new InvalidDataException($"{_folder.MetricsPath} is missing but checkpoints exist; cannot resume without duplicating or losing metrics rows");
        }
        else
        {
            metrics = MetricsCsvWriter.Create(_folder.MetricsPath);
            log.Information("started run {RunId}: {Trainer} on {Environment}, {Parameters} parameters", _runId, trainer.Kind, _spec.Environment.Kind, trainer.ParameterCount);
        }

        using (metrics)
        {
            // Progress lines also go to the JSON log (the console sink leaves them out: the reporter draws them there).
            var progressLog = log.ForContext(LogSetup.ProgressProperty, true);
            var progress = ProgressReporter.ForConsole(_spec.Logging.ProgressSeconds, _verbosity == Verbosity.Quiet,
                line => progressLog.Information("{Progress}", line));
            var sink = new RunFolderSink(this, metrics, runLock, log, progress, bestEvaluation);
            var loop = new TrainingLoop(trainer, components.Budget, new TrainingSchedule(_spec.Logging.MetricsEverySteps, _spec.Logging.CheckpointEverySteps), sink);
            if (loopState is not null) loop.LoadState(new BinaryReader(new MemoryStream(loopState)));
            TrainingOutcome outcome;
            try
            {
                outcome = loop.Run(cancel);
            }
            catch (Exception ex) when (ex is DivergenceException or ExternalEnvironmentException or NotSupportedException)
            {
                // The run stops where it is; checkpoints already written stay as they are (resume continues from the newest).
                // NotSupportedException: an environment that cannot save its state (a bridged child that is not deterministic).
                progress.Finish();
                log.Error("{Message}", ex.Message);
                WriteFailed(ex.Message);
                return ExitCodes.Failure;
            }
            progress.Finish();
            if (outcome == TrainingOutcome.Interrupted)
            {
                log.Warning("interrupted at step {Step}; checkpoint written; continue with: hybridrl resume {Dir}", trainer.Counters.EnvSteps, _folder.Root);
                return ExitCodes.Interrupted;
            }
            var summary = Summarise(components, sink.BestEvaluation);
            AtomicFile.WriteAllText(_folder.SummaryPath, summary.ToJson());
            log.Information("finished: final greedy return {Final:0.####} over {Episodes} episodes; best evaluation {Best:0.####}; {Steps} steps in {Seconds:0.0} s",
                summary.FinalReturn, summary.FinalEvalEpisodes, summary.BestReturn, summary.EnvSteps, summary.WallSeconds);
            _out.WriteLine($"summary: {_folder.SummaryPath}");
            return ExitCodes.Done;
        }
    }

    /// <summary>
    /// A folder with checkpoints is resumed with the config it was started with: a new spec (e.g. an edited base file behind a
    /// sweep or train call reusing a run id) may differ only in keys that are safe on resume, or the run stops with exit 2.
    /// </summary>
    private void RefuseChangedConfigOnResume()
    {
        if (!File.Exists(_folder.ConfigPath) || CheckpointStore.List(_folder.CheckpointsDir).Count == 0) return;
        var saved = ExperimentSpecLoader.Load([_folder.ConfigPath], [], new Dictionary<string, string>());
        var diff = SpecDiff.Compare(saved, _spec);
        if (diff.IsSafeForResume) return;
        var keys = string.Join(", ", diff.UnsafeDifferences.Select(d => $"{d.Key} ({d.Before} → {d.After})"));
        throw new ConfigException([new ConfigError("run", _folder.ConfigPath, null,
            $"'{_folder.Root}' holds checkpoints of a different config: {keys}; resume it unchanged or start a new run (another run id)")]);
    }

    /// <summary>Whether the budget of this session's spec goes beyond the counters of the newest valid checkpoint (a finished run given a larger budget).</summary>
    private bool BudgetExceedsNewestCheckpoint()
    {
        using var newest = CheckpointStore.OpenNewestValid(_folder.CheckpointsDir, out _);
        if (newest is null || !newest.HasSection(CheckpointSections.Counters)) return false;
        var counters = new TrainingCounters();
        using (var r = newest.GetSection(CheckpointSections.Counters)) counters.Load(r);
        var b = _spec.Experiment.Budget;
        var budget = new TrainingBudget(b.EnvSteps, b.Episodes, b.Generations, b.CircuitExecutions, b.WallSeconds);
        return !budget.IsUnlimited && budget.ReachedBy(counters) is null;
    }

    /// <summary>
    /// Checkpoint section with the session's own state: the best periodic evaluation seen so far (from the
    /// metrics rows), so that summary.json's best_return after a resume equals an uninterrupted run's.
    /// </summary>
    public const string SessionSection = "session";

    private static void WriteSessionSection(BinaryWriter w, double? best)
    {
        w.Write(best.HasValue);
        w.Write(best ?? 0);
    }

    private static double? ReadSessionSection(BinaryReader r)
    {
        using (r)
        {
            bool has = r.ReadBoolean();
            double v = r.ReadDouble();
            return has ? v : null;
        }
    }

    private RunSummary Summarise(ExperimentComponents components, double? bestEvaluation)
    {
        var trainer = components.Trainer;
        int finalEpisodes = _spec.Logging.FinalEvalEpisodes;
        double? final = finalEpisodes > 0 ? components.EvaluateFinal(finalEpisodes) : trainer.LatestEvaluation;
        var c = trainer.Counters;
        double shotsPerExecution = ShotsPerExecution(_spec);
        var ledger = new Dictionary<string, object?>
        {
            ["circuit_executions"] = c.CircuitExecutions,
            ["shots"] = c.Shots,
            ["hardware_executions"] = c.HardwareExecutions,
            ["shots_per_execution"] = shotsPerExecution,
            ["hardware_shots"] = c.HardwareExecutions * shotsPerExecution,
        };
        if (_spec.Hardware is { } hw)
        {
            var profile = new HardwareProfile(hw.Name, hw.Note, hw.SecondsPerShot, hw.PerCircuitOverheadSeconds, hw.CircuitsPerJob, hw.QueueLatencySeconds, hw.PricePerShot);
            var estimate = new HardwareLedger(c.CircuitExecutions, c.Shots, c.HardwareExecutions, shotsPerExecution).Estimate(profile);
            ledger["profile"] = hw.Name;
            ledger["estimated_device_seconds"] = estimate.ShotSeconds + estimate.OverheadSeconds + estimate.QueueSeconds;
            ledger["estimated_cost"] = estimate.Cost;
            ledger["note"] = HardwareLedger.Disclaimer;
        }
        return new RunSummary
        {
            RunId = _runId,
            Name = _name,
            Trainer = trainer.Kind,
            StoppedBy = components.Budget.ReachedBy(c),
            FinalReturn = final,
            FinalEvalEpisodes = finalEpisodes,
            BestReturn = Max(bestEvaluation, final),
            EnvSteps = c.EnvSteps,
            Episodes = c.Episodes,
            Updates = c.Updates,
            Generations = c.Generations,
            CircuitExecutions = c.CircuitExecutions,
            Shots = c.Shots,
            HardwareExecutions = c.HardwareExecutions,
            WallSeconds = c.WallSeconds,
            ParameterCount = trainer.ParameterCount,
            ParameterCounts = components.ParameterCounts,
            ConfigHash = _spec.Hash(),
            Ledger = ledger,
        };
    }

    /// <summary>
    /// Shots a device would spend per circuit execution: the configured shot count, or 1000 when the
    /// simulation is exact (common practice for estimating an expectation to about ±0.03).
    /// </summary>
    public static double ShotsPerExecution(ExperimentSpec spec) =>
        spec.Model.Simulation is { Shots: > 0 } sim ? sim.Shots : 1000;

    private static double? Max(double? a, double? b) => a is null ? b : b is null ? a : Math.Max(a.Value, b.Value);

    private void WriteFailed(string message) =>
        AtomicFile.WriteAllText(_folder.FailedPath, JsonSerializer.Serialize(new Dictionary<string, object> { ["status"] = "failed", ["message"] = message, ["time"] = DateTime.UtcNow.ToString("O") }, RunSummary.Json));

    /// <summary>Writes metrics rows and checkpoints into the run folder.</summary>
    private sealed class RunFolderSink(TrainingSession session, MetricsCsvWriter metrics, RunLock runLock, ILogger log, ProgressReporter progress, double? bestEvaluation) : ITrainingSink
    {
        public double? BestEvaluation { get; private set; } = bestEvaluation;

        public void OnMetrics(MetricsRow row, long rowIndex)
        {
            metrics.Append(row);
            log.Debug("metrics {@Row}", row);
            if (row.EvalReturn is double e && (BestEvaluation is null || e > BestEvaluation)) BestEvaluation = e;
        }

        public void OnCheckpoint(ITrainer trainer, Action<BinaryWriter> loop, double? score)
        {
            metrics.FlushToDisk();
            string path = RunCheckpoint.Save(trainer, loop, session._spec, session._folder.CheckpointsDir, score,
                (SessionSection, w => WriteSessionSection(w, BestEvaluation)));
            runLock.Touch();
            log.Debug("checkpoint {Path}", path);
        }

        public void OnProgress(ITrainer trainer, double fraction) => progress.Update(trainer, fraction);
    }
}
