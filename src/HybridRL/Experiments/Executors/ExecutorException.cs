namespace HybridRL.Experiments.Executors;

/// <summary>An executor could not do its work (a command missing or failing, unexpected output); the message says which.</summary>
public sealed class ExecutorException(string message, Exception? inner = null) : Exception(message, inner);
