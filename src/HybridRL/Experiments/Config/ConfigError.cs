namespace HybridRL.Experiments.Config;

/// <summary>One problem found in an experiment configuration.</summary>
/// <param name="Key">Dotted key path (e.g. <c>trainer.dqn.batch_size</c>); empty when the problem is about a whole file.</param>
/// <param name="File">Where the offending value came from: a file path, <c>--set</c>, or <c>environment variable NAME</c>; null for a default value.</param>
/// <param name="Line">1-based line in <paramref name="File"/> when the parser gives one.</param>
/// <param name="Message">What is wrong and, where possible, how to fix it.</param>
public sealed record ConfigError(string Key, string? File, int? Line, string Message)
{
    public override string ToString()
    {
        var where = File is null ? "(default)" : Line is { } l ? $"{File}:{l}" : File;
        return Key.Length == 0 ? $"{where}: {Message}" : $"{where}: {Key}: {Message}";
    }
}
