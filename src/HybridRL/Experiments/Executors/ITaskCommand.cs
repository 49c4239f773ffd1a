namespace HybridRL.Experiments.Executors;

/// <summary>
/// The command line that runs one sweep task, as an argument vector (first element: the program). Injected so that tests can run
/// stand-in commands and the application can run itself (<see cref="HybridRLTaskCommand"/>).
/// </summary>
public interface ITaskCommand
{
    /// <summary>Command for run <paramref name="index"/> of <paramref name="sweepFile"/>, run as a local child process.</summary>
    IReadOnlyList<string> ForIndex(string sweepFile, int index);

    /// <summary>Command for a Slurm array element: the task finds its index in <c>SLURM_ARRAY_TASK_ID</c>.</summary>
    IReadOnlyList<string> ForArrayTask(string sweepFile);
}
