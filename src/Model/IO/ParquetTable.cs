using Parquet;
using Parquet.Schema;

namespace Thermostrat.Model.IO;

/// <summary>A table read whole into memory: columns by name, and the file's key-value metadata.</summary>
public sealed class ParquetTable
{
    private readonly Dictionary<string, Array> _columns;

    private ParquetTable(Dictionary<string, Array> columns, IReadOnlyDictionary<string, string> metadata, long rows)
    {
        _columns = columns;
        Metadata = metadata;
        RowCount = rows;
    }

    /// <summary>Key-value metadata of the file.</summary>
    public IReadOnlyDictionary<string, string> Metadata { get; }

    /// <summary>Number of rows.</summary>
    public long RowCount { get; }

    /// <summary>Column names in file order.</summary>
    public IEnumerable<string> ColumnNames => _columns.Keys;

    /// <summary>True if the table has a column of this name.</summary>
    public bool Has(string name) => _columns.ContainsKey(name);

    /// <summary>A floating-point column (integer columns are converted).</summary>
    /// <exception cref="InvalidDataException">No such column, or it is not numeric.</exception>
    public double[] Doubles(string name) => _columns.TryGetValue(name, out var a)
        ? a switch
        {
            double[] d => d,
            long[] l => l.Select(x => (double)x).ToArray(),
            int[] i => i.Select(x => (double)x).ToArray(),
            float[] f => f.Select(x => (double)x).ToArray(),
            double?[] dn => dn.Select(x => x ?? double.NaN).ToArray(),
            _ => throw new InvalidDataException($"column '{name}' is not numeric"),
        }
        : throw new InvalidDataException($"no column '{name}'; columns are: {string.Join(", ", _columns.Keys)}");

    /// <summary>A text column.</summary>
    public string[] Texts(string name) => _columns.TryGetValue(name, out var a) && a is string[] s
        ? s
        : throw new InvalidDataException($"no text column '{name}'; columns are: {string.Join(", ", _columns.Keys)}");

    /// <summary>Reads a Parquet file of flat numeric and text columns.</summary>
    /// <exception cref="FileNotFoundException">The file does not exist.</exception>
    /// <exception cref="InvalidDataException">The file is not a readable Parquet table.</exception>
    public static ParquetTable Read(string path)
    {
        if (!File.Exists(path)) throw new FileNotFoundException($"file not found: {path}", path);
        try
        {
            return ReadAsync(path).GetAwaiter().GetResult();
        }
        catch (Exception e) when (e is not InvalidDataException and not FileNotFoundException)
        {
            throw new InvalidDataException($"{path} is not a readable Parquet table: {e.Message}", e);
        }
    }

    private static async Task<ParquetTable> ReadAsync(string path)
    {
        await using var reader = await ParquetReader.CreateAsync(path);
        var fields = reader.Schema.GetDataFields();
        var parts = fields.ToDictionary(f => f.Name, _ => new List<Array>());
        long rows = 0;
        for (int g = 0; g < reader.RowGroupCount; g++)
        {
            using var rg = reader.OpenRowGroupReader(g);
            int n = checked((int)rg.RowCount);
            rows += n;
            foreach (var f in fields)
                parts[f.Name].Add(await ReadColumn(rg, f, n));
        }
        var columns = new Dictionary<string, Array>(StringComparer.Ordinal);
        foreach (var f in fields) columns[f.Name] = Concat(parts[f.Name], f);
        return new ParquetTable(columns, reader.CustomMetadata ?? new Dictionary<string, string>(), rows);
    }

    private static async Task<Array> ReadColumn(ParquetRowGroupReader rg, DataField f, int n)
    {
        var t = f.ClrType;
        if (t == typeof(string) || t == typeof(ReadOnlyMemory<char>))
        {
            var s = new string?[n];
            await rg.ReadAsync(f, s.AsMemory());
            return s.Select(x => x ?? "").ToArray();
        }
        if (t == typeof(double)) return f.IsNullable ? await Nullable<double>(rg, f, n) : await Plain<double>(rg, f, n);
        if (t == typeof(float)) return f.IsNullable ? (await Nullable<float>(rg, f, n)) : await Plain<float>(rg, f, n);
        if (t == typeof(long)) return f.IsNullable ? (await Nullable<long>(rg, f, n)) : await Plain<long>(rg, f, n);
        if (t == typeof(int)) return f.IsNullable ? (await Nullable<int>(rg, f, n)) : await Plain<int>(rg, f, n);
        throw new InvalidDataException($"column '{f.Name}' has unsupported type {t.Name}");
    }

    private static async Task<Array> Plain<T>(ParquetRowGroupReader rg, DataField f, int n) where T : struct
    {
        var a = new T[n];
        await rg.ReadAsync<T>(f, a.AsMemory());
        return a;
    }

    private static async Task<Array> Nullable<T>(ParquetRowGroupReader rg, DataField f, int n) where T : struct
    {
        var a = new T?[n];
        await rg.ReadAsync<T>(f, a.AsMemory());
        if (a.Any(v => v is null)) throw new InvalidDataException($"column '{f.Name}' has missing values");
        return a.Select(v => v!.Value).ToArray();
    }

    private static Array Concat(List<Array> parts, DataField f)
    {
        if (parts.Count == 1) return parts[0];
        int total = parts.Sum(p => p.Length);
        var elem = parts.Count > 0 ? parts[0].GetType().GetElementType()! : (f.ClrType == typeof(string) ? typeof(string) : typeof(double));
        var result = Array.CreateInstance(elem, total);
        int at = 0;
        foreach (var p in parts) { Array.Copy(p, 0, result, at, p.Length); at += p.Length; }
        return result;
    }
}
