using System.Diagnostics;
using System.Globalization;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Experiments.Executors;

/// <summary>
/// <c>sweep run</c>: runs a sweep's tasks as child processes, <see cref="LocalRunOptions.Jobs"/> at a time, in run order.
/// Finished runs are skipped, runs locked by a live process are left alone, every other run is started (the task resumes
/// partial runs itself). When the token is cancelled no new child starts and each running child gets
/// <see cref="LocalRunOptions.StopSignal"/> (they checkpoint and exit 3); the executor then waits for them.
/// </summary>
public sealed class LocalSweepExecutor(ITaskCommand command, TextWriter? progress = null)
{
    /// <summary>Environment variable set for each child: its run index.</summary>
    public const string IndexVariable = "HYBRIDRL_SWEEP_INDEX";

    /// <summary>Environment variable set for each child: its run id.</summary>
    public const string RunIdVariable = "HYBRIDRL_SWEEP_RUN_ID";

    private readonly object _gate = new();

    public async Task<LocalSweepReport> RunAsync(SweepPlan plan, LocalRunOptions options, CancellationToken ct)
    {
        if (options.Jobs < 1) throw new ArgumentOutOfRangeException(nameof(options), options.Jobs, "jobs must be at least 1");
        string logDir = options.LogDir ?? Path.Combine(plan.SweepDir, "logs");
        Directory.CreateDirectory(logDir);

        var outcomes = new LocalRunOutcome?[plan.Runs.Count];
        var queue = new Queue<SweepRun>();
        foreach (var run in plan.Runs)
        {
            if (options.Indices is { } only && !only.Contains(run.Index)) continue;
            var status = RunFolderInspector.Inspect(plan.RunDir(run));
            if (status.State == RunFolderState.Done)
                outcomes[run.Index] = new LocalRunOutcome(run.Index, run.Id, LocalRunResult.SkippedDone, null, TimeSpan.Zero);
            else if (status.State == RunFolderState.Running)
            {
                outcomes[run.Index] = new LocalRunOutcome(run.Index, run.Id, LocalRunResult.SkippedRunning, null, TimeSpan.Zero);
                Say($"run {run.Index} ({run.Id}) skipped: running ({status.Detail})");
            }
            else queue.Enqueue(run);
        }
        int skippedDone = outcomes.Count(o => o?.Result == LocalRunResult.SkippedDone);
        Say($"sweep {plan.Name}: {queue.Count} to run, {skippedDone} already done, {options.Jobs} at a time");

        var active = new Dictionary<Task<LocalRunOutcome>, Process>();
        int peak = 0;
        bool stopSent = false;
        using var cancelled = new SemaphoreSlim(0);
        using var reg = ct.Register(() => cancelled.Release());
        Task cancelTask = cancelled.WaitAsync(CancellationToken.None);

        while (true)
        {
            while (!ct.IsCancellationRequested && active.Count < options.Jobs && queue.Count > 0)
            {
                var run = queue.Dequeue();
                var started = Start(plan, run, logDir);
                if (started.Process is null)
                {
                    outcomes[run.Index] = new LocalRunOutcome(run.Index, run.Id, LocalRunResult.Failed, null, TimeSpan.Zero);
                    continue;
                }
                active.Add(started.Completion!, started.Process);
                peak = Math.Max(peak, active.Count);
            }
            if (active.Count == 0) break;

            if (ct.IsCancellationRequested && !stopSent)
            {
                stopSent = true;
                Say($"stopping: sending signal {options.StopSignal} to {active.Count} running task(s)");
                foreach (var p in active.Values) TrySignal(p, options.StopSignal);
                if (options.StopGrace is { } grace) _ = KillAfter(active.Values.ToArray(), grace);
            }

            var waitOn = new List<Task>(active.Keys);
            if (!stopSent) waitOn.Add(cancelTask);
            var finished = await Task.WhenAny(waitOn).ConfigureAwait(false);
            if (finished is Task<LocalRunOutcome> done)
            {
                var outcome = await done.ConfigureAwait(false);
                active[done].Dispose();
                active.Remove(done);
                outcomes[outcome.Index] = outcome;
                Say($"run {outcome.Index} ({outcome.RunId}) exited {outcome.ExitCode}: {Describe(outcome.Result)} after {outcome.Elapsed.TotalSeconds.ToString("0.0", CultureInfo.InvariantCulture)} s");
            }
        }

        while (queue.Count > 0)
        {
            var run = queue.Dequeue();
            outcomes[run.Index] = new LocalRunOutcome(run.Index, run.Id, LocalRunResult.NotStarted, null, TimeSpan.Zero);
        }
        var list = outcomes.Where(o => o is not null).Select(o => o!).ToArray();
        return new LocalSweepReport(list, ct.IsCancellationRequested) { PeakConcurrency = peak };
    }

