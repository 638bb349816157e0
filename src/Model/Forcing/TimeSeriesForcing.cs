using System.Globalization;
using Parquet;
using Parquet.Schema;
using Thermostrat.Model.Configuration;

namespace Thermostrat.Model.Forcing;

/// <summary>
/// A scalar forcing (CO2, sea level) as a function of model time: a constant, or a validated time series
/// from a CSV or Parquet file, linearly interpolated between rows.
/// </summary>
/// <remarks>
/// Files have a time column — <c>age_ka</c> (thousands of years before 1950, positive into the past) or
/// <c>time_yr</c> (years since the start of the run) — and a value column. Rows may be in increasing or
/// decreasing time but must be strictly monotonic; every value must be present (an empty cell or a null
/// is a gap) and finite; consecutive rows may be at most the configured gap apart; and the series must
/// cover the whole run. Each violation is a <see cref="ConfigurationException"/> naming the key, the file,
/// the row and what is allowed.
/// </remarks>
public sealed class TimeSeriesForcing
{
    private readonly double[] _t, _v;

    private TimeSeriesForcing(double[] t, double[] v, string description)
    {
        _t = t;
        _v = v;
        Description = description;
    }

    /// <summary>What the series is (for output metadata).</summary>
    public string Description { get; }

    /// <summary>A constant series.</summary>
    public static TimeSeriesForcing Constant(double value, string unit) =>
        new([0.0], [value], string.Create(CultureInfo.InvariantCulture, $"constant {value} {unit}"));

    /// <summary>Value at model time <paramref name="timeYears"/> (years since the run start); held at the end values outside the rows.</summary>
    public double ValueAt(double timeYears)
    {
        var t = _t;
        if (t.Length == 1 || timeYears <= t[0]) return _v[0];
        if (timeYears >= t[^1]) return _v[^1];
        int hi = Array.BinarySearch(t, timeYears);
        if (hi >= 0) return _v[hi];
        hi = ~hi;
        int lo = hi - 1;
        return _v[lo] + (_v[hi] - _v[lo]) * (timeYears - t[lo]) / (t[hi] - t[lo]);
    }

    /// <summary>
    /// Reads and validates a series.
    /// </summary>
    /// <param name="path">CSV (".csv") or Parquet (".parquet") file.</param>
    /// <param name="column">Value column name.</param>
    /// <param name="key">Configuration key of the file option, for messages (e.g. "Model:Forcing:Co2:File").</param>
    /// <param name="maxGapKyr">Largest allowed spacing between consecutive rows (kyr).</param>
    /// <param name="startAgeKa">Age at the start of the run (ka).</param>
    /// <param name="durationYears">Length of the run (years).</param>
    /// <param name="unit">Unit of the values (for the description).</param>
    public static TimeSeriesForcing FromFile(string path, string column, string key, double maxGapKyr, double startAgeKa, double durationYears, string unit)
    {
        if (!File.Exists(path)) throw new ConfigurationException($"{key} = '{path}': file not found");
        (string timeName, double[] time, double[] value, Func<int, string> where) = Path.GetExtension(path).ToLowerInvariant() switch
        {
            ".csv" or ".txt" => ReadCsv(path, column, key),
            ".parquet" => ReadParquet(path, column, key),
            var ext => throw new ConfigurationException($"{key} = '{path}': unknown file type '{ext}'; allowed: .csv or .parquet"),
        };
        int n = time.Length;
        if (n < 2) throw new ConfigurationException($"{key} = '{path}': {n} row(s); a time series needs at least 2 rows");
        for (int i = 0; i < n; i++)
        {
            if (!double.IsFinite(time[i])) throw new ConfigurationException($"{key} = '{path}', {where(i)}: {timeName} = {time[i]} is not finite; allowed: finite numbers");
            if (!double.IsFinite(value[i])) throw new ConfigurationException($"{key} = '{path}', {where(i)}: {column} = {value[i]} is not finite; allowed: finite numbers");
        }
        // Model time (years since the run start) of each row.
        bool ages = timeName == "age_ka";
        var t = new double[n];
        for (int i = 0; i < n; i++) t[i] = ages ? (startAgeKa - time[i]) * 1000.0 : time[i];
        int direction = Math.Sign(t[1] - t[0]);
        for (int i = 1; i < n; i++)
        {
            double step = t[i] - t[i - 1];
            if (direction == 0 || Math.Sign(step) != direction)
                throw new ConfigurationException($"{key} = '{path}', {where(i)}: {timeName} = {Show(time[i])} after {Show(time[i - 1])} is {(step == 0 ? "a repeated time" : "out of order")}; allowed: rows in strictly increasing or strictly decreasing {timeName}");
            if (Math.Abs(step) > maxGapKyr * 1000.0)
                throw new ConfigurationException($"{key} = '{path}', {where(i)}: a gap of {Show(Math.Abs(step) / 1000.0)} kyr after {timeName} = {Show(time[i - 1])}; allowed: rows at most {Show(maxGapKyr)} kyr apart (the key's MaxGap_kyr)");
        }
        if (direction < 0)
        {
            Array.Reverse(t);
            Array.Reverse(value);
        }
        const double slack = 1e-9;
        if (t[0] > slack || t[^1] < durationYears - slack)
        {
            string need = ages
                ? string.Create(CultureInfo.InvariantCulture, $"ages {startAgeKa} to {startAgeKa - durationYears / 1000.0} ka")
                : string.Create(CultureInfo.InvariantCulture, $"years 0 to {durationYears}");
            string has = ages
                ? string.Create(CultureInfo.InvariantCulture, $"ages {startAgeKa - t[0] / 1000.0} to {startAgeKa - t[^1] / 1000.0} ka")
                : string.Create(CultureInfo.InvariantCulture, $"years {t[0]} to {t[^1]}");
            throw new ConfigurationException($"{key} = '{path}' covers {has} but the run needs {need}; allowed: a series covering the whole run");
        }
        return new TimeSeriesForcing(t, value, string.Create(CultureInfo.InvariantCulture, $"{column} from {path} ({n} rows, linear interpolation)"));
    }

