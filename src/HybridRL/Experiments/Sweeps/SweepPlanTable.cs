using System.Globalization;
using System.Text;

namespace HybridRL.Experiments.Sweeps;

/// <summary>
/// <c>sweep plan FILE</c>: the table of runs (index, id, overrides) and the total budget — the sum over runs of each budget key
/// a resolver reports (e.g. <c>trainer.env_steps</c>, <c>trainer.circuit_executions</c>).
/// </summary>
public static class SweepPlanTable
{
    /// <summary>Sums each budget key over all runs; keys a run does not report add nothing. Keys in first-seen order.</summary>
    public static IReadOnlyList<KeyValuePair<string, double>> TotalBudget(SweepPlan plan, Func<SweepRun, IReadOnlyDictionary<string, double>> budgetOf)
    {
        var totals = new Dictionary<string, double>(StringComparer.Ordinal);
        var order = new List<string>();
        foreach (var run in plan.Runs)
            foreach (var (k, v) in budgetOf(run))
            {
                if (!totals.ContainsKey(k)) { totals[k] = 0; order.Add(k); }
                totals[k] += v;
            }
        return order.Select(k => new KeyValuePair<string, double>(k, totals[k])).ToArray();
    }

    /// <summary>Text table: a header line, one line per run, then one total line per budget key (none without a resolver).</summary>
    public static string Format(SweepPlan plan, Func<SweepRun, IReadOnlyDictionary<string, double>>? budgetOf = null)
    {
        var sb = new StringBuilder();
        sb.Append(CultureInfo.InvariantCulture, $"sweep {plan.Name}: {plan.Runs.Count} runs of {plan.BasePath}\n");
        sb.Append(CultureInfo.InvariantCulture, $"runs folder: {plan.SweepDir}\n");
        int idWidth = Math.Max(2, plan.Runs.Count == 0 ? 2 : plan.Runs.Max(r => r.Id.Length));
        int ixWidth = Math.Max(5, (plan.Runs.Count - 1).ToString(CultureInfo.InvariantCulture).Length);
        sb.Append("index".PadLeft(ixWidth)).Append("  ").Append("id".PadRight(idWidth)).Append("  overrides\n");
        foreach (var run in plan.Runs)
        {
            sb.Append(run.Index.ToString(CultureInfo.InvariantCulture).PadLeft(ixWidth)).Append("  ")
              .Append(run.Id.PadRight(idWidth)).Append("  ")
              .Append(run.Overrides.Count == 0 ? "(none)" : string.Join(" ", run.OverrideStrings)).Append('\n');
        }
        if (budgetOf is not null)
        {
            var totals = TotalBudget(plan, budgetOf);
            if (totals.Count == 0) sb.Append("total budget: no budget keys found\n");
            foreach (var (k, v) in totals)
                sb.Append(CultureInfo.InvariantCulture, $"total {k}: {v.ToString("R", CultureInfo.InvariantCulture)}\n");
        }
        return sb.ToString();
    }
}
