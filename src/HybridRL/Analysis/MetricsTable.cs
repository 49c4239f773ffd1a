namespace HybridRL.Analysis;

/// <summary>A parsed metrics.csv: named numeric columns, one value per logging row; not-applicable cells are NaN.</summary>
public sealed class MetricsTable
{
    /// <summary>The header required by the metrics.csv contract, in order.</summary>
    public static readonly string[] ContractColumns =
    [
        "env_steps", "episodes", "updates", "generations", "wall_seconds", "train_return", "eval_return", "loss",
        "fitness_mean", "fitness_best", "fitness_std", "epsilon", "sigma", "circuit_executions", "shots",
        "hardware_executions", "parameter_count",
    ];

    private readonly Dictionary<string, double[]> _columns;

    public MetricsTable(string source, IReadOnlyList<string> names, IReadOnlyList<double[]> columns)
    {
        Source = source;
        if (names.Count != columns.Count) throw new ArgumentException("one column array per name is required");
        _columns = new Dictionary<string, double[]>(StringComparer.Ordinal);
        for (int i = 0; i < names.Count; i++) _columns[names[i]] = columns[i];
        ColumnNames = names.ToArray();
        RowCount = columns.Count == 0 ? 0 : columns[0].Length;
    }

    /// <summary>File the table was read from (for error messages).</summary>
    public string Source { get; }
    public IReadOnlyList<string> ColumnNames { get; }
    public int RowCount { get; }

    public bool HasColumn(string name) => _columns.ContainsKey(name);

    /// <summary>The column's values (NaN where empty).</summary>
    public ReadOnlySpan<double> Column(string name) =>
        _columns.TryGetValue(name, out var c) ? c : throw new KeyNotFoundException($"{Source}: no column '{name}'");

    /// <summary>True when the column exists and holds at least one value.</summary>
    public bool HasValues(string name)
    {
        if (!_columns.TryGetValue(name, out var c)) return false;
        foreach (double v in c) if (!double.IsNaN(v)) return true;
        return false;
    }

    /// <summary>The last non-empty value of a column, or NaN.</summary>
    public double LastValue(string name)
    {
        if (!_columns.TryGetValue(name, out var c)) return double.NaN;
        for (int i = c.Length - 1; i >= 0; i--) if (!double.IsNaN(c[i])) return c[i];
        return double.NaN;
    }
}
