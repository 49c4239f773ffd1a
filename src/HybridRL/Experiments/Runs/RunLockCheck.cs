namespace HybridRL.Experiments.Runs;

/// <summary>Result of inspecting an existing run.lock.</summary>
/// <param name="Held">True when the holder is alive (or cannot be proven dead).</param>
/// <param name="Holder">The parsed lock content, null when the file is missing or unreadable.</param>
/// <param name="Reason">Human-readable explanation naming pid and host.</param>
public sealed record RunLockCheck(bool Held, RunLockInfo? Holder, string Reason);
