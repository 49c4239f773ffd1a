namespace HybridRL.Training.Evolution;

/// <summary>
/// Ranking of a generation's fitness values (to be maximised), without allocation.
/// Order: larger fitness first; NaN after every number; equal values keep slot order (stable).
/// </summary>
public static class FitnessRanking
{
    /// <summary>
    /// Writes into <paramref name="order"/> the slot indices from best to worst.
    /// <paramref name="scratch"/> must be at least as long as <paramref name="fitness"/>.
    /// </summary>
    public static void SortDescending(ReadOnlySpan<double> fitness, Span<int> order, Span<int> scratch)
    {
        int n = fitness.Length;
        if (order.Length < n) throw new ArgumentException("order is shorter than fitness", nameof(order));
        if (scratch.Length < n) throw new ArgumentException("scratch is shorter than fitness", nameof(scratch));
        for (int i = 0; i < n; i++) order[i] = i;
        // Bottom-up stable merge sort: equal keys keep increasing slot order.
        Span<int> src = order[..n];
        Span<int> dst = scratch[..n];
        bool inOrder = true;
        for (int width = 1; width < n; width *= 2)
        {
            for (int lo = 0; lo < n; lo += 2 * width)
            {
                int mid = Math.Min(lo + width, n), hi = Math.Min(lo + 2 * width, n);
                int a = lo, b = mid, k = lo;
                while (a < mid && b < hi)
                    dst[k++] = Before(fitness[src[b]], fitness[src[a]]) ? src[b++] : src[a++];
                while (a < mid) dst[k++] = src[a++];
                while (b < hi) dst[k++] = src[b++];
            }
            var t = src; src = dst; dst = t;
            inOrder = !inOrder;
        }
        if (!inOrder) src.CopyTo(order);
    }

    /// <summary>True when x ranks strictly before y (x is a larger number, or y is NaN and x is not).</summary>
    public static bool Before(double x, double y)
    {
        if (double.IsNaN(x)) return false;
        if (double.IsNaN(y)) return true;
        return x > y;
    }

    /// <summary>
    /// Centred ranks (Salimans et al. 2017, fitness shaping): ascending rank r ∈ {0 … λ−1} mapped to
    /// r/(λ−1) − 0.5, so the worst member gets −0.5 and the best +0.5. Members with equal fitness share the
    /// mean of their ranks (our choice: equal fitness then carries no spurious gradient; NaNs are all equal).
    /// <paramref name="order"/> must come from <see cref="SortDescending"/> on the same fitness.
    /// </summary>
    public static void CentredRanks(ReadOnlySpan<double> fitness, ReadOnlySpan<int> order, Span<double> shaped)
    {
        int n = fitness.Length;
        if (shaped.Length < n) throw new ArgumentException("output is shorter than fitness", nameof(shaped));
        if (n == 1) { shaped[0] = 0; return; }
        int start = 0;
        while (start < n)
        {
            int end = start + 1;
            double f = fitness[order[start]];
            while (end < n && Same(fitness[order[end]], f)) end++;
            // Positions start … end−1 (0 = best) have ascending ranks n−1−start … n−end; their mean:
            double meanRank = (n - 1) - 0.5 * (start + end - 1);
            double value = meanRank / (n - 1) - 0.5;
            for (int k = start; k < end; k++) shaped[order[k]] = value;
            start = end;
        }
    }

    /// <summary>Centred ranks computed directly from fitness (allocates its scratch; for tests and one-off use).</summary>
    public static double[] CentredRanks(ReadOnlySpan<double> fitness)
    {
        var order = new int[fitness.Length];
        var scratch = new int[fitness.Length];
        var shaped = new double[fitness.Length];
        SortDescending(fitness, order, scratch);
        CentredRanks(fitness, order, shaped);
        return shaped;
    }

    private static bool Same(double a, double b) => a == b || (double.IsNaN(a) && double.IsNaN(b));
}
