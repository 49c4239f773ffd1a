using System.Diagnostics;
using System.Globalization;
using HybridRL.Training;

namespace HybridRL.Experiments;

/// <summary>
/// Shows training progress: a live bar on a terminal (steps, episodes, recent return, ε or σ,
/// steps/s, ETA), or one plain line every N seconds when output goes to a batch log.
/// Writes to standard error so standard output stays clean for results.
/// </summary>
public sealed class ProgressReporter
{
    private readonly TextWriter _out;
    private readonly bool _live;
    private readonly double _plainEverySeconds;
    private readonly Stopwatch _clock = Stopwatch.StartNew();
    private double _lastDraw = double.NegativeInfinity;
    private double _lastRecord = double.NegativeInfinity;
    private long _stepsAtStart = -1;
    private double _secondsAtStart;
    private bool _drewLive;

    public ProgressReporter(TextWriter output, bool liveTerminal, double plainEverySeconds)
    {
        _out = output;
        _live = liveTerminal;
        _plainEverySeconds = plainEverySeconds;
    }

    /// <summary>A reporter for this process's standard error: live bar when it is a terminal.</summary>
    public static ProgressReporter ForConsole(double plainEverySeconds, bool quiet, Action<string>? record = null) =>
        new(quiet ? TextWriter.Null : Console.Error, !Console.IsErrorRedirected, plainEverySeconds) { Record = record };

    /// <summary>
    /// Called with each progress line's text at most every <c>plainEverySeconds</c> (and on forced updates), live bar or
    /// not, so the run's JSON log records the same events as a batch log; null: not recorded.
    /// </summary>
    public Action<string>? Record { get; init; }

    public void Update(ITrainer trainer, double progress, bool force = false)
    {
        if (!_live && _plainEverySeconds <= 0) return; // logging.progress_seconds: 0 means no plain progress lines
        double now = _clock.Elapsed.TotalSeconds;
        double every = _live ? 0.25 : _plainEverySeconds;
        bool draw = force || now - _lastDraw >= every;
        bool record = Record is not null && _plainEverySeconds > 0 && (force || now - _lastRecord >= _plainEverySeconds);
        if (!draw && !record) return;
        var c = trainer.Counters;
        if (_stepsAtStart < 0) (_stepsAtStart, _secondsAtStart) = (c.EnvSteps, now);
        // Steps since the first report of this process (a resumed run counts from the resume); "-" until some are done.
        string rate = now > _secondsAtStart && c.EnvSteps > _stepsAtStart
            ? ((c.EnvSteps - _stepsAtStart) / (now - _secondsAtStart)).ToString("0", CultureInfo.InvariantCulture) : "-";
        var row = trainer.Metrics(MetricsRow.FromCounters(c, trainer.ParameterCount));
        string ret = row.TrainReturn is double r ? r.ToString("0.###", CultureInfo.InvariantCulture) : "-";
        string eval = row.EvalReturn is double e ? e.ToString("0.###", CultureInfo.InvariantCulture) : "-";
        string explore = row.Epsilon is double eps ? $"ε {eps:0.000}" : row.Sigma is double s ? $"σ {s:0.0000}" : "";
        double elapsedFraction = progress;
        string eta = elapsedFraction > 0.001 && elapsedFraction < 1 ? FormatSeconds(now / elapsedFraction * (1 - elapsedFraction)) : "-";
        string text = string.Create(CultureInfo.InvariantCulture,
            $"steps {c.EnvSteps} | episodes {c.Episodes}{(c.Generations > 0 ? $" | gen {c.Generations}" : "")} | return {ret} | eval {eval} | {explore} | {rate} steps/s | ETA {eta}");
        string plain = string.Create(CultureInfo.InvariantCulture, $"progress {progress * 100:0.0}% {text}");
        if (record)
        {
            _lastRecord = now;
            Record!(plain);
        }
        if (!draw) return;
        _lastDraw = now;
        if (_live)
        {
            const int width = 24;
            int filled = (int)Math.Round(progress * width);
            _out.Write($"\r[{new string('#', filled)}{new string('.', width - filled)}] {progress * 100,5:0.0}% {text}\u001b[K");
            _drewLive = true;
        }
        else
        {
            _out.WriteLine(plain);
        }
        _out.Flush();
    }

    /// <summary>Ends the live line so following output starts on a fresh line.</summary>
    public void Finish()
    {
        if (_live && _drewLive) _out.WriteLine();
        _out.Flush();
    }

    private static string FormatSeconds(double s) =>
        s >= 3600 ? $"{(int)(s / 3600)}h{(int)(s % 3600 / 60):00}m" : s >= 60 ? $"{(int)(s / 60)}m{(int)(s % 60):00}s" : $"{s:0}s";
}
