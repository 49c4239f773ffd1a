namespace HybridRL.Native;

/// <summary>The native tensor library cannot be loaded on this machine; the message says what is missing and how to fix it.</summary>
public sealed class TorchUnavailableException(string message) : Exception(message);
