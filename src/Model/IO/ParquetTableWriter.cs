using Parquet;
using Parquet.Schema;
using System.Text.Json;

namespace Thermostrat.Model.IO;

/// <summary>Kind of values held by a table column.</summary>
public enum ColumnKind
{
    /// <summary>64-bit floating point.</summary>
    Double,
    /// <summary>64-bit integer (counts, indices).</summary>
    Int64,
    /// <summary>UTF-8 text (labels such as a point type).</summary>
    Text,
}

/// <summary>One column of an output table: snake_case name with its unit in the name, the unit itself, a description.</summary>
/// <param name="Name">Column name, snake_case, unit suffix where it has one (e.g. <c>insolation_wm2</c>).</param>
/// <param name="Unit">Unit in plain text ("W m-2", "ka", "1" for dimensionless, "" for labels).</param>
/// <param name="Description">One-line meaning.</param>
/// <param name="Kind">Value kind.</param>
public sealed record ColumnSpec(string Name, string Unit, string Description = "", ColumnKind Kind = ColumnKind.Double);

/// <summary>
/// Streams rows into a Parquet file in row groups, so memory stays flat however long the table.
/// The file is written under a temporary name beside the target and renamed only by
/// <see cref="Complete"/>; disposing an incomplete writer deletes the temporary file, so no
/// reader ever sees half a table. Key-value metadata carries the tool version, the units of
/// every column and whatever provenance the caller adds (the resolved configuration).
/// </summary>
public sealed class ParquetTableWriter : IDisposable
{
    /// <summary>Metadata key of the tool version.</summary>
    public const string VersionKey = "thermostrat.version";
    /// <summary>Metadata key of the JSON object mapping column name to unit.</summary>
    public const string UnitsKey = "thermostrat.units";
    /// <summary>Metadata key of the JSON object mapping column name to description.</summary>
    public const string DescriptionsKey = "thermostrat.columns";
    /// <summary>Metadata key of the fully resolved configuration (JSON).</summary>
    public const string ConfigKey = "thermostrat.config";

    private readonly string _path;
    private readonly string _tempPath;
    private readonly FileStream _stream;
    private readonly ParquetWriter _writer;
    private readonly DataField[] _fields;
    private readonly IReadOnlyList<ColumnSpec> _columns;
    private readonly double[][] _doubles;
    private readonly long[][] _longs;
    private readonly string[][] _texts;
    private readonly int _rowGroupSize;
    private int _row;
    private long _rowsWritten;
    private bool _completed;
    private bool _disposed;

    private ParquetTableWriter(string path, IReadOnlyList<ColumnSpec> columns, IReadOnlyDictionary<string, string>? metadata, int rowGroupSize)
    {
        if (columns.Count == 0) throw new ArgumentException("a table needs at least one column", nameof(columns));
        var dup = columns.GroupBy(c => c.Name, StringComparer.Ordinal).FirstOrDefault(g => g.Count() > 1);
        if (dup is not null) throw new ArgumentException($"column '{dup.Key}' appears twice", nameof(columns));
        _path = Path.GetFullPath(path);
        _columns = columns;
        _rowGroupSize = rowGroupSize;
        _fields = columns.Select(c => c.Kind switch
        {
            ColumnKind.Double => (DataField)new DataField<double>(c.Name),
            ColumnKind.Int64 => new DataField<long>(c.Name),
            _ => new DataField<string>(c.Name),
        }).ToArray();
        _doubles = columns.Select(c => c.Kind == ColumnKind.Double ? new double[rowGroupSize] : []).ToArray();
        _longs = columns.Select(c => c.Kind == ColumnKind.Int64 ? new long[rowGroupSize] : []).ToArray();
        _texts = columns.Select(c => c.Kind == ColumnKind.Text ? new string[rowGroupSize] : []).ToArray();

        Directory.CreateDirectory(Path.GetDirectoryName(_path)!);
        _tempPath = _path + ".partial-" + Guid.NewGuid().ToString("N")[..8];
        _stream = new FileStream(_tempPath, FileMode.CreateNew, FileAccess.ReadWrite, FileShare.None);
        _writer = ParquetWriter.CreateAsync(new ParquetSchema(_fields), _stream).GetAwaiter().GetResult();
        var meta = new Dictionary<string, string>(StringComparer.Ordinal)
        {
            [VersionKey] = ThermostratInfo.Version,
            [UnitsKey] = JsonSerializer.Serialize(columns.ToDictionary(c => c.Name, c => c.Unit)),
            [DescriptionsKey] = JsonSerializer.Serialize(columns.ToDictionary(c => c.Name, c => c.Description)),
        };
        if (metadata is not null)
            foreach (var (k, v) in metadata) meta[k] = v;
        _metadata = meta;
        _writer.CustomMetadata = meta;
    }