    private (Process? Process, Task<LocalRunOutcome>? Completion) Start(SweepPlan plan, SweepRun run, string logDir)
    {
        var argv = command.ForIndex(plan.SweepFile, run.Index);
        var psi = new ProcessStartInfo(argv[0])
        {
            UseShellExecute = false,
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
        };
        foreach (var a in argv.Skip(1)) psi.ArgumentList.Add(a);
        psi.Environment[IndexVariable] = run.Index.ToString(CultureInfo.InvariantCulture);
        psi.Environment[RunIdVariable] = run.Id;

        string logPath = Path.Combine(logDir, $"task-{run.Index}.out");
        var writer = new StreamWriter(new FileStream(logPath, FileMode.Append, FileAccess.Write, FileShare.ReadWrite)) { AutoFlush = true };
        var proc = new Process { StartInfo = psi, EnableRaisingEvents = true };
        var exited = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        proc.Exited += (_, _) => exited.TrySetResult();
        void Line(string? l) { if (l is not null) lock (writer) writer.WriteLine(l); }
        proc.OutputDataReceived += (_, e) => Line(e.Data);
        proc.ErrorDataReceived += (_, e) => Line(e.Data);
        var clock = Stopwatch.StartNew();
        try
        {
            proc.Start();
        }
        catch (Exception e) when (e is System.ComponentModel.Win32Exception or InvalidOperationException)
        {
            Say($"run {run.Index} ({run.Id}) could not start '{argv[0]}': {e.Message}");
            writer.Dispose();
            proc.Dispose();
            return (null, null);
        }
        proc.StandardInput.Close();
        proc.BeginOutputReadLine();
        proc.BeginErrorReadLine();
        Say($"run {run.Index} ({run.Id}) started, pid {proc.Id}, log {logPath}");

        async Task<LocalRunOutcome> Complete()
        {
            await exited.Task.ConfigureAwait(false);
            proc.WaitForExit(); // drains the redirected streams
            int code = proc.ExitCode;
            lock (writer) writer.Dispose();
            var result = code switch { 0 => LocalRunResult.Done, 3 => LocalRunResult.Interrupted, _ => LocalRunResult.Failed };
            return new LocalRunOutcome(run.Index, run.Id, result, code, clock.Elapsed);
        }
        return (proc, Complete());
    }

    private static void TrySignal(Process p, int signal)
    {
        try
        {
            if (!p.HasExited) ProcessSignals.Send(p.Id, signal);
        }
        catch (InvalidOperationException) { }
    }

    private static async Task KillAfter(Process[] processes, TimeSpan grace)
    {
        await Task.Delay(grace).ConfigureAwait(false);
        foreach (var p in processes)
        {
            try { if (!p.HasExited) p.Kill(entireProcessTree: true); }
            catch (InvalidOperationException) { }
        }
    }

    private static string Describe(LocalRunResult r) => r switch
    {
        LocalRunResult.Done => "done",
        LocalRunResult.Interrupted => "interrupted (resumable)",
        _ => "failed",
    };

    private void Say(string line)
    {
        if (progress is null) return;
        lock (_gate) progress.WriteLine(line);
    }
}