    private static string Show(double v) => v.ToString("R", CultureInfo.InvariantCulture);

    private static (string, double[], double[], Func<int, string>) ReadCsv(string path, string column, string key)
    {
        string[]? header = null;
        int timeCol = -1, valueCol = -1;
        var time = new List<double>();
        var value = new List<double>();
        var lines = new List<int>();
        int lineNumber = 0;
        foreach (string raw in File.ReadLines(path))
        {
            lineNumber++;
            string line = raw.Trim();
            if (line.Length == 0 || line[0] == '#') continue;
            string[] cells = line.Split(',');
            for (int i = 0; i < cells.Length; i++) cells[i] = cells[i].Trim().Trim('"').Trim();
            if (header is null)
            {
                header = cells;
                timeCol = Array.FindIndex(header, h => h.Equals("age_ka", StringComparison.OrdinalIgnoreCase));
                if (timeCol < 0) timeCol = Array.FindIndex(header, h => h.Equals("time_yr", StringComparison.OrdinalIgnoreCase));
                valueCol = Array.FindIndex(header, h => h.Equals(column, StringComparison.OrdinalIgnoreCase));
                if (timeCol < 0)
                    throw new ConfigurationException($"{key} = '{path}': no time column; allowed: 'age_ka' (ka before 1950) or 'time_yr' (years since the run start); the header has: {string.Join(", ", header)}");
                if (valueCol < 0)
                    throw new ConfigurationException($"{key} = '{path}': no column '{column}'; the header has: {string.Join(", ", header)}");
                continue;
            }
            time.Add(Cell(cells, timeCol, header, lineNumber, path, key));
            value.Add(Cell(cells, valueCol, header, lineNumber, path, key));
            lines.Add(lineNumber);
        }
        if (header is null) throw new ConfigurationException($"{key} = '{path}': the file is empty; expected a header row and data rows");
        return (header[timeCol].ToLowerInvariant(), [.. time], [.. value], i => $"line {lines[i]}");
    }

