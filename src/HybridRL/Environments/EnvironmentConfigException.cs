namespace HybridRL.Environments;

/// <summary>An environment parameter is unknown, malformed or out of range. <see cref="Key"/> names it.</summary>
public sealed class EnvironmentConfigException : Exception
{
    public EnvironmentConfigException(string key, string message) : base(message) => Key = key;

    public EnvironmentConfigException(string key, string message, Exception inner) : base(message, inner) => Key = key;

    /// <summary>The offending parameter key (or <c>kind</c> for an unknown environment kind).</summary>
    public string Key { get; }
}
