using System.Text;
using HybridRL.Checkpoints;
using HybridRL.Experiments.Config;
using HybridRL.Experiments.Runs;
using HybridRL.Native;
using HybridRL.Quantum.Randomness;
using HybridRL.Training;

namespace HybridRL.Experiments.Evaluation;

/// <summary>
/// Greedy evaluation of a finished (or stopped) run's agent, optionally under different simulation
/// settings (shots, noise, mode) — what <c>hybridrl eval RUN_DIR</c> does. The agent's flat parameters are
/// read from a checkpoint (section <c>model.online</c> for DQN, <c>model.center</c> for evolution: int32
/// count followed by the doubles). Episode seeds are the ones of the run's final evaluation
/// (root <c>final-evaluation</c>), so with unchanged settings and the final checkpoint the mean equals
/// summary.json's final_return.
/// </summary>
public static class RunEvaluator
{
    /// <summary>Whether <paramref name="key"/> may differ from the run's config in an evaluation: model.simulation.* and evaluation keys.</summary>
    public static bool MayChange(string key) =>
        key.StartsWith("model.simulation.", StringComparison.Ordinal)
        || key == "logging.final_eval_episodes"
        || (key.StartsWith("trainer.", StringComparison.Ordinal) && key[(key.LastIndexOf('.') + 1)..].StartsWith("eval_", StringComparison.Ordinal));

    /// <summary>Evaluates and writes <c>eval-&lt;label&gt;.json</c> atomically into the run folder; returns the result and the file path.</summary>
    public static (EvaluationResult Result, string Path) EvaluateAndWrite(string runDir, IReadOnlyList<string> setOverrides, CheckpointChoice choice,
        int? episodes = null, string? label = null)
    {
        var result = Evaluate(runDir, setOverrides, choice, episodes, label, out var folder);
        string path = folder.EvalPath(result.Label);
        AtomicFile.WriteAllText(path, result.ToJson());
        return (result, path);
    }

    /// <summary>Evaluates without writing anything.</summary>
    public static EvaluationResult Evaluate(string runDir, IReadOnlyList<string> setOverrides, CheckpointChoice choice, int? episodes, string? label, out RunFolder folder)
    {
        ArgumentNullException.ThrowIfNull(runDir);
        ArgumentNullException.ThrowIfNull(setOverrides);
        folder = new RunFolder(Path.GetFullPath(runDir));
        if (!File.Exists(folder.ConfigPath))
            throw new ConfigException([new ConfigError("run", folder.Root, null, $"'{folder.Root}' is not a run folder: it has no config.yaml")]);
        var noEnvironment = new Dictionary<string, string>();
        var saved = ExperimentSpecLoader.Load([folder.ConfigPath], [], noEnvironment);
        var spec = setOverrides.Count == 0 ? saved : ExperimentSpecLoader.Load([folder.ConfigPath], setOverrides, noEnvironment);
        var diff = SpecDiff.Compare(saved, spec);
        var refused = diff.Differences.Where(d => !MayChange(d.Key)).ToList();
        if (refused.Count > 0)
            throw new ConfigException(refused.Select(d => new ConfigError(d.Key, "--set", null,
                $"cannot be changed for an evaluation ({d.Before ?? "(absent)"} → {d.After ?? "(absent)"}); only model.simulation.* and evaluation keys may differ from the run's config.yaml")).ToList());
        if (episodes is <= 0)
            throw new ConfigException([new ConfigError("--episodes", null, null, $"--episodes = {episodes} must be positive")]);
        if (label is not null && !RunId.IsSafeSegment(label))
            throw new ConfigException([new ConfigError("--label", null, null, $"--label '{label}' may hold only letters, digits, '.', '_' and '-'")]);

        (string checkpointPath, string? note) = ChooseCheckpoint(folder, choice);
        TorchRuntime.EnsureLoaded();
        using var components = ExperimentComponents.Describe(spec);
        using var model = components.CreateModel();
        var parameters = new double[model.ParameterCount];
        string section;
        long step;
        using (var reader = CheckpointReader.Open(checkpointPath))
        {
            section = reader.HasSection("model.online") ? "model.online"
                : reader.HasSection("model.center") ? "model.center"
                : throw new InvalidDataException($"checkpoint '{checkpointPath}' has neither a 'model.online' nor a 'model.center' section");
            using var r = reader.GetSection(section);
            int n = r.ReadInt32();
            if (n != parameters.Length)
                throw new InvalidDataException($"checkpoint '{checkpointPath}' section '{section}' holds {n} parameters where the model of this run has {parameters.Length}");
            r.BaseStream.ReadExactly(System.Runtime.InteropServices.MemoryMarshal.AsBytes(parameters.AsSpan()));
            step = reader.Header.Step;
        }
        model.SetFlat(parameters);

        int count = episodes ?? DefaultEpisodes(spec);
        var returns = new double[count];
        var evaluator = new GreedyEvaluator(components.CreateEnvironment(), count, RandomStream.SeedFor(spec.Experiment.Seed, "final-evaluation", 0));
        double mean = evaluator.Evaluate(model, returns, out long steps);
        double ss = 0;
        foreach (var x in returns) ss += (x - mean) * (x - mean);
        var changed = diff.Differences.ToDictionary(d => d.Key, d => new ChangedSetting(d.Before, d.After), StringComparer.Ordinal);
        return new EvaluationResult
        {
            Label = label ?? DefaultLabel(choice, diff),
            RunId = Path.GetFileName(folder.Root),
            Checkpoint = choice == CheckpointChoice.Best ? "best" : "latest",
            CheckpointFile = Path.GetFileName(checkpointPath),
            CheckpointStep = step,
            CheckpointNote = note,
            ParameterSection = section,
            Episodes = count,
            Mean = mean,
            Std = count > 1 ? Math.Sqrt(ss / (count - 1)) : 0,
            Min = returns.Min(),
            Max = returns.Max(),
            Returns = returns,
            EnvSteps = steps,
            CircuitExecutions = model.Counters?.CircuitExecutions ?? 0,
            Shots = model.Counters?.Shots ?? 0,
            SettingsChanged = changed,
            ConfigHash = spec.Hash(),
            EpisodeSeeds = "final-evaluation (same episodes as the run's final evaluation)",
        };
    }

