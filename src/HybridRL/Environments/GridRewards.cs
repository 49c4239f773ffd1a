namespace HybridRL.Environments;

/// <summary>Rewards of a grid task: every step costs <see cref="StepCost"/>; entering a goal adds <see cref="GoalReward"/>, entering a hole adds <see cref="HoleReward"/> (usually negative).</summary>
public readonly record struct GridRewards(double StepCost, double GoalReward, double HoleReward)
{
    /// <summary>Reward for a step that ends in <paramref name="arrived"/>.</summary>
    public double For(GridCell arrived) => -StepCost + arrived switch
    {
        GridCell.Goal => GoalReward,
        GridCell.Hole => HoleReward,
        _ => 0,
    };

    /// <summary>Builds the exact tabular model of a grid task with the Russell &amp; Norvig slip model (<see cref="GridMoves"/>). Goals and holes are terminal; the start distribution is uniform over start cells, or with <paramref name="anyCell"/> uniform over every non-terminal cell.</summary>
    public TabularModel BuildModel(GridMap map, double slip, bool anyCell = false)
    {
        var b = new TabularModelBuilder(map.StateCount, GridMoves.ActionCount);
        int nonTerminal = 0;
        for (int s = 0; s < map.StateCount; s++)
            if (map.CellOfState(s) is not (GridCell.Goal or GridCell.Hole)) nonTerminal++;
        for (int s = 0; s < map.StateCount; s++)
        {
            var cell = map.CellOfState(s);
            if (anyCell ? cell is not (GridCell.Goal or GridCell.Hole) : cell == GridCell.Start)
                b.SetStartProbability(s, 1.0 / (anyCell ? nonTerminal : map.StartCount));
            if (cell is GridCell.Goal or GridCell.Hole) { b.SetTerminal(s); continue; }
            for (int a = 0; a < GridMoves.ActionCount; a++)
                for (int o = 0; o < 3; o++)
                {
                    double p = GridMoves.OutcomeProbability(o, slip);
                    int next = GridMoves.Move(map, s, GridMoves.Direction(a, o));
                    b.AddTransition(s, a, next, p, For(map.CellOfState(next)));
                }
        }
        return b.Build();
    }
}
