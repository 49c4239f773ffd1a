namespace HybridRL.Experiments.Executors;

/// <summary>Runs an external command to completion and captures its output.</summary>
public interface ICommandRunner
{
    /// <summary>Runs <paramref name="program"/>; throws <see cref="ExecutorException"/> when it cannot be started or exceeds <paramref name="timeout"/>.</summary>
    CommandResult Run(string program, IReadOnlyList<string> arguments, TimeSpan timeout);

    /// <summary>Whether <paramref name="program"/> can be found on PATH (or is an existing path).</summary>
    bool IsAvailable(string program);
}
