namespace HybridRL.Analysis;

/// <summary>
/// Several runs' curves on one grid. <see cref="Values"/>[run][point] is NaN where the run was not observed
/// (before its first or after its last logged point: censored, not imputed); <see cref="Observed"/>[point]
/// counts the runs with a value there.
/// </summary>
public sealed record AlignedCurves(double[] Grid, double[][] Values, int[] Observed)
{
    /// <summary>Copies the observed values at one grid point into <paramref name="into"/>; returns how many.</summary>
    public int ObservedAt(int point, Span<double> into)
    {
        int k = 0;
        foreach (var run in Values)
        {
            double v = run[point];
            if (!double.IsNaN(v)) into[k++] = v;
        }
        return k;
    }
}
