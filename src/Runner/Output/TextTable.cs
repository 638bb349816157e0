namespace Thermostrat.Runner.Output;

/// <summary>Plain aligned text tables for the terminal (first row is the header; numbers right-aligned).</summary>
public static class TextTable
{
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
            var cells = r.Select((cell, c) => c == 0 ? cell.PadRight(width[c]) : cell.PadLeft(width[c]));
            o.WriteLine(indent + string.Join("  ", cells).TrimEnd());
            if (k == 0) o.WriteLine(indent + string.Join("  ", width.Select(w => new string('-', w))));
        }
    }
}
