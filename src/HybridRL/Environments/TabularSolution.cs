using System.Globalization;
using System.Text;

namespace HybridRL.Environments;

/// <summary>
/// Exact solution of a tabular environment (what <c>hybridrl env solve CONFIG</c> prints): the value-iteration
/// result and, for grid tasks, the map for a picture of values and greedy moves. Build with <see cref="Solve"/>.
/// </summary>
public sealed class TabularSolution
{
    private TabularSolution(EnvironmentSettings settings, GridMap? map, TabularModel model, ValueIterationResult result)
    {
        Settings = settings;
        Map = map;
        Model = model;
        Result = result;
    }

    public EnvironmentSettings Settings { get; }
    public GridMap? Map { get; }
    public TabularModel Model { get; }
    public ValueIterationResult Result { get; }

    /// <summary>Solves the task by value iteration; errors (<see cref="EnvironmentConfigException"/>, key <c>kind</c>) when it has no tabular model.</summary>
    public static TabularSolution Solve(EnvironmentSettings settings, double gamma, double tolerance = 1e-12)
    {
        ArgumentNullException.ThrowIfNull(settings);
        var model = settings.ToTabularModel()
            ?? throw new EnvironmentConfigException("kind", $"environment kind '{settings.Kind}' has no exact tabular model; solvable kinds: {SlipperyWarehouseSettings.KindName}, {SurveyDroneSettings.KindName}");
        GridMap? map = settings switch
        {
            SlipperyWarehouseSettings w => w.Map,
            SurveyDroneSettings d => d.Map,
            _ => null,
        };
        return new TabularSolution(settings, map, model, ValueIteration.Solve(model, gamma, tolerance));
    }

    /// <summary>Solves from a kind and its parameters (as in the experiment file).</summary>
    public static TabularSolution Solve(string kind, IReadOnlyDictionary<string, string> parameters, double gamma, double tolerance = 1e-12) =>
        Solve(EnvironmentFactory.Parse(kind, parameters), gamma, tolerance);

    /// <summary>Plain-text report: settings, optimal start return, a value grid and a greedy-move grid (grid tasks).</summary>
    public string Format()
    {
        var inv = CultureInfo.InvariantCulture;
        var sb = new StringBuilder();
        sb.Append("environment: ").Append(Settings.Kind).Append('\n');
        foreach (var (k, v) in Settings.Values)
            sb.Append("  ").Append(k).Append(": ").Append(v.Contains('\n') ? v.Replace("\n", "/") : v).Append('\n');
        sb.Append("discount (gamma): ").Append(Result.Gamma.ToString("R", inv)).Append('\n');
        sb.Append("states: ").Append(Model.StateCount).Append(", actions: ").Append(Model.ActionCount).Append('\n');
        sb.Append("value iteration: ").Append(Result.Sweeps).Append(" sweeps, last change ").Append(Result.FinalChange.ToString("E2", inv)).Append('\n');
        sb.Append("optimal expected return from the start: ").Append(Result.OptimalStartReturn.ToString("F6", inv)).Append('\n');
        if (Map is null)
        {
            sb.Append("state  value  action\n");
            for (int s = 0; s < Model.StateCount; s++)
                sb.Append(s).Append("  ").Append(Result.Values[s].ToString("F6", inv)).Append("  ")
                  .Append(Model.IsTerminal(s) ? "-" : Result.Policy[s].ToString(inv)).Append('\n');
            return sb.ToString();
        }
        sb.Append("optimal values (row by row; '#' blocked):\n");
        for (int r = 0; r < Map.Height; r++)
        {
            for (int c = 0; c < Map.Width; c++)
            {
                int s = Map.StateOf(r, c);
                sb.Append(s < 0 ? "      #" : Result.Values[s].ToString("F3", inv).PadLeft(7));
                sb.Append(' ');
            }
            sb.Append('\n');
        }
        sb.Append("greedy moves (^ north, > east, v south, < west; D goal, o hole, # blocked):\n");
        for (int r = 0; r < Map.Height; r++)
        {
            for (int c = 0; c < Map.Width; c++)
            {
                var cell = Map[r, c];
                int s = Map.StateOf(r, c);
                sb.Append(cell is GridCell.Blocked or GridCell.Goal or GridCell.Hole ? GridMap.Symbol(cell) : GridMoves.Arrow(Result.Policy[s]));
            }
            sb.Append('\n');
        }
        return sb.ToString();
    }
}
