namespace HybridRL.Experiments.Config;

/// <summary>"Did you mean" suggestions by Levenshtein edit distance.</summary>
public static class KeySuggester
{
    /// <summary>Levenshtein distance (insertions, deletions, substitutions; Levenshtein 1966), two-row dynamic programme.</summary>
    public static int Distance(string a, string b)
    {
        if (a.Length == 0) return b.Length;
        if (b.Length == 0) return a.Length;
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (var j = 0; j <= b.Length; j++) previous[j] = j;
        for (var i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (var j = 1; j <= b.Length; j++)
            {
                var cost = a[i - 1] == b[j - 1] ? 0 : 1;
                current[j] = Math.Min(Math.Min(current[j - 1] + 1, previous[j] + 1), previous[j - 1] + cost);
            }
            (previous, current) = (current, previous);
        }
        return previous[b.Length];
    }

    /// <summary>
    /// Nearest candidate to a misspelt dotted key, or null when nothing is close. A candidate with the same last
    /// segment in the same top-level section (a key put in the wrong sub-section) is preferred; otherwise the
    /// candidate with the smallest edit distance within max(2, length/3).
    /// </summary>
    public static string? Suggest(string unknown, IEnumerable<string> candidates)
    {
        var list = candidates.ToList();
        var leaf = unknown[(unknown.LastIndexOf('.') + 1)..];
        var top = unknown.Split('.')[0];
        var sameLeaf = list.Where(c => c.EndsWith("." + leaf, StringComparison.Ordinal) && c.Split('.')[0] == top).ToList();
        if (sameLeaf.Count > 0) return sameLeaf.MinBy(c => Distance(unknown, c));

        string? best = null;
        var bestDistance = int.MaxValue;
        foreach (var candidate in list)
        {
            var d = Distance(unknown, candidate);
            if (d < bestDistance) { bestDistance = d; best = candidate; }
        }
        return best is not null && bestDistance <= Math.Max(2, unknown.Length / 3) ? best : null;
    }

    /// <summary>Nearest allowed value for a misspelt choice, or null.</summary>
    public static string? SuggestValue(string value, IEnumerable<string> choices)
    {
        string? best = null;
        var bestDistance = int.MaxValue;
        foreach (var c in choices)
        {
            var d = Distance(value.ToLowerInvariant(), c);
            if (d < bestDistance) { bestDistance = d; best = c; }
        }
        return best is not null && bestDistance <= Math.Max(2, value.Length / 3) ? best : null;
    }
}
