using MathNet.Numerics.Distributions;

namespace HybridRL.Analysis.Statistics;

/// <summary>
/// Two-sided Mann–Whitney U (Wilcoxon rank-sum) test (Mann &amp; Whitney 1947). Ranks use mid-ranks for ties.
/// Without ties and with both samples of size ≤ <see cref="ExactLimit"/>, the p-value is exact, from the
/// recursion for the number of arrangements with a given U (Mann &amp; Whitney 1947, eq. 2); otherwise the normal
/// approximation with tie correction and continuity correction is used (Normal CDF from MathNet.Numerics).
/// </summary>
public static class MannWhitneyTest
{
    public const int ExactLimit = 25;

    public static MannWhitneyResult Compute(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n1 = x.Length, n2 = y.Length;
        if (n1 == 0 || n2 == 0) return new MannWhitneyResult(double.NaN, double.NaN, double.NaN, false);
        int n = n1 + n2;
        var values = new double[n];
        var fromX = new bool[n];
        for (int i = 0; i < n1; i++) { values[i] = x[i]; fromX[i] = true; }
        for (int i = 0; i < n2; i++) values[n1 + i] = y[i];
        var order = new int[n];
        for (int i = 0; i < n; i++) order[i] = i;
        Array.Sort(values.ToArray(), order);

        double rankSumX = 0, tieTerm = 0;
        bool ties = false;
        for (int i = 0; i < n;)
        {
            int j = i;
            while (j + 1 < n && values[order[j + 1]] == values[order[i]]) j++;
            double midRank = (i + j) / 2.0 + 1.0;
            int t = j - i + 1;
            if (t > 1) { ties = true; tieTerm += (double)t * t * t - t; }
            for (int k = i; k <= j; k++) if (fromX[order[k]]) rankSumX += midRank;
            i = j + 1;
        }
        double u = rankSumX - n1 * (n1 + 1) / 2.0;
        double mu = n1 * (double)n2 / 2.0;
        double variance = n1 * (double)n2 / 12.0 * ((n + 1) - tieTerm / ((double)n * (n - 1)));
        double z = variance > 0 ? (u - mu - Math.Sign(u - mu) * Math.Min(0.5, Math.Abs(u - mu))) / Math.Sqrt(variance) : 0;

        if (!ties && n1 <= ExactLimit && n2 <= ExactLimit)
        {
            int ui = (int)Math.Round(u);
            double lower = ExactCdf(n1, n2, ui);
            double upper = 1 - ExactCdf(n1, n2, ui - 1);
            return new MannWhitneyResult(u, z, Math.Min(1, 2 * Math.Min(lower, upper)), true);
        }
        double p = variance > 0 ? 2 * Normal.CDF(0, 1, -Math.Abs(z)) : 1;
        return new MannWhitneyResult(u, z, Math.Min(1, p), false);
    }

    /// <summary>P(U ≤ u) under the null for sample sizes m, n without ties.</summary>
    public static double ExactCdf(int m, int n, int u)
    {
        if (u < 0) return 0;
        int max = m * n;
        if (u >= max) return 1;
        // counts[i][j][k] = number of orderings of i x's and j y's with U = k; built over i, j.
        // f(i, j, k) = f(i − 1, j, k − j) + f(i, j − 1, k)  (the largest element is an x or a y).
        var prev = new double[n + 1][];
        for (int j = 0; j <= n; j++) { prev[j] = new double[max + 1]; prev[j][0] = 1; } // i = 0: U = 0 only
        for (int i = 1; i <= m; i++)
        {
            var cur = new double[n + 1][];
            for (int j = 0; j <= n; j++)
            {
                cur[j] = new double[max + 1];
                for (int k = 0; k <= i * j; k++)
                {
                    double a = k - j >= 0 ? prev[j][k - j] : 0;
                    double b = j > 0 ? cur[j - 1][k] : 0;
                    cur[j][k] = a + b;
                }
            }
            prev = cur;
        }
        var f = prev[n];
        double total = 0, below = 0;
        for (int k = 0; k <= max; k++) { total += f[k]; if (k <= u) below += f[k]; }
        return below / total;
    }
}