    private static double Cell(string[] cells, int col, string[] header, int line, string path, string key)
    {
        string text = col < cells.Length ? cells[col] : "";
        if (text.Length == 0)
            throw new ConfigurationException($"{key} = '{path}', line {line}: column '{header[col]}' is empty (a gap in the record); allowed: a value in every row");
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out double v))
            throw new ConfigurationException($"{key} = '{path}', line {line}: column '{header[col]}' = '{text}' is not a number (use '.' as the decimal separator)");
        return v;
    }

    private static (string, double[], double[], Func<int, string>) ReadParquet(string path, string column, string key) =>
        ReadParquetAsync(path, column, key).GetAwaiter().GetResult();

    private static async Task<(string, double[], double[], Func<int, string>)> ReadParquetAsync(string path, string column, string key)
    {
        await using FileStream stream = File.OpenRead(path);
        ParquetReader reader;
        try
        {
            reader = await ParquetReader.CreateAsync(stream).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is IOException or InvalidDataException or NotSupportedException or InvalidOperationException or ArgumentException)
        {
            throw new ConfigurationException($"{key} = '{path}': not a readable Parquet file ({ex.Message})");
        }
        await using (reader)
        {
            DataField[] fields = reader.Schema.GetDataFields();
            DataField timeField = fields.FirstOrDefault(f => f.Name.Equals("age_ka", StringComparison.OrdinalIgnoreCase))
                ?? fields.FirstOrDefault(f => f.Name.Equals("time_yr", StringComparison.OrdinalIgnoreCase))
                ?? throw new ConfigurationException($"{key} = '{path}': no time column; allowed: 'age_ka' or 'time_yr'; the file has: {string.Join(", ", fields.Select(f => f.Name))}");
            DataField valueField = fields.FirstOrDefault(f => f.Name.Equals(column, StringComparison.OrdinalIgnoreCase))
                ?? throw new ConfigurationException($"{key} = '{path}': no column '{column}'; the file has: {string.Join(", ", fields.Select(f => f.Name))}");
            var time = new List<double>();
            var value = new List<double>();
            for (int g = 0; g < reader.RowGroupCount; g++)
            {
                using ParquetRowGroupReader rowGroup = reader.OpenRowGroupReader(g);
                int rows = checked((int)rowGroup.RowCount);
                await ReadColumnAsync(rowGroup, timeField, rows, time, path, key).ConfigureAwait(false);
                await ReadColumnAsync(rowGroup, valueField, rows, value, path, key).ConfigureAwait(false);
            }
            return (timeField.Name.ToLowerInvariant(), [.. time], [.. value], i => $"row {i + 1}");
        }
    }

    private static async Task ReadColumnAsync(ParquetRowGroupReader rowGroup, DataField field, int rows, List<double> into, string path, string key)
    {
        int first = into.Count;
        string Gap(int i) => $"{key} = '{path}', row {first + i + 1}: column '{field.Name}' is null (a gap in the record); allowed: a value in every row";
        if (field.ClrType == typeof(double))
        {
            if (field.IsNullable)
            {
                var b = new double?[rows];
                await rowGroup.ReadAsync<double>(field, b.AsMemory(), null, CancellationToken.None).ConfigureAwait(false);
                for (int i = 0; i < rows; i++) into.Add(b[i] ?? throw new ConfigurationException(Gap(i)));
            }
            else
            {
                var b = new double[rows];
                await rowGroup.ReadAsync<double>(field, b.AsMemory(), null, CancellationToken.None).ConfigureAwait(false);
                into.AddRange(b);
            }
        }
        else if (field.ClrType == typeof(float))
        {
            if (field.IsNullable)
            {
                var b = new float?[rows];
                await rowGroup.ReadAsync<float>(field, b.AsMemory(), null, CancellationToken.None).ConfigureAwait(false);
                for (int i = 0; i < rows; i++) into.Add(b[i] ?? throw new ConfigurationException(Gap(i)));
            }
            else
            {
                var b = new float[rows];
                await rowGroup.ReadAsync<float>(field, b.AsMemory(), null, CancellationToken.None).ConfigureAwait(false);
                foreach (float v in b) into.Add(v);
            }
        }
        else
        {
            throw new ConfigurationException($"{key} = '{path}': column '{field.Name}' has type {field.ClrType.Name}; allowed: double or float");
        }
    }
}