    private readonly Dictionary<string, string> _metadata;

    /// <summary>Adds or replaces a key-value metadata entry; allowed until <see cref="Complete"/> (the footer is written last).</summary>
    public void SetMetadata(string key, string value)
    {
        ObjectDisposedException.ThrowIf(_disposed, this);
        _metadata[key] = value;
        _writer.CustomMetadata = _metadata;
    }

    /// <summary>Starts a table at <paramref name="path"/> (written to a temporary name until <see cref="Complete"/>).</summary>
    public static ParquetTableWriter Create(string path, IReadOnlyList<ColumnSpec> columns,
        IReadOnlyDictionary<string, string>? metadata = null, int rowGroupSize = 65536)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(rowGroupSize, 1);
        return new ParquetTableWriter(path, columns, metadata, rowGroupSize);
    }

    /// <summary>The columns, in order.</summary>
    public IReadOnlyList<ColumnSpec> Columns => _columns;

    /// <summary>Rows appended so far.</summary>
    public long RowCount => _rowsWritten + _row;

    /// <summary>Sets a floating-point cell of the current row.</summary>
    public void Set(int column, double value) => _doubles[column][_row] = value;

    /// <summary>Sets an integer cell of the current row.</summary>
    public void Set(int column, long value) => _longs[column][_row] = value;

    /// <summary>Sets a text cell of the current row.</summary>
    public void Set(int column, string value) => _texts[column][_row] = value;

    /// <summary>Finishes the current row (flushing a row group when full).</summary>
    public void EndRow()
    {
        ObjectDisposedException.ThrowIf(_disposed, this);
        if (++_row == _rowGroupSize) Flush();
    }

    /// <summary>Appends a row of an all-floating-point table.</summary>
    public void AppendRow(ReadOnlySpan<double> values)
    {
        if (values.Length != _columns.Count)
            throw new ArgumentException($"row has {values.Length} values, table has {_columns.Count} columns", nameof(values));
        for (int c = 0; c < values.Length; c++)
        {
            if (_columns[c].Kind != ColumnKind.Double)
                throw new InvalidOperationException($"column '{_columns[c].Name}' is not floating point");
            _doubles[c][_row] = values[c];
        }
        EndRow();
    }

    private void Flush()
    {
        if (_row == 0) return;
        using (var rg = _writer.CreateRowGroup())
        {
            for (int c = 0; c < _fields.Length; c++)
            {
                switch (_columns[c].Kind)
                {
                    case ColumnKind.Double:
                        rg.WriteAsync<double>(_fields[c], _doubles[c].AsMemory(0, _row)).GetAwaiter().GetResult();
                        break;
                    case ColumnKind.Int64:
                        rg.WriteAsync<long>(_fields[c], _longs[c].AsMemory(0, _row)).GetAwaiter().GetResult();
                        break;
                    default:
                        rg.WriteAsync(_fields[c], new ArraySegment<string>(_texts[c], 0, _row)).GetAwaiter().GetResult();
                        break;
                }
            }
        }
        _rowsWritten += _row;
        _row = 0;
    }

    /// <summary>Writes the remaining rows, closes the file and renames it to its final name (replacing any file there).</summary>
    public void Complete()
    {
        ObjectDisposedException.ThrowIf(_disposed, this);
        Flush();
        _writer.DisposeAsync().AsTask().GetAwaiter().GetResult();
        _stream.Flush(flushToDisk: true);
        _stream.Dispose();
        File.Move(_tempPath, _path, overwrite: true);
        _completed = true;
        _disposed = true;
    }

    /// <summary>Abandons an incomplete table: the temporary file is removed, nothing appears at the target.</summary>
    public void Dispose()
    {
        if (_disposed) return;
        _disposed = true;
        try { _writer.DisposeAsync().AsTask().GetAwaiter().GetResult(); } catch (IOException) { } catch (InvalidOperationException) { }
        _stream.Dispose();
        if (!_completed && File.Exists(_tempPath)) File.Delete(_tempPath);
    }
}
