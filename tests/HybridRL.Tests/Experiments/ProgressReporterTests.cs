using System.Globalization;
using System.Text.RegularExpressions;
using HybridRL.Experiments;
using HybridRL.Native;
using HybridRL.Tests.Training.Grid;
using HybridRL.Training;

namespace HybridRL.Tests.Experiments;

/// <summary>
/// Plain progress lines (batch logs) written by <see cref="ProgressReporter"/> into a <see cref="StringWriter"/> while a real,
/// tiny deep-Q trainer (built in memory through <see cref="ExperimentComponents"/>) runs unit by unit. Only forced lines,
/// the first line (always drawn) and an interval of an hour are used, so nothing depends on machine speed.
/// </summary>
public sealed class ProgressReporterTests
{
    // 40 environment steps; ε decays linearly from 1 to 0 over 100 steps; episodes cut after 5 moves; a greedy
    // evaluation every 20 steps. Slippery warehouse on the built-in invented dock-3x4 floor.
    private const string Yaml = """
        experiment:
          name: progress
          seed: 5
          budget:
            env_steps: 40
        environment:
          kind: slippery-warehouse
          map: dock-3x4
          observation: binary
          slip_probability: 0.2
          step_cost: 0.01
          max_steps: 5
        model:
          circuit:
            qubits: 4
            layers: 1
            encoding: angle
            readout: per_action
          simulation:
            mode: exact
            gradient: adjoint
        trainer:
          kind: dqn
          dqn:
            replay_capacity: 40
            warmup_steps: 8
            batch_size: 4
            epsilon_start: 1
            epsilon_end: 0
            epsilon_decay: linear
            epsilon_decay_steps: 100
            eval_every: 20
            eval_episodes: 1
        """;

    private const string Eta = @"ETA (-|\d+s|\d+m\d\ds|\d+h\d\dm)";

    private static ExperimentComponents Build()
    {
        TorchRuntime.EnsureLoaded();
        return ExperimentComponents.Build(GridTraining.Spec(Yaml));
    }

    private static void RunUnits(ExperimentComponents c, int units)
    {
        for (int i = 0; i < units; i++) c.Trainer.RunUnit(c.Budget);
    }

    private static void Report(ProgressReporter reporter, ExperimentComponents c, bool force) =>
        reporter.Update(c.Trainer, c.Budget.Progress(c.Trainer.Counters), force);

    private static string[] Lines(StringWriter w) => w.ToString().Split(w.NewLine, StringSplitOptions.RemoveEmptyEntries);

    private static string Format(double? value) => value is double v ? v.ToString("0.###", CultureInfo.InvariantCulture) : "-";

    [Fact]
    public void Plain_lines_show_progress_counters_returns_epsilon_rate_and_eta()
    {
        using var c = Build();
        var w = new StringWriter();
        var reporter = new ProgressReporter(w, liveTerminal: false, plainEverySeconds: 0.001);

        RunUnits(c, 10);
        Report(reporter, c, force: true);
        var first = Assert.Single(Lines(w));
        // 10 of 40 steps = 25.0%; ε is set before each step from the step count: after 10 steps ε = At(9) = 1 - 9/100 = 0.91
        // (ExplorationSchedule, linear); the first line has no earlier report to measure a rate from, so "-".
        var m = Regex.Match(first, @"^progress 25\.0% steps 10 \| episodes (\d+) \| return (\S+) \| eval - \| ε 0\.910 \| - steps/s \| " + Eta + "$");
        Assert.True(m.Success, first);
        long episodes = c.Trainer.Counters.Episodes;
        Assert.Equal(episodes.ToString(CultureInfo.InvariantCulture), m.Groups[1].Value);
        Assert.True(episodes >= 2, $"{episodes} episodes"); // max_steps 5 cuts an episode after at most 5 moves: 10 steps end at least 2
        var row = c.Trainer.Metrics(MetricsRow.FromCounters(c.Trainer.Counters, c.Trainer.ParameterCount));
        Assert.NotNull(row.TrainReturn); // episodes have ended, so the recent return is known
        Assert.Equal(Format(row.TrainReturn), m.Groups[2].Value);
        Assert.Null(c.Trainer.LatestEvaluation); // eval_every 20: none yet, printed as "-"

        RunUnits(c, 10);
        Report(reporter, c, force: true);
        var lines = Lines(w);
        Assert.Equal(2, lines.Length);
        // 20 of 40 = 50.0%; ε = At(19) = 1 - 19/100 = 0.81; eval_every 20 made the first greedy evaluation at step 20;
        // the rate is now measured (10 steps since the first report), a whole number of steps per second.
        m = Regex.Match(lines[1], @"^progress 50\.0% steps 20 \| episodes (\d+) \| return (\S+) \| eval (\S+) \| ε 0\.810 \| (\d+) steps/s \| " + Eta + "$");
        Assert.True(m.Success, lines[1]);
        Assert.Equal(c.Trainer.Counters.Episodes.ToString(CultureInfo.InvariantCulture), m.Groups[1].Value);
        Assert.NotNull(c.Trainer.LatestEvaluation);
        Assert.Equal(Format(c.Trainer.LatestEvaluation), m.Groups[3].Value);
    }

