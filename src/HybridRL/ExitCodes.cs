namespace HybridRL;

/// <summary>Process exit codes of every HybridRL command.</summary>
public static class ExitCodes
{
    /// <summary>The command finished its work.</summary>
    public const int Done = 0;

    /// <summary>The command failed (a bug, an I/O problem, a diverged run).</summary>
    public const int Failure = 1;

    /// <summary>Invalid input: bad usage, a bad experiment or sweep file. Nothing was created.</summary>
    public const int InvalidInput = 2;

    /// <summary>Interrupted by a signal after a checkpoint was written; `hybridrl resume` continues.</summary>
    public const int Interrupted = 3;

    public const string Description =
        "Exit codes: 0 done, 1 failure, 2 invalid input (usage or config), 3 interrupted after a checkpoint was written (resumable).";
}
