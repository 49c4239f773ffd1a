namespace HybridRL.Environments;

/// <summary>A bridged environment failed; <see cref="Failure"/> says how. The message names the command and ends with the child's last stderr lines.</summary>
public sealed class ExternalEnvironmentException : Exception
{
    public ExternalEnvironmentException(BridgeFailure failure, string message) : base(message) => Failure = failure;

    public ExternalEnvironmentException(BridgeFailure failure, string message, Exception inner) : base(message, inner) => Failure = failure;

    public BridgeFailure Failure { get; }
}
