using System.Globalization;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>Reads the CSV fixtures in Fixtures/Seawater: '#' lines are provenance comments, then a header row.</summary>
internal sealed class SeawaterFixture
{
    private readonly Dictionary<string, int> _columns;

    private SeawaterFixture(string fileName, string[] header, List<string[]> rows, List<string> comments)
    {
        FileName = fileName;
        _columns = header.Select((name, index) => (name, index)).ToDictionary(c => c.name, c => c.index);
        Rows = rows;
        Comments = comments;
    }

    public string FileName { get; }
    public IReadOnlyList<string[]> Rows { get; }
    public IReadOnlyList<string> Comments { get; }

    public static SeawaterFixture Load(string fileName)
    {
        string path = Path.Combine(AppContext.BaseDirectory, "Fixtures", "Seawater", fileName);
        var comments = new List<string>();
        var rows = new List<string[]>();
        string[]? header = null;
        foreach (string line in File.ReadLines(path))
        {
            if (line.StartsWith('#')) { comments.Add(line); continue; }
            if (string.IsNullOrWhiteSpace(line)) continue;
            string[] fields = line.Split(',');
            if (header is null) header = fields;
            else rows.Add(fields);
        }
        return new SeawaterFixture(fileName, header ?? throw new InvalidDataException($"{path}: no header"), rows, comments);
    }

    public string Text(string[] row, string column) => row[_columns[column]];

    public double Value(string[] row, string column) => double.Parse(row[_columns[column]], NumberStyles.Float, CultureInfo.InvariantCulture);

    public double? OptionalValue(string[] row, string column) =>
        row[_columns[column]].Length == 0 ? null : Value(row, column);

    public IEnumerable<double> Column(string column) => Rows.Select(r => Value(r, column));
}
