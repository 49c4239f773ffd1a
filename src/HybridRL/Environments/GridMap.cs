using System.Text;

namespace HybridRL.Environments;

/// <summary>
/// A rectangular grid parsed from a small text map (legend in <see cref="GridCell"/>). Rows are separated by
/// newlines or by <c>/</c> (handy on one config line); spaces around rows are ignored. Every non-blocked cell is a
/// state; states are numbered row by row. A map needs at least one start and at least one goal.
/// </summary>
public sealed class GridMap
{
    private readonly GridCell[] _cells;
    private readonly int[] _stateOfCell;
    private readonly int[] _cellOfState;

    public GridMap(GridCell[,] cells)
    {
        Height = cells.GetLength(0);
        Width = cells.GetLength(1);
        if (Height < 1 || Width < 1) throw new ArgumentException("map must have at least one cell", nameof(cells));
        _cells = new GridCell[Height * Width];
        _stateOfCell = new int[Height * Width];
        var states = new List<int>();
        for (int r = 0; r < Height; r++)
            for (int c = 0; c < Width; c++)
            {
                int k = r * Width + c;
                _cells[k] = cells[r, c];
                if (cells[r, c] == GridCell.Blocked) { _stateOfCell[k] = -1; continue; }
                _stateOfCell[k] = states.Count;
                states.Add(k);
            }
        _cellOfState = states.ToArray();
        int starts = 0, goals = 0;
        foreach (var cell in _cells) { if (cell == GridCell.Start) starts++; if (cell == GridCell.Goal) goals++; }
        StartCount = starts;
        GoalCount = goals;
    }

    public int Height { get; }
    public int Width { get; }

    /// <summary>Number of non-blocked cells (the tabular states).</summary>
    public int StateCount => _cellOfState.Length;

    public int StartCount { get; }
    public int GoalCount { get; }

    public GridCell this[int row, int col] => _cells[row * Width + col];

    /// <summary>True when (row, col) lies inside the map and is not blocked.</summary>
    public bool IsOpen(int row, int col) => row >= 0 && row < Height && col >= 0 && col < Width && _cells[row * Width + col] != GridCell.Blocked;

    /// <summary>State index of an open cell, -1 for blocked cells.</summary>
    public int StateOf(int row, int col) => _stateOfCell[row * Width + col];

    public int RowOf(int state) => _cellOfState[state] / Width;
    public int ColumnOf(int state) => _cellOfState[state] % Width;
    public GridCell CellOfState(int state) => _cells[_cellOfState[state]];

    /// <summary>Parses a text map; errors are <see cref="EnvironmentConfigException"/> naming <paramref name="key"/>.</summary>
    public static GridMap Parse(string text, string key = "map")
    {
        ArgumentNullException.ThrowIfNull(text);
        var rows = text.Replace("\r", "").Split(['\n', '/'], StringSplitOptions.TrimEntries | StringSplitOptions.RemoveEmptyEntries);
        if (rows.Length == 0) throw new EnvironmentConfigException(key, $"parameter '{key}': map text is empty");
        int width = rows[0].Length;
        var cells = new GridCell[rows.Length, width];
        for (int r = 0; r < rows.Length; r++)
        {
            if (rows[r].Length != width)
                throw new EnvironmentConfigException(key, $"parameter '{key}': map row {r + 1} has {rows[r].Length} cells, row 1 has {width}; all rows must have the same width");
            for (int c = 0; c < width; c++)
            {
                cells[r, c] = rows[r][c] switch
                {
                    '.' => GridCell.Floor,
                    '#' => GridCell.Blocked,
                    'o' => GridCell.Hole,
                    'R' => GridCell.Start,
                    'D' => GridCell.Goal,
                    char ch => throw new EnvironmentConfigException(key,
                        $"parameter '{key}': map row {r + 1}, column {c + 1} has '{ch}'; legend: '.' floor, '#' blocked, 'o' hole, 'R' start, 'D' goal"),
                };
            }
        }
        var map = new GridMap(cells);
        if (map.StartCount == 0) throw new EnvironmentConfigException(key, $"parameter '{key}': map has no start cell 'R'");
        if (map.GoalCount == 0) throw new EnvironmentConfigException(key, $"parameter '{key}': map has no goal cell 'D'");
        return map;
    }

    /// <summary>The map in its text form, rows separated by newlines.</summary>
    public string ToText(string rowSeparator = "\n")
    {
        var sb = new StringBuilder();
        for (int r = 0; r < Height; r++)
        {
            if (r > 0) sb.Append(rowSeparator);
            for (int c = 0; c < Width; c++) sb.Append(Symbol(this[r, c]));
        }
        return sb.ToString();
    }

    public static char Symbol(GridCell cell) => cell switch
    {
        GridCell.Floor => '.',
        GridCell.Blocked => '#',
        GridCell.Hole => 'o',
        GridCell.Start => 'R',
        GridCell.Goal => 'D',
        _ => '?',
    };
}
