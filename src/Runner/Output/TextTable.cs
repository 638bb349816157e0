namespace Thermostrat.Runner.Output;

/// <summary>Plain aligned text tables for the terminal (first row is the header; numbers right-aligned).</summary>
public static class TextTable
{
    private static bool IsNumeric(string s) =>
        double.TryParse(s, System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out _);

    /// <summary>Writes the rows with columns padded to their widest cell.</summary>
    public static void Write(TextWriter o, IReadOnlyList<string[]> rows, string indent = "  ")
    {
        if (rows.Count == 0) return;
        int nc = rows.Max(r => r.Length);
        var width = new int[nc];
        foreach (var r in rows)
            for (int c = 0; c < r.Length; c++) width[c] = Math.Max(width[c], r[c].Length);
        for (int k = 0; k < rows.Count; k++)
        {
            var r = rows[k];
            // Numbers are right-aligned, text left-aligned; the header follows its column's first row.
            var cells = r.Select((cell, c) => c > 0 && IsNumeric(rows.Count > 1 ? (c < rows[1].Length ? rows[1][c] : "") : cell) ? cell.PadLeft(width[c]) : cell.PadRight(width[c]));
            o.WriteLine(indent + string.Join("  ", cells).TrimEnd());
            if (k == 0) o.WriteLine(indent + string.Join("  ", width.Select(w => new string('-', w))));
        }
    }
}
