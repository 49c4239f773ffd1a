using System.Globalization;

namespace HybridRL.Analysis;

/// <summary>
/// Reads a run's metrics.csv (header as in <see cref="MetricsTable.ContractColumns"/>; invariant-culture numbers;
/// empty cell = not applicable). Columns are looked up by name, so extra columns are kept; a missing contract
/// column, a ragged row or an unparsable number is an error that names the file, line and column.
/// </summary>
public static class MetricsCsvReader
{
    public static MetricsTable Read(string path)
    {
        if (!File.Exists(path)) throw new FileNotFoundException($"metrics file not found: {path}", path);
        using var reader = new StreamReader(path);
        return Read(reader, path);
    }

    public static MetricsTable Read(TextReader reader, string source)
    {
        string? header = reader.ReadLine();
        if (string.IsNullOrWhiteSpace(header)) throw new InvalidDataException($"{source}: empty file, expected a header line");
        var names = header.Trim().Split(',').Select(s => s.Trim()).ToArray();
        var missing = MetricsTable.ContractColumns.Where(c => !names.Contains(c)).ToArray();
        if (missing.Length > 0)
            throw new InvalidDataException($"{source}: header lacks column(s) {string.Join(", ", missing)}");
        var dup = names.GroupBy(n => n).FirstOrDefault(g => g.Count() > 1);
        if (dup is not null) throw new InvalidDataException($"{source}: column '{dup.Key}' appears twice");

        var cols = names.Select(_ => new List<double>()).ToArray();
        string? line;
        int lineNo = 1;
        while ((line = reader.ReadLine()) is not null)
        {
            lineNo++;
            if (line.Length == 0) continue;
            var cells = line.Split(',');
            if (cells.Length != names.Length)
                throw new InvalidDataException($"{source}:{lineNo}: {cells.Length} cells, header has {names.Length}");
            for (int i = 0; i < cells.Length; i++)
            {
                var cell = cells[i].Trim();
                if (cell.Length == 0) { cols[i].Add(double.NaN); continue; }
                if (!double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out double v))
                    throw new InvalidDataException($"{source}:{lineNo}: column '{names[i]}' value '{cell}' is not a number");
                cols[i].Add(v);
            }
        }
        return new MetricsTable(source, names, cols.Select(c => c.ToArray()).ToArray());
    }
}
