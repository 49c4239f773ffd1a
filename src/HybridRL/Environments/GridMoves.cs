namespace HybridRL.Environments;

/// <summary>
/// Four compass moves on a grid (0 north, 1 east, 2 south, 3 west) with the slip model of Russell &amp; Norvig
/// (Artificial Intelligence: A Modern Approach, ch. 17): the intended direction with probability 1 − p and each of
/// the two perpendicular directions with probability p / 2 (p = 0.2 gives their 0.8 / 0.1 / 0.1).
/// A move into a blocked cell or off the map leaves the agent where it is.
/// </summary>
public static class GridMoves
{
    public const int ActionCount = 4;
    private static readonly int[] RowDelta = [-1, 0, 1, 0];
    private static readonly int[] ColDelta = [0, 1, 0, -1];
    private static readonly string[] Names = ["north", "east", "south", "west"];

    public static string ActionName(int action) => Names[action];

    /// <summary>Arrow used by text formatters (ASCII).</summary>
    public static char Arrow(int action) => "^>v<"[action];

    /// <summary>Direction actually taken: 0 intended, 1 perpendicular to the left, 2 perpendicular to the right.</summary>
    public static int Direction(int intended, int outcome) => outcome switch
    {
        0 => intended,
        1 => (intended + 3) & 3,
        _ => (intended + 1) & 3,
    };

    /// <summary>Probability of each outcome of <see cref="Direction"/>.</summary>
    public static double OutcomeProbability(int outcome, double slip) => outcome == 0 ? 1 - slip : slip / 2;

    /// <summary>Samples an outcome (0 intended, 1 left, 2 right) with one uniform draw.</summary>
    public static int SampleOutcome(double uniform, double slip)
    {
        if (uniform < 1 - slip) return 0;
        return uniform < 1 - slip / 2 ? 1 : 2;
    }

    /// <summary>The state reached by moving in <paramref name="direction"/> from <paramref name="state"/>.</summary>
    public static int Move(GridMap map, int state, int direction)
    {
        int r = map.RowOf(state) + RowDelta[direction];
        int c = map.ColumnOf(state) + ColDelta[direction];
        return map.IsOpen(r, c) ? map.StateOf(r, c) : state;
    }
}
