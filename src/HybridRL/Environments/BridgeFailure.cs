namespace HybridRL.Environments;

/// <summary>What went wrong with an external (bridged) environment.</summary>
public enum BridgeFailure
{
    /// <summary>The command could not be started.</summary>
    StartFailed,
    /// <summary>The child exited or closed its output.</summary>
    Crashed,
    /// <summary>No reply within the configured timeout (the child is killed).</summary>
    TimedOut,
    /// <summary>A reply was not valid JSON or lacked a required field.</summary>
    MalformedMessage,
    /// <summary>An observation had the wrong number of entries, or the handshake declared impossible sizes.</summary>
    WrongSize,
    /// <summary>The child replied with an <c>error</c> message.</summary>
    ChildError,
    /// <summary>Replaying the recorded seed and actions after a restore did not reproduce the saved observation.</summary>
    ReplayMismatch,
    /// <summary>The bridge is unusable after an earlier failure.</summary>
    Broken,
}
