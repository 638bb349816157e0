using System.Globalization;
using Parquet;
using Parquet.Schema;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// Orbital elements from an imported table (for users who bring a longer or different solution), with
/// columns <c>age_ka, eccentricity, obliquity_deg, perihelion_deg</c>. Between rows, e·sin ϖ, e·cos ϖ and ε
/// are interpolated by not-a-knot cubic splines in time (never ϖ itself, which wraps at 360°); e and ϖ are
/// recovered as hypot and atan2. Times outside the table are refused, never extrapolated.
/// </summary>
/// <remarks>
/// <para>Columns: <c>age_ka</c> in thousands of years before 1950 (positive into the past), rows sorted by age
/// (increasing or decreasing) without duplicates; <c>eccentricity</c> in [0, 1); <c>obliquity_deg</c> in [0, 90];
/// <c>perihelion_deg</c> in [0, 360], Berger's longitude of perihelion from the moving vernal equinox
/// (102.04° in 1950; the Sun's longitude at perihelion minus 180°). Other columns are ignored. At least 4 rows.</para>
/// <para>CSV: comma-separated with a header row, '.' decimal separator; blank lines and lines starting with '#' are skipped.
/// Parquet: the four columns as double or float, without nulls.</para>
/// </remarks>
public sealed class TabulatedOrbit : IOrbitSource
{
    /// <summary>The column names an imported table must have.</summary>
    public static IReadOnlyList<string> RequiredColumns { get; } = ["age_ka", "eccentricity", "obliquity_deg", "perihelion_deg"];

    /// <summary>Fewest rows a table may have (the cubic interpolant needs four).</summary>
    public const int MinimumRows = 4;

    /// <summary>Row spacing (kyr) above which precession (periods of 19–24 kyr) is poorly resolved and a warning is given.</summary>
    public const double CoarseSpacingKyr = 2.0;

    private readonly CubicSpline _spline;
    private readonly double _slack;

    private TabulatedOrbit(string source, double[] ageKa, double[] eccentricity, double[] obliquityDeg, double[] perihelionDeg)
    {
        Source = source;
        int n = ageKa.Length;
        // Store in increasing time t = −1000·age.
        bool ascendingAge = ageKa[1] > ageKa[0];
        var t = new double[n];
        var eSin = new double[n];
        var eCos = new double[n];
        var obl = new double[n];
        for (int k = 0; k < n; k++)
        {
            int i = ascendingAge ? n - 1 - k : k;
            t[k] = IOrbitSource.YearsFromAgeKa(ageKa[i]);
            (double s, double c) = Math.SinCos(perihelionDeg[i] * Angles.DegToRad);
            eSin[k] = eccentricity[i] * s;
            eCos[k] = eccentricity[i] * c;
            obl[k] = obliquityDeg[i];
        }
        _spline = new CubicSpline(t, [eSin, eCos, obl]);
        StartYears = t[0];
        EndYears = t[^1];
        RowCount = n;
        _slack = 1e-12 * Math.Max(1.0, Math.Max(Math.Abs(StartYears), Math.Abs(EndYears)));

        var warnings = new List<string>();
        double maxGapKyr = 0;
        for (int k = 1; k < n; k++) maxGapKyr = Math.Max(maxGapKyr, (t[k] - t[k - 1]) / 1000.0);
        if (maxGapKyr > CoarseSpacingKyr)
            warnings.Add(string.Create(CultureInfo.InvariantCulture,
                $"{source}: rows are up to {maxGapKyr:0.###} kyr apart; climatic precession (periods 19–24 kyr) is poorly resolved by interpolation beyond about {CoarseSpacingKyr} kyr."));
        if (StartYears <= 0 && EndYears >= 0)
        {
            OrbitalElements now = At(0);
            double offset = Math.Abs(Math.IEEERemainder(now.PerihelionDeg - 102.04, 360.0));
            if (now.Eccentricity > 0.005 && offset > 30.0)
                warnings.Add(string.Create(CultureInfo.InvariantCulture,
                    $"{source}: perihelion_deg at 0 ka is {now.PerihelionDeg:0.##}°, far from Berger's 102.04° (1950); the table may use another convention (e.g. the Sun's longitude at perihelion, ϖ + 180°)."));
        }
        Warnings = warnings;
    }

