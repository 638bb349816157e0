using Xunit;
using System.Text.Json;
using DuckDB.NET.Data;
using Thermostrat.Model.IO;

namespace Thermostrat.Runner.Tests;

/// <summary>
/// Files written by the project must be readable outside it: DuckDB (an independent Parquet
/// implementation, DuckDB.NET.Data.Full from NuGet) reads values and key-value metadata back.
/// </summary>
public sealed class ParquetInteropTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("thermostrat-parquet-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void DuckDB_reads_our_values_and_metadata()
    {
        var path = Path.Combine(_dir, "t.parquet");
        var cols = new[]
        {
            new ColumnSpec("age_ka", "ka", "age before 1950"),
            new ColumnSpec("insolation_wm2", "W m-2", "daily mean insolation"),
            new ColumnSpec("label", "", "text", ColumnKind.Text),
            new ColumnSpec("index", "1", "row index", ColumnKind.Int64),
        };
        // Small row groups so the file has several of them.
        using (var w = ParquetTableWriter.Create(path, cols, new Dictionary<string, string> { [ParquetTableWriter.ConfigKey] = "{\"Orbit\":{}}" }, rowGroupSize: 100))
        {
            for (int i = 0; i < 1000; i++)
            {
                w.Set(0, i * 0.5);
                w.Set(1, 400 + Math.Sin(i));
                w.Set(2, i % 2 == 0 ? "even" : "odd");
                w.Set(3, (long)i);
                w.EndRow();
            }
            Assert.False(File.Exists(path)); // nothing at the target until complete
            w.Complete();
        }
        Assert.True(File.Exists(path));
        Assert.Empty(Directory.GetFiles(_dir, "*.partial-*"));

        using var conn = new DuckDBConnection("DataSource=:memory:");
        conn.Open();
        using (var cmd = conn.CreateCommand())
        {
            cmd.CommandText = $"SELECT count(*), sum(age_ka), max(insolation_wm2), CAST(sum(CASE WHEN label = 'odd' THEN 1 ELSE 0 END) AS BIGINT), max(\"index\") FROM read_parquet('{path}')";
            using var r = cmd.ExecuteReader();
            Assert.True(r.Read());
            Assert.Equal(1000L, Convert.ToInt64(r.GetValue(0)));
            Assert.Equal(Enumerable.Range(0, 1000).Sum(i => i * 0.5), r.GetDouble(1), 9);
            Assert.Equal(Enumerable.Range(0, 1000).Max(i => 400 + Math.Sin(i)), r.GetDouble(2), 12);
            Assert.Equal(500L, Convert.ToInt64(r.GetValue(3)));
            Assert.Equal(999L, Convert.ToInt64(r.GetValue(4)));
        }
        var meta = new Dictionary<string, string>();
        using (var cmd = conn.CreateCommand())
        {
            cmd.CommandText = $"SELECT decode(key), decode(value) FROM parquet_kv_metadata('{path}')";
            using var r = cmd.ExecuteReader();
            while (r.Read()) meta[r.GetString(0)] = r.GetString(1);
        }
        Assert.Equal(Thermostrat.Model.ThermostratInfo.Version, meta[ParquetTableWriter.VersionKey]);
        var units = JsonSerializer.Deserialize<Dictionary<string, string>>(meta[ParquetTableWriter.UnitsKey])!;
        Assert.Equal("W m-2", units["insolation_wm2"]);
        Assert.Equal("{\"Orbit\":{}}", meta[ParquetTableWriter.ConfigKey]);

        // And our own reader agrees.
        var t = ParquetTable.Read(path);
        Assert.Equal(1000, t.RowCount);
        Assert.Equal(499.5, t.Doubles("age_ka")[999]);
        Assert.Equal("odd", t.Texts("label")[1]);
    }

    [Fact]
    public void An_abandoned_table_leaves_no_file()
    {
        var path = Path.Combine(_dir, "abandoned.parquet");
        using (var w = ParquetTableWriter.Create(path, [new ColumnSpec("x", "1")]))
        {
            w.AppendRow([1.0]);
        }
        Assert.False(File.Exists(path));
        Assert.Empty(Directory.GetFiles(_dir));
    }

    [Fact]
    public void Reading_a_missing_or_corrupt_file_names_it()
    {
        var missing = Path.Combine(_dir, "none.parquet");
        Assert.Contains("none.parquet", Assert.Throws<FileNotFoundException>(() => ParquetTable.Read(missing)).Message);
        var junk = Path.Combine(_dir, "junk.parquet");
        File.WriteAllText(junk, "this is not parquet");
        Assert.Contains("junk.parquet", Assert.Throws<InvalidDataException>(() => ParquetTable.Read(junk)).Message);
    }
}
