namespace HybridRL.Training.Evolution;

/// <summary>Common base of the immutable per-method settings records.</summary>
public abstract record EvolutionSettings
{
    /// <summary>The method these settings configure.</summary>
    public abstract EvolutionKind Kind { get; }

    /// <summary>Throws <see cref="ArgumentException"/> naming the offending setting key when a value is out of range.</summary>
    public abstract void Validate();

    internal abstract void Write(BinaryWriter writer);

    private protected static ArgumentException Bad(string method, string key, string rule, object value) =>
        new($"{method} setting '{key}' {rule}, got {value}", key);

    private protected static bool IsPositiveFinite(double x) => double.IsFinite(x) && x > 0;
}
