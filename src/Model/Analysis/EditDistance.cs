namespace Thermostrat.Model.Analysis;

/// <summary>
/// Levenshtein edit distance (insertions, deletions and substitutions each cost 1), used to
/// suggest the closest valid name when a user misspells a parameter, model or setting.
/// </summary>
public static class EditDistance
{
    /// <summary>
    /// The Levenshtein distance between <paramref name="a"/> and <paramref name="b"/>
    /// (Levenshtein 1966; the two-row dynamic programme of Wagner and Fischer 1974).
    /// </summary>
    /// <param name="a">First string.</param>
    /// <param name="b">Second string.</param>
    /// <param name="ignoreCase">Compare characters case-insensitively (invariant culture).</param>
    public static int Levenshtein(string a, string b, bool ignoreCase = false)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        if (a.Length == 0) return b.Length;
        if (b.Length == 0) return a.Length;
        Span<int> previous = b.Length < 256 ? stackalloc int[b.Length + 1] : new int[b.Length + 1];
        Span<int> current = b.Length < 256 ? stackalloc int[b.Length + 1] : new int[b.Length + 1];
        for (int j = 0; j <= b.Length; j++) previous[j] = j;
        for (int i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            char ca = ignoreCase ? char.ToUpperInvariant(a[i - 1]) : a[i - 1];
            for (int j = 1; j <= b.Length; j++)
            {
                char cb = ignoreCase ? char.ToUpperInvariant(b[j - 1]) : b[j - 1];
                int substitution = previous[j - 1] + (ca == cb ? 0 : 1);
                current[j] = Math.Min(substitution, Math.Min(previous[j] + 1, current[j - 1] + 1));
            }
            current.CopyTo(previous);
        }
        return previous[b.Length];
    }

    /// <summary>
    /// The candidate closest to <paramref name="name"/> by case-insensitive edit distance, or
    /// <see langword="null"/> if there are no candidates. Ties go to the earlier candidate.
    /// </summary>
    public static string? Closest(string name, IEnumerable<string> candidates)
    {
        ArgumentNullException.ThrowIfNull(name);
        ArgumentNullException.ThrowIfNull(candidates);
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (var candidate in candidates)
        {
            int d = Levenshtein(name, candidate, ignoreCase: true);
            if (d < bestDistance)
            {
                bestDistance = d;
                best = candidate;
            }
        }
        return best;
    }
}
