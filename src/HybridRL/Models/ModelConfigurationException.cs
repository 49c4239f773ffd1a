namespace HybridRL.Models;

/// <summary>
/// A model configuration that cannot be built. <see cref="Keys"/> lists the configuration keys the user
/// can change to fix it (e.g. <c>model.compressor.kind</c>); the message names them too.
/// </summary>
public sealed class ModelConfigurationException : ArgumentException
{
    public ModelConfigurationException(string message, params string[] keys)
        : base(message + (keys.Length == 0 ? "" : $" (change: {string.Join(", ", keys)})"))
    {
        Keys = keys;
    }

    /// <summary>Configuration keys that control the failing choice.</summary>
    public IReadOnlyList<string> Keys { get; }
}