    [Fact]
    public void Zero_seconds_between_plain_lines_writes_nothing_even_when_forced()
    {
        using var c = Build();
        var w = new StringWriter();
        var reporter = new ProgressReporter(w, liveTerminal: false, plainEverySeconds: 0); // logging.progress_seconds: 0 = none
        Report(reporter, c, force: false);
        RunUnits(c, 5);
        Report(reporter, c, force: false);
        Report(reporter, c, force: true);
        reporter.Finish();
        Assert.Equal("", w.ToString());
    }

    [Fact]
    public void Force_writes_a_line_inside_the_interval_and_an_unforced_update_does_not()
    {
        using var c = Build();
        var w = new StringWriter();
        var reporter = new ProgressReporter(w, liveTerminal: false, plainEverySeconds: 3600);

        RunUnits(c, 4);
        Report(reporter, c, force: false); // the first update always draws (no earlier line)
        Assert.Single(Lines(w));
        RunUnits(c, 4);
        Report(reporter, c, force: false); // within the hour: skipped
        Assert.Single(Lines(w));
        Report(reporter, c, force: true);
        var lines = Lines(w);
        Assert.Equal(2, lines.Length);
        Assert.StartsWith("progress 10.0% steps 4 | ", lines[0], StringComparison.Ordinal); // 4 of 40 steps
        Assert.Contains(" | - steps/s | ", lines[0], StringComparison.Ordinal);
        Assert.StartsWith("progress 20.0% steps 8 | ", lines[1], StringComparison.Ordinal); // 8 of 40 steps
        Assert.Matches(@" \| \d+ steps/s \| " + Eta + "$", lines[1]);
        reporter.Finish(); // plain lines end themselves; Finish adds nothing
        Assert.Equal(2, Lines(w).Length);
        Assert.EndsWith(w.NewLine, w.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Recorded_lines_follow_the_plain_interval_also_under_a_live_bar()
    {
        using var c = Build();
        var w = new StringWriter();
        var recorded = new List<string>();
        var reporter = new ProgressReporter(w, liveTerminal: true, plainEverySeconds: 3600) { Record = recorded.Add };
        RunUnits(c, 4);
        Report(reporter, c, force: false); // first update: bar drawn and line recorded
        RunUnits(c, 4);
        Report(reporter, c, force: false); // within the hour: not recorded again (the bar may redraw)
        Assert.Single(recorded);
        Report(reporter, c, force: true);
        Assert.Equal(2, recorded.Count);
        // the recorded text is the plain line, whatever the console shows
        Assert.StartsWith("progress 10.0% steps 4 | ", recorded[0], StringComparison.Ordinal);
        Assert.StartsWith("progress 20.0% steps 8 | ", recorded[1], StringComparison.Ordinal);
        Assert.Contains("\r[", w.ToString()); // the console got the live bar
        var none = new List<string>();
        Report(new ProgressReporter(new StringWriter(), liveTerminal: true, plainEverySeconds: 0) { Record = none.Add }, c, force: true);
        Assert.Empty(none); // logging.progress_seconds 0: no progress events in the log either
    }
}
