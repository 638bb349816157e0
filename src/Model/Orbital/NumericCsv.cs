using System.Globalization;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// A small reader for numeric comma-separated tables: one header row of column names, then rows of
/// numbers. Blank lines and lines starting with '#' are skipped. Names are matched without regard to
/// case, surrounding spaces or double quotes.
/// </summary>
internal sealed class NumericCsv
{
    private NumericCsv(string source, string[] header, List<double[]> rows, List<int> lineNumbers)
    {
        Source = source;
        Header = header;
        Rows = rows;
        LineNumbers = lineNumbers;
    }

    /// <summary>Where the table came from (file path or resource name), for messages.</summary>
    public string Source { get; }

    /// <summary>Column names as written (trimmed, quotes removed).</summary>
    public string[] Header { get; }

    /// <summary>Parsed rows, each with one value per header column (may be NaN or ±∞ if written so).</summary>
    public List<double[]> Rows { get; }

    /// <summary>1-based line number in the source of each row.</summary>
    public List<int> LineNumbers { get; }

    /// <summary>Index of the column named <paramref name="name"/>; throws naming the file and the columns found.</summary>
    public int Column(string name)
    {
        for (int i = 0; i < Header.Length; i++)
            if (string.Equals(Header[i], name, StringComparison.OrdinalIgnoreCase)) return i;
        throw new FormatException($"{Source}: required column '{name}' is missing; the header has: {string.Join(", ", Header.Select(h => $"'{h}'"))}.");
    }

    public static NumericCsv Parse(TextReader reader, string source)
    {
        string[]? header = null;
        var rows = new List<double[]>();
        var lines = new List<int>();
        int lineNumber = 0;
        string? line;
        while ((line = reader.ReadLine()) is not null)
        {
            lineNumber++;
            string trimmed = line.Trim();
            if (trimmed.Length == 0 || trimmed[0] == '#') continue;
            string[] cells = trimmed.Split(',');
            for (int i = 0; i < cells.Length; i++) cells[i] = cells[i].Trim().Trim('"').Trim();
            if (header is null)
            {
                header = cells;
                continue;
            }
            if (cells.Length != header.Length)
                throw new FormatException($"{source}, line {lineNumber}: {cells.Length} values but the header has {header.Length} columns ({string.Join(", ", header)}).");
            var values = new double[cells.Length];
            for (int i = 0; i < cells.Length; i++)
            {
                if (!double.TryParse(cells[i], NumberStyles.Float, CultureInfo.InvariantCulture, out values[i]))
                    throw new FormatException($"{source}, line {lineNumber}, column '{header[i]}': '{cells[i]}' is not a number (use '.' as the decimal separator).");
            }
            rows.Add(values);
            lines.Add(lineNumber);
        }
        if (header is null)
            throw new FormatException($"{source}: the file is empty; expected a header row and data rows.");
        return new NumericCsv(source, header, rows, lines);
    }
}
