namespace HybridRL.Experiments.Sweeps;

/// <summary>A sweep file that cannot be read or expanded. The message names the file, the key and, where known, the line.</summary>
public sealed class SweepFileException : Exception
{
    public SweepFileException(string message) : base(message) { }

    public SweepFileException(string message, Exception inner) : base(message, inner) { }

    /// <summary>The sweep file the error is about.</summary>
    public string? FilePath { get; init; }

    /// <summary>The dotted key (or top-level section) the error is about, when there is one.</summary>
    public string? Key { get; init; }
}