    /// <summary>Where the table came from (file path, or the description given to <see cref="FromRows"/>).</summary>
    public string Source { get; }

    /// <summary>Number of rows.</summary>
    public int RowCount { get; }

    /// <summary>Earliest time covered, years relative to 1950 (the oldest age).</summary>
    public double StartYears { get; }

    /// <summary>Latest time covered, years relative to 1950 (the youngest age).</summary>
    public double EndYears { get; }

    /// <summary>Oldest age in the table, ka.</summary>
    public double MaxAgeKa => IOrbitSource.AgeKaFromYears(StartYears);

    /// <summary>Youngest age in the table, ka.</summary>
    public double MinAgeKa => IOrbitSource.AgeKaFromYears(EndYears);

    /// <summary>Warnings about the table found on import (coarse rows, a suspicious perihelion convention); also returned by <see cref="CheckRange"/>.</summary>
    public IReadOnlyList<string> Warnings { get; }

    /// <inheritdoc/>
    public string Description => string.Create(CultureInfo.InvariantCulture,
        $"tabulated orbital solution from {Source} ({RowCount} rows, {MinAgeKa:0.###}–{MaxAgeKa:0.###} ka; e·sin ϖ, e·cos ϖ and ε cubic-spline interpolated)");

    /// <inheritdoc/>
    public OrbitalElements At(double yearsSince1950)
    {
        IOrbitSource.ValidateTime(yearsSince1950);
        if (!(yearsSince1950 >= StartYears - _slack && yearsSince1950 <= EndYears + _slack))
            throw OutOfTable(yearsSince1950, nameof(yearsSince1950));
        _spline.Evaluate3(yearsSince1950, out double eSin, out double eCos, out double obliquity);
        return OrbitalElements.FromComponents(eSin, eCos, obliquity);
    }

    /// <inheritdoc/>
    public IReadOnlyList<string> CheckRange(double tStartYears, double tEndYears)
    {
        IOrbitSource.ValidateSpan(tStartYears, tEndYears);
        if (tStartYears < StartYears - _slack) throw OutOfTable(tStartYears, nameof(tStartYears));
        if (tEndYears > EndYears + _slack) throw OutOfTable(tEndYears, nameof(tEndYears));
        return Warnings;
    }

    private ArgumentOutOfRangeException OutOfTable(double t, string parameter) =>
        new(parameter, t, string.Create(CultureInfo.InvariantCulture,
            $"{parameter} = {t:R} years (age {IOrbitSource.AgeKaFromYears(t):0.###} ka) is outside the table {Source}, which covers {MinAgeKa:0.###} to {MaxAgeKa:0.###} ka; tabulated solutions are not extrapolated."));

    // ------------------------------------------------------------------ constructors from data

    /// <summary>
    /// A table from arrays (same length, one entry per row); validated as described in the class remarks.
    /// </summary>
    /// <param name="source">Name used in messages and the description.</param>
    /// <param name="ageKa">Ages in ka before 1950 (positive into the past), sorted, no duplicates.</param>
    /// <param name="eccentricity">Eccentricity per row, in [0, 1).</param>
    /// <param name="obliquityDeg">Obliquity per row, degrees in [0, 90].</param>
    /// <param name="perihelionDeg">Longitude of perihelion ϖ per row (Berger's convention), degrees in [0, 360].</param>
    public static TabulatedOrbit FromRows(string source, IReadOnlyList<double> ageKa, IReadOnlyList<double> eccentricity, IReadOnlyList<double> obliquityDeg, IReadOnlyList<double> perihelionDeg)
    {
        ArgumentNullException.ThrowIfNull(source);
        ArgumentNullException.ThrowIfNull(ageKa);
        ArgumentNullException.ThrowIfNull(eccentricity);
        ArgumentNullException.ThrowIfNull(obliquityDeg);
        ArgumentNullException.ThrowIfNull(perihelionDeg);
        int n = ageKa.Count;
        if (eccentricity.Count != n || obliquityDeg.Count != n || perihelionDeg.Count != n)
            throw new ArgumentException($"{source}: columns have different lengths (age_ka {n}, eccentricity {eccentricity.Count}, obliquity_deg {obliquityDeg.Count}, perihelion_deg {perihelionDeg.Count}).");
        return Validated(source, [.. ageKa], [.. eccentricity], [.. obliquityDeg], [.. perihelionDeg], row => $"row {row + 1}");
    }

