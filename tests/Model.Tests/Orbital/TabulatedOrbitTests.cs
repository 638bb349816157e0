using System.Globalization;
using Parquet;
using Parquet.Schema;
using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

/// <summary>Import of tabulated orbital solutions (CSV and Parquet): fidelity, conventions and error cases.</summary>
public sealed class TabulatedOrbitTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("thermostrat-orbital-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    /// <summary>Rows sampled from the Berger (1978) series every <paramref name="stepKa"/> from 0 to <paramref name="maxKa"/>.</summary>
    private static List<(double Age, OrbitalElements O)> BergerRows(double maxKa, double stepKa)
    {
        var rows = new List<(double, OrbitalElements)>();
        for (double a = 0; a <= maxKa + 1e-9; a += stepKa) rows.Add((a, Berger1978Orbit.Shared.At(IOrbitSource.YearsFromAgeKa(a))));
        return rows;
    }

    private string WriteCsv(string name, IEnumerable<string> lines)
    {
        string path = Path.Combine(_dir, name);
        File.WriteAllLines(path, lines);
        return path;
    }

    private string WriteCsv(string name, IEnumerable<(double Age, OrbitalElements O)> rows) =>
        WriteCsv(name, new[] { "age_ka,eccentricity,obliquity_deg,perihelion_deg" }
            .Concat(rows.Select(r => string.Create(CultureInfo.InvariantCulture, $"{r.Age:R},{r.O.Eccentricity:R},{r.O.ObliquityDeg:R},{r.O.PerihelionDeg:R}"))));

    private static string Lines(params string[] rows) => string.Join("\n", rows);

    private static FormatException ImportError(string csv) =>
        Assert.Throws<FormatException>(() => TabulatedOrbit.FromCsv(new StringReader(csv), "test.csv"));

    [Fact]
    public void Csv_table_reproduces_the_solution_it_was_sampled_from()
    {
        // A table sampled from Berger (1978) every 1 kyr: exact at the rows, and between rows the cubic
        // interpolation of e·sin ϖ, e·cos ϖ and ε stays within ~1e-5 of the series (precession periods ≥ 19 kyr).
        var rows = BergerRows(300, 1);
        var orbit = TabulatedOrbit.FromCsv(WriteCsv("berger.csv", rows));
        Assert.Equal(rows.Count, orbit.RowCount);
        Assert.Equal(0.0, orbit.MinAgeKa);
        Assert.Equal(300.0, orbit.MaxAgeKa, 1e-9);
        Assert.Empty(orbit.Warnings);
        foreach (var (age, o) in rows.Where((_, i) => i % 17 == 0))
        {
            OrbitalElements t = orbit.At(IOrbitSource.YearsFromAgeKa(age));
            Assert.Equal(o.Eccentricity, t.Eccentricity, 1e-12);
            Assert.Equal(o.ObliquityDeg, t.ObliquityDeg, 1e-10);
            Assert.Equal(0.0, Math.IEEERemainder(o.PerihelionDeg - t.PerihelionDeg, 360), 1e-8);
        }
        for (double age = 0.25; age < 300; age += 3.1)
        {
            OrbitalElements b = Berger1978Orbit.Shared.At(IOrbitSource.YearsFromAgeKa(age));
            OrbitalElements t = orbit.At(IOrbitSource.YearsFromAgeKa(age));
            Assert.Equal(b.ClimaticPrecession, t.ClimaticPrecession, 2e-5);
            Assert.Equal(b.EccentricityCosPerihelion, t.EccentricityCosPerihelion, 2e-5);
            Assert.Equal(b.ObliquityDeg, t.ObliquityDeg, 1e-4);
        }
    }

    [Fact]
    public void Perihelion_is_never_interpolated_across_its_wrap()
    {
        // ϖ advancing 5° per row through 360°: halfway between 355° and 0° it must be 357.5°, not ~177.5°.
        string csv = Lines("age_ka,eccentricity,obliquity_deg,perihelion_deg",
            "0,0.02,23,345", "1,0.02,23,350", "2,0.02,23,355", "3,0.02,23,0", "4,0.02,23,5", "5,0.02,23,10");
        var orbit = TabulatedOrbit.FromCsv(new StringReader(csv), "wrap.csv");
        OrbitalElements mid = orbit.At(IOrbitSource.YearsFromAgeKa(2.5));
        Assert.Equal(357.5, mid.PerihelionDeg, 0.01);
        Assert.Equal(0.02, mid.Eccentricity, 1e-5);
    }

    [Fact]
    public void Ages_may_be_listed_oldest_first()
    {
        var rows = BergerRows(50, 1);
        var ascending = TabulatedOrbit.FromCsv(WriteCsv("up.csv", rows));
        var descending = TabulatedOrbit.FromCsv(WriteCsv("down.csv", Enumerable.Reverse(rows)));
        for (double age = 0; age <= 50; age += 0.7)
            Assert.Equal(ascending.At(-1000 * age), descending.At(-1000 * age));
    }

    [Fact]
    public void Extra_columns_comments_and_quoted_headers_are_accepted()
    {
        string csv = Lines("# a test table", "\"age_ka\", \"Eccentricity\", obliquity_deg, perihelion_deg, note_code",
            "0,0.0167,23.44,102.0,1", "", "1,0.0168,23.45,104.0,2", "2,0.0169,23.46,106.0,3", "3,0.0170,23.47,108.0,4");
        var orbit = TabulatedOrbit.FromCsv(new StringReader(csv), "extra.csv");
        Assert.Equal(4, orbit.RowCount);
        Assert.Equal(0.0168, orbit.At(-1000).Eccentricity, 1e-12);
    }

    [Fact]
    public void Tables_are_not_extrapolated()
    {
        var orbit = TabulatedOrbit.FromCsv(WriteCsv("short.csv", BergerRows(20, 1)));
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => orbit.At(IOrbitSource.YearsFromAgeKa(20.5)));
        Assert.Contains("not extrapolated", ex.Message);
        Assert.Contains("0 to 20 ka", ex.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => orbit.At(100.0)); // the future, after 1950
        Assert.Throws<ArgumentOutOfRangeException>(() => orbit.CheckRange(-25_000, 0));
        Assert.Empty(orbit.CheckRange(-20_000, 0));
    }

    [Theory]
    [InlineData("0,0.02,23,10|2,0.02,23,12|1,0.02,23,11|3,0.02,23,13", "line 4", "order")]
    [InlineData("0,0.02,23,10|1,0.02,23,11|1,0.02,23,12|3,0.02,23,13", "line 4", "duplicates")]
    [InlineData("0,0.02,23,10|1,1.2,23,11|2,0.02,23,12|3,0.02,23,13", "line 3", "eccentricity = 1.2")]
    [InlineData("0,-0.01,23,10|1,0.02,23,11|2,0.02,23,12|3,0.02,23,13", "line 2", "eccentricity = -0.01")]
    [InlineData("0,0.02,23,10|1,0.02,95,11|2,0.02,23,12|3,0.02,23,13", "line 3", "obliquity_deg = 95")]
    [InlineData("0,0.02,23,10|1,0.02,23,11|2,0.02,23,-12|3,0.02,23,13", "line 4", "perihelion_deg = -12")]
    [InlineData("0,0.02,23,10|1,0.02,23,11|2,0.02,23,400|3,0.02,23,13", "line 4", "perihelion_deg = 400")]
    [InlineData("0,0.02,23,10|1,NaN,23,11|2,0.02,23,12|3,0.02,23,13", "line 3", "eccentricity = NaN")]
    [InlineData("0,0.02,23,10|1,0.02,23,11|Infinity,0.02,23,12|3,0.02,23,13", "line 4", "age_ka")]
    [InlineData("0,0.02,23,10|1,0.02,abc,11|2,0.02,23,12|3,0.02,23,13", "line 3", "'abc' is not a number")]
    [InlineData("0,0.02,23,10|1,0.02,23|2,0.02,23,12|3,0.02,23,13", "line 3", "3 values")]
    [InlineData("0,0.02,23,10|1,0.02,23,11|2,0.02,23,12", "3 rows", "at least 4")]
    public void Bad_rows_give_a_clear_error(string rows, string where, string what)
    {
        FormatException ex = ImportError("age_ka,eccentricity,obliquity_deg,perihelion_deg\n" + rows.Replace('|', '\n'));
        Assert.Contains("test.csv", ex.Message);
        Assert.Contains(where, ex.Message);
        Assert.Contains(what, ex.Message);
    }

    [Fact]
    public void Missing_column_and_missing_file_are_reported()
    {
        FormatException ex = ImportError("age_ka,eccentricity,obliquity_deg\n0,0.02,23\n1,0.02,23\n2,0.02,23\n3,0.02,23");
        Assert.Contains("'perihelion_deg' is missing", ex.Message);
        Assert.Contains("'obliquity_deg'", ex.Message);
        Assert.Throws<FileNotFoundException>(() => TabulatedOrbit.FromCsv(Path.Combine(_dir, "absent.csv")));
        Assert.Contains("empty", ImportError("").Message);
    }

    [Fact]
    public void Coarse_rows_and_a_suspicious_perihelion_convention_give_warnings()
    {
        var coarse = TabulatedOrbit.FromCsv(WriteCsv("coarse.csv", BergerRows(100, 5)));
        Assert.Contains(coarse.Warnings, w => w.Contains("5 kyr apart"));
        Assert.Equal(coarse.Warnings, coarse.CheckRange(-50_000, 0));

        // The Sun's longitude at perihelion (ϖ + 180° ≈ 282°) written instead of Berger's ϖ (102°).
        var shifted = BergerRows(20, 1).Select(r => (r.Age, r.O with { PerihelionDeg = (r.O.PerihelionDeg + 180) % 360 }));
        var wrong = TabulatedOrbit.FromCsv(WriteCsv("shifted.csv", shifted));
        Assert.Contains(wrong.Warnings, w => w.Contains("102.04") && w.Contains("convention"));
    }

    private async Task<string> WriteParquetAsync(string name, IReadOnlyList<(double Age, OrbitalElements O)> rows, bool asFloat = false, bool withNull = false)
    {
        string path = Path.Combine(_dir, name);
        DataField[] fields = asFloat
            ? [new DataField<float>("age_ka"), new DataField<float>("eccentricity"), new DataField<float>("obliquity_deg"), new DataField<float>("perihelion_deg")]
            : [new DataField<double>("age_ka"), new DataField<double?>("eccentricity"), new DataField<double>("obliquity_deg"), new DataField<double>("perihelion_deg")];
        await using (FileStream stream = File.Create(path))
        await using (ParquetWriter writer = await ParquetWriter.CreateAsync(new ParquetSchema(fields), stream))
        {
            using ParquetRowGroupWriter rg = writer.CreateRowGroup();
            if (asFloat)
            {
                await rg.WriteAsync<float>(fields[0], rows.Select(r => (float)r.Age).ToArray().AsMemory());
                await rg.WriteAsync<float>(fields[1], rows.Select(r => (float)r.O.Eccentricity).ToArray().AsMemory());
                await rg.WriteAsync<float>(fields[2], rows.Select(r => (float)r.O.ObliquityDeg).ToArray().AsMemory());
                await rg.WriteAsync<float>(fields[3], rows.Select(r => (float)r.O.PerihelionDeg).ToArray().AsMemory());
            }
            else
            {
                await rg.WriteAsync<double>(fields[0], rows.Select(r => r.Age).ToArray().AsMemory());
                await rg.WriteAsync<double>(fields[1], rows.Select((r, i) => withNull && i == 2 ? (double?)null : r.O.Eccentricity).ToArray().AsMemory());
                await rg.WriteAsync<double>(fields[2], rows.Select(r => r.O.ObliquityDeg).ToArray().AsMemory());
                await rg.WriteAsync<double>(fields[3], rows.Select(r => r.O.PerihelionDeg).ToArray().AsMemory());
            }
        }
        return path;
    }

    [Fact]
    public async Task Parquet_table_reads_like_the_csv_table()
    {
        var rows = BergerRows(60, 1);
        var fromCsv = TabulatedOrbit.FromCsv(WriteCsv("t.csv", rows));
        var fromParquet = TabulatedOrbit.FromParquet(await WriteParquetAsync("t.parquet", rows));
        Assert.Equal(rows.Count, fromParquet.RowCount);
        for (double age = 0; age <= 60; age += 1.3)
            Assert.Equal(fromCsv.At(-1000 * age), fromParquet.At(-1000 * age));

        // Float columns are accepted (single precision: agreement to ~1e-6).
        var fromFloat = await TabulatedOrbit.FromParquetAsync(await WriteParquetAsync("f.parquet", rows, asFloat: true));
        Assert.Equal(fromCsv.At(-30_500).Eccentricity, fromFloat.At(-30_500).Eccentricity, 1e-6);
    }

    [Fact]
    public async Task Parquet_nulls_and_missing_columns_are_reported()
    {
        var rows = BergerRows(10, 1);
        string withNull = await WriteParquetAsync("null.parquet", rows, withNull: true);
        var ex = Assert.Throws<FormatException>(() => TabulatedOrbit.FromParquet(withNull));
        Assert.Contains("'eccentricity' is null in row 3", ex.Message);

        string path = Path.Combine(_dir, "partial.parquet");
        var field = new DataField<double>("age_ka");
        await using (FileStream stream = File.Create(path))
        await using (ParquetWriter writer = await ParquetWriter.CreateAsync(new ParquetSchema(field), stream))
        {
            using ParquetRowGroupWriter rg = writer.CreateRowGroup();
            await rg.WriteAsync<double>(field, new double[] { 0, 1, 2, 3 }.AsMemory());
        }
        Assert.Contains("'eccentricity' is missing", Assert.Throws<FormatException>(() => TabulatedOrbit.FromParquet(path)).Message);

        string notParquet = WriteCsv("not.parquet", ["hello"]);
        Assert.Contains("not a readable Parquet file", Assert.Throws<FormatException>(() => TabulatedOrbit.FromParquet(notParquet)).Message);
    }

    [Fact]
    public void Rows_from_arrays_are_validated_like_files()
    {
        var ex = Assert.Throws<FormatException>(() => TabulatedOrbit.FromRows("arrays", [0, 1, 2, 3], [0.01, 0.01, 0.01, 0.01], [23, 23, 23, 23], [0, 1, 2, 720]));
        Assert.Contains("arrays, row 4", ex.Message);
        Assert.Throws<ArgumentException>(() => TabulatedOrbit.FromRows("arrays", [0, 1, 2, 3], [0.01, 0.01, 0.01], [23, 23, 23, 23], [0, 1, 2, 3]));
        var ok = TabulatedOrbit.FromRows("arrays", [0, 1, 2, 3], [0.01, 0.01, 0.01, 0.01], [23, 23, 23, 23], [10, 11, 12, 13]);
        Assert.Contains("arrays", ok.Description);
        Assert.Equal(11.5, ok.At(IOrbitSource.YearsFromAgeKa(1.5)).PerihelionDeg, 1e-6);
    }
}
