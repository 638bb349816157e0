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
            int d = Thermostrat.Model.Analysis.EditDistance.Levenshtein(typed, c, ignoreCase: true);
            if (d < bestD) { bestD = d; best = c; }
        }
        if (best is null) return null;
        return bestD <= Math.Max(2, typed.Length / 2) ? best : null;
    }

    /// <summary>Levenshtein edit distance (the model library's, case-sensitive).</summary>
    public static int Distance(string a, string b) => Thermostrat.Model.Analysis.EditDistance.Levenshtein(a, b);
}