    /// <summary>logging.final_eval_episodes when positive, else the trainer's eval_episodes.</summary>
    public static int DefaultEpisodes(ExperimentSpec spec)
    {
        if (spec.Logging.FinalEvalEpisodes > 0) return spec.Logging.FinalEvalEpisodes;
        var t = spec.Trainer;
        return t.Dqn?.EvalEpisodes ?? t.Genetic?.EvalEpisodes ?? t.EvolutionStrategies?.EvalEpisodes ?? t.CmaEs?.EvalEpisodes ?? 20;
    }

    /// <summary>"best" / "latest", followed by each changed key's last part and its new value (e.g. best-shots-100).</summary>
    public static string DefaultLabel(CheckpointChoice choice, SpecDiff diff)
    {
        var sb = new StringBuilder(choice == CheckpointChoice.Best ? "best" : "latest");
        foreach (var d in diff.Differences)
        {
            sb.Append('-').Append(Safe(d.Key[(d.Key.LastIndexOf('.') + 1)..])).Append('-').Append(Safe(d.After ?? "none"));
        }
        string s = sb.ToString();
        return s.Length <= 200 ? s : s[..200];
    }

    private static string Safe(string text)
    {
        var sb = new StringBuilder(text.Length);
        foreach (char c in text) sb.Append(char.IsAsciiLetterOrDigit(c) || c is '.' or '_' ? c : '_');
        return sb.ToString();
    }

    private static (string Path, string? Note) ChooseCheckpoint(RunFolder folder, CheckpointChoice choice)
    {
        string dir = folder.CheckpointsDir;
        if (choice == CheckpointChoice.Best && CheckpointStore.ReadBestPointer(dir) is { } best)
        {
            string path = Path.Combine(dir, best.FileName);
            if (File.Exists(path)) return (path, null);
            string? fallback = CheckpointStore.FindNewestValid(dir, out _);
            if (fallback is null) throw NoCheckpoint(folder);
            return (fallback, $"the best pointer names '{best.FileName}', which is missing; used the newest valid checkpoint");
        }
        string? newest = CheckpointStore.FindNewestValid(dir, out var rejected);
        if (newest is null) throw NoCheckpoint(folder, rejected);
        string? note = choice == CheckpointChoice.Best
            ? "no best checkpoint is recorded (no periodic evaluation ran before a checkpoint); used the newest valid checkpoint"
            : null;
        return (newest, note);
    }

    private static ConfigException NoCheckpoint(RunFolder folder, IReadOnlyList<string>? rejected = null) =>
        new([new ConfigError("run", folder.Root, null,
            $"run folder '{folder.Root}' has no valid checkpoint to evaluate{(rejected is { Count: > 0 } ? ": " + string.Join("; ", rejected) : "")}")]);
}
