namespace Thermostrat.Runner.Configuration;

/// <summary>Closest valid name for a mistyped key (Levenshtein distance, case-insensitive).</summary>
public static class KeySuggester
{
    /// <summary>The candidate nearest to <paramref name="typed"/>, or null if none is close enough to be a plausible typo.</summary>
    public static string? Closest(string typed, IEnumerable<string> candidates)
    {
        string? best = null;
        int bestD = int.MaxValue;
        foreach (var c in candidates)
        {
            int d = Distance(typed.ToLowerInvariant(), c.ToLowerInvariant());
            if (d < bestD) { bestD = d; best = c; }
        }
        if (best is null) return null;
        return bestD <= Math.Max(2, typed.Length / 2) ? best : null;
    }

    /// <summary>Levenshtein edit distance.</summary>
    public static int Distance(string a, string b)
    {
        var prev = new int[b.Length + 1];
        var cur = new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++) prev[j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            cur[0] = i;
            for (int j = 1; j <= b.Length; j++)
                cur[j] = Math.Min(Math.Min(cur[j - 1] + 1, prev[j] + 1), prev[j - 1] + (a[i - 1] == b[j - 1] ? 0 : 1));
            (prev, cur) = (cur, prev);
        }
        return prev[b.Length];
    }
}
