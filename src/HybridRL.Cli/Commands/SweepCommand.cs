using System.CommandLine;
using HybridRL.Experiments;
using HybridRL.Experiments.Executors;
using HybridRL.Experiments.Sweeps;

namespace HybridRL.Cli.Commands;

/// <summary>`hybridrl sweep plan|run|submit|task|status FILE`: expand a sweep file and run it on local cores or a Slurm job array.</summary>
public static class SweepCommand
{
    public static Command Create()
    {
        var command = new Command("sweep", "Expand a sweep file (grid, zip, random samples, seeds over a base experiment) and run it locally or on Slurm. See docs/slurm.md.");
        command.Subcommands.Add(Plan());
        command.Subcommands.Add(Run());
        command.Subcommands.Add(Submit());
        command.Subcommands.Add(Task());
        command.Subcommands.Add(Status());
        return command;
    }

    private static Argument<string> FileArgument() => new("file") { Description = "The sweep file (YAML)." };

    private static Command Plan()
    {
        var file = FileArgument();
        var command = new Command("plan", "List the runs (index, id, overrides) and the total budget; every run's config is loaded and validated.") { file };
        command.SetAction(result =>
        {
            var plan = SweepPlan.Load(result.GetValue(file)!);
            var budget = new SpecBudgetResolver(plan.BasePath, ConfigOptions.EnvironmentVariables());
            Console.Write(SweepPlanTable.Format(plan, budget.Resolve));
            return ExitCodes.Done;
        });
        return command;
    }

    private static Command Run()
    {
        var file = FileArgument();
        var jobs = new Option<int>("--jobs", "-j") { Description = "Runs at a time (default: the number of cores).", DefaultValueFactory = _ => Environment.ProcessorCount };
        var command = new Command("run", "Run the sweep's unfinished runs as child processes on this machine, N at a time. Ctrl+C or SIGTERM stops them at a checkpoint (exit 3); run again to resume.")
        {
            file, jobs,
        };
        command.SetAction(result =>
        {
            int n = result.GetValue(jobs);
            if (n < 1) throw new SweepFileException($"--jobs must be at least 1, got {n}") { Key = "--jobs" };
            var plan = SweepPlan.Load(result.GetValue(file)!);
            using var signals = new InterruptSignals();
            var executor = new LocalSweepExecutor(HybridRLTaskCommand.FromCurrentProcess(), Console.Out);
            var report = executor.RunAsync(plan, new LocalRunOptions { Jobs = n }, signals.Token).GetAwaiter().GetResult();
            Console.Write(SweepStatusReader.Format(SweepStatusReader.Read(plan, null)));
            return report.ExitCode;
        });
        return command;
    }

    private static Command Submit()
    {
        var file = FileArgument();
        var partition = new Option<string?>("--partition") { Description = "Slurm partition (default: the cluster's default)." };
        var time = new Option<string?>("--time") { Description = "Time limit per task in Slurm's format, e.g. 4:00:00 (default: the partition's)." };
        var maxParallel = new Option<int?>("--max-parallel") { Description = "At most this many array tasks at once." };
        var dryRun = new Option<bool>("--dry-run") { Description = "Print the batch script without writing or submitting it." };
        var command = new Command("submit", "Submit the runs not yet done as a Slurm job array. Each task checkpoints on USR1/TERM and requeues itself.")
        {
            file, partition, time, maxParallel, dryRun,
        };
        command.SetAction(result =>
        {
            var plan = SweepPlan.Load(result.GetValue(file)!);
            var options = new SlurmSubmitOptions
            {
                Partition = result.GetValue(partition),
                Time = result.GetValue(time),
                MaxParallel = result.GetValue(maxParallel),
            };
            if (options.MaxParallel is < 1) throw new SweepFileException($"--max-parallel must be at least 1, got {options.MaxParallel}") { Key = "--max-parallel" };
            bool dry = result.GetValue(dryRun);
            var submission = new SlurmSubmitter(HybridRLTaskCommand.FromCurrentProcess()).Submit(plan, options, dry);
            if (submission.Indices.Count == 0)
            {
                Console.WriteLine($"sweep {plan.Name}: nothing to submit (every run is done or running)");
                return ExitCodes.Done;
            }
            if (dry)
            {
                Console.Write(submission.Script);
                return ExitCodes.Done;
            }
            Console.WriteLine($"submitted job {submission.JobId}: {submission.Indices.Count} of {plan.Runs.Count} runs; script {submission.ScriptPath}");
            Console.WriteLine($"output: {Path.Combine(plan.SweepDir, SlurmBatchScript.OutputPattern)}; follow with: hybridrl sweep status {plan.SweepFile}");
            return ExitCodes.Done;
        });
        return command;
    }

    private static Command Task()
    {
        var file = FileArgument();
        var index = new Option<int?>("--index") { Description = "Run index (default: SLURM_ARRAY_TASK_ID)." };
        var command = new Command("task", "Train (or resume) one run of the sweep; this is what 'sweep run' and the Slurm array tasks execute.")
        {
            file, index,
        };
        command.SetAction(result =>
        {
            var plan = SweepPlan.Load(result.GetValue(file)!);
            int i = SweepTaskRunner.ResolveIndex(result.GetValue(index));
            using var signals = new InterruptSignals();
            var task = new SessionTrainTask(GlobalOptions.VerbosityOf(result), Console.Out, ConfigOptions.EnvironmentVariables());
            return SweepTaskRunner.Run(plan, i, task, signals.Token, Console.Out);
        });
        return command;
    }

    private static Command Status()
    {
        var file = FileArgument();
        var command = new Command("status", "State of every run (pending, running, interrupted, failed, done) from its run folder, with the Slurm state of this sweep's array tasks.")
        {
            file,
        };
        command.SetAction(result =>
        {
            var plan = SweepPlan.Load(result.GetValue(file)!);
            Console.Write(SweepStatusReader.Format(SweepStatusReader.Read(plan, SlurmQueue.Query())));
            return ExitCodes.Done;
        });
        return command;
    }
}