    /// <summary>Reads a CSV table with the columns <see cref="RequiredColumns"/> (see the class remarks).</summary>
    /// <exception cref="FileNotFoundException">The file does not exist.</exception>
    /// <exception cref="FormatException">The file is malformed or its values are invalid; the message names the file, line and column.</exception>
    public static TabulatedOrbit FromCsv(string path)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (!File.Exists(path)) throw new FileNotFoundException($"Orbital table '{path}' does not exist.", path);
        using var reader = new StreamReader(path);
        return FromCsv(reader, path);
    }

    /// <summary>Reads a CSV table from <paramref name="reader"/>; <paramref name="source"/> names it in messages.</summary>
    public static TabulatedOrbit FromCsv(TextReader reader, string source)
    {
        ArgumentNullException.ThrowIfNull(reader);
        ArgumentNullException.ThrowIfNull(source);
        NumericCsv table = NumericCsv.Parse(reader, source);
        int[] columns = RequiredColumns.Select(table.Column).ToArray();
        int n = table.Rows.Count;
        var cols = new double[4][];
        for (int c = 0; c < 4; c++)
        {
            cols[c] = new double[n];
            for (int r = 0; r < n; r++) cols[c][r] = table.Rows[r][columns[c]];
        }
        return Validated(source, cols[0], cols[1], cols[2], cols[3], row => $"line {table.LineNumbers[row]}");
    }

    /// <summary>Reads a Parquet table with the columns <see cref="RequiredColumns"/> (double or float, no nulls).</summary>
    public static TabulatedOrbit FromParquet(string path) => FromParquetAsync(path).GetAwaiter().GetResult();

    /// <summary>Reads a Parquet table with the columns <see cref="RequiredColumns"/> (double or float, no nulls).</summary>
    /// <exception cref="FileNotFoundException">The file does not exist.</exception>
    /// <exception cref="FormatException">A column is missing, of another type, contains nulls, or a value is invalid.</exception>
    public static async Task<TabulatedOrbit> FromParquetAsync(string path, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(path);
        if (!File.Exists(path)) throw new FileNotFoundException($"Orbital table '{path}' does not exist.", path);
        await using FileStream stream = File.OpenRead(path);
        ParquetReader reader;
        try
        {
            reader = await ParquetReader.CreateAsync(stream, cancellationToken: cancellationToken).ConfigureAwait(false);
        }
        catch (Exception ex) when (ex is IOException or InvalidDataException or NotSupportedException or InvalidOperationException or ArgumentException)
        {
            throw new FormatException($"{path}: not a readable Parquet file ({ex.Message}).", ex);
        }
        await using (reader)
        {
            DataField[] fields = reader.Schema.GetDataFields();
            var wanted = new DataField[4];
            for (int c = 0; c < 4; c++)
            {
                wanted[c] = fields.FirstOrDefault(f => string.Equals(f.Name, RequiredColumns[c], StringComparison.OrdinalIgnoreCase))
                    ?? throw new FormatException($"{path}: required column '{RequiredColumns[c]}' is missing; the file has: {string.Join(", ", fields.Select(f => $"'{f.Name}'"))}.");
                Type clr = wanted[c].ClrType;
                if (clr != typeof(double) && clr != typeof(float))
                    throw new FormatException($"{path}: column '{wanted[c].Name}' has type {clr.Name}; orbital columns must be double or float.");
            }
            var columns = new List<double>[4];
            for (int c = 0; c < 4; c++) columns[c] = [];
            for (int g = 0; g < reader.RowGroupCount; g++)
            {
                using ParquetRowGroupReader rowGroup = reader.OpenRowGroupReader(g);
                int rows = checked((int)rowGroup.RowCount);
                for (int c = 0; c < 4; c++)
                    await ReadColumnAsync(rowGroup, wanted[c], rows, columns[c], path, cancellationToken).ConfigureAwait(false);
            }
            return Validated(path, [.. columns[0]], [.. columns[1]], [.. columns[2]], [.. columns[3]], row => $"row {row + 1}");
        }
    }

    private static async Task ReadColumnAsync(ParquetRowGroupReader rowGroup, DataField field, int rows, List<double> into, string path, CancellationToken ct)
    {
        int firstRow = into.Count;
        if (field.ClrType == typeof(double))
        {
            if (field.IsNullable)
            {
                var buffer = new double?[rows];
                await rowGroup.ReadAsync<double>(field, buffer.AsMemory(), null, ct).ConfigureAwait(false);
                for (int i = 0; i < rows; i++)
                    into.Add(buffer[i] ?? throw new FormatException($"{path}: column '{field.Name}' is null in row {firstRow + i + 1}; orbital tables must be complete."));
            }
            else
            {
                var buffer = new double[rows];
                await rowGroup.ReadAsync<double>(field, buffer.AsMemory(), null, ct).ConfigureAwait(false);
                into.AddRange(buffer);
            }
        }
        else
        {
            if (field.IsNullable)
            {
                var buffer = new float?[rows];
                await rowGroup.ReadAsync<float>(field, buffer.AsMemory(), null, ct).ConfigureAwait(false);
                for (int i = 0; i < rows; i++)
                    into.Add(buffer[i] ?? throw new FormatException($"{path}: column '{field.Name}' is null in row {firstRow + i + 1}; orbital tables must be complete."));
            }
            else
            {
                var buffer = new float[rows];
                await rowGroup.ReadAsync<float>(field, buffer.AsMemory(), null, ct).ConfigureAwait(false);
                foreach (float v in buffer) into.Add(v);
            }
        }
    }

    /// <summary>Checks every row and builds the orbit; <paramref name="where"/> names a row (by index) in messages.</summary>
    private static TabulatedOrbit Validated(string source, double[] age, double[] ecc, double[] obl, double[] peri, Func<int, string> where)
    {
        int n = age.Length;
        if (n < MinimumRows)
            throw new FormatException($"{source}: {n} rows; an orbital table needs at least {MinimumRows} rows for cubic interpolation.");
        for (int r = 0; r < n; r++)
        {
            CheckFinite(source, where(r), "age_ka", age[r]);
            CheckFinite(source, where(r), "eccentricity", ecc[r]);
            CheckFinite(source, where(r), "obliquity_deg", obl[r]);
            CheckFinite(source, where(r), "perihelion_deg", peri[r]);
            if (!(ecc[r] >= 0.0 && ecc[r] < 1.0))
                throw new FormatException(Invariant($"{source}, {where(r)}: eccentricity = {ecc[r]:R} is out of range; allowed 0 ≤ e < 1."));
            if (!(obl[r] >= 0.0 && obl[r] <= 90.0))
                throw new FormatException(Invariant($"{source}, {where(r)}: obliquity_deg = {obl[r]:R} is out of range; allowed [0, 90] degrees."));
            if (!(peri[r] >= 0.0 && peri[r] <= 360.0))
                throw new FormatException(Invariant($"{source}, {where(r)}: perihelion_deg = {peri[r]:R} is out of range; allowed [0, 360] degrees (Berger's ϖ from the moving vernal equinox, 102.04° in 1950)."));
        }
        double direction = Math.Sign(age[1] - age[0]);
        for (int r = 1; r < n; r++)
        {
            if (age[r] == age[r - 1])
                throw new FormatException(Invariant($"{source}, {where(r)}: age_ka = {age[r]:R} duplicates the previous row; each age may appear once."));
            if (Math.Sign(age[r] - age[r - 1]) != direction)
                throw new FormatException(Invariant($"{source}, {where(r)}: age_ka = {age[r]:R} after {age[r - 1]:R} breaks the {(direction > 0 ? "increasing" : "decreasing")} order; rows must be sorted by age_ka."));
        }
        return new TabulatedOrbit(source, age, ecc, obl, peri);
    }

    private static void CheckFinite(string source, string where, string column, double value)
    {
        if (!double.IsFinite(value))
            throw new FormatException(Invariant($"{source}, {where}: {column} = {value} is not a finite number."));
    }

    private static string Invariant(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}
