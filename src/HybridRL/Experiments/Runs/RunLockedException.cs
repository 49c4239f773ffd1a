namespace HybridRL.Experiments.Runs;

/// <summary>The run folder is locked by a live (or not provably dead) process; the message names its pid and host.</summary>
public sealed class RunLockedException : Exception
{
    public RunLockedException(string lockPath, RunLockInfo? holder, string message) : base(message)
    {
        LockPath = lockPath;
        Holder = holder;
    }

    public string LockPath { get; }
    public RunLockInfo? Holder { get; }
}
