using System.Text.Json;
using Thermostrat.Model.IO;
using Xunit;

namespace Thermostrat.Runner.Tests;

public sealed class InsolationCommandTests : IDisposable
{
    private readonly CliHarness _cli = new();

    public void Dispose() => _cli.Dispose();

    [Fact]
    public void Writes_tables_figures_and_run_record()
    {
        var outDir = _cli.Path_("ins");
        var (code, stdout, stderr) = _cli.Run("insolation", "--to-ka", "20", "--every-ka", "2", "--lat", "-65,0,65", "--what", "daily", "--sun-longitude", "90", "--out", outDir);
        Assert.True(code == 0, stderr);
        foreach (var f in new[] { "insolation.parquet", "orbit.parquet", "season.parquet", "run.json", "insolation_age_latitude.png", "insolation_season.png", "orbital_elements.png" })
            Assert.True(File.Exists(Path.Combine(outDir, f)), f + " missing");
        var t = ParquetTable.Read(Path.Combine(outDir, "insolation.parquet"));
        Assert.Equal(11 * 3, t.RowCount);
        var lat = t.Doubles("latitude_deg");
        var q = t.Doubles("insolation_wm2");
        var age = t.Doubles("age_ka");
        // North Pole closed form is checked in the model tests; here: 65°N at the June solstice
        // today is ~ 480–510 W/m² (common practice; e.g. Berger & Loutre 1991 curves), and the
        // southern winter at 65°S is dark-ish (< 30 W/m²).
        int i65 = Enumerable.Range(0, (int)t.RowCount).First(i => age[i] == 0 && lat[i] == 65);
        int iS65 = Enumerable.Range(0, (int)t.RowCount).First(i => age[i] == 0 && lat[i] == -65);
        Assert.InRange(q[i65], 470, 520);
        Assert.InRange(q[iS65], 0, 30);
        // Provenance: the resolved configuration and units are in the file.
        Assert.Contains("\"SolarConstant\": 1361", t.Metadata[ParquetTableWriter.ConfigKey]);
        Assert.Contains("21 March", t.Metadata["thermostrat.calendar"]);
        var units = JsonSerializer.Deserialize<Dictionary<string, string>>(t.Metadata[ParquetTableWriter.UnitsKey])!;
        Assert.Equal("W m-2", units["insolation_wm2"]);
        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "run.json")));
        Assert.Equal("insolation", run.RootElement.GetProperty("command").GetString());
        Assert.Equal(1361, run.RootElement.GetProperty("configuration").GetProperty("Insolation").GetProperty("SolarConstant").GetDouble());
        Assert.False(string.IsNullOrEmpty(run.RootElement.GetProperty("version").GetString()));
        Assert.Contains("wrote", stdout);
    }

    [Theory]
    [InlineData("latitude", "--lat", "95")]
    [InlineData("step", "--every-ka", "0")]
    [InlineData("step", "--every-ka", "-1")]
    [InlineData("quantity", "--what", "weekly")]
    [InlineData("orbit table", "--orbit-table", "/no/such/orbit.csv")]
    [InlineData("config key", "--set", "Insolation:SolarKonstant=1360")]
    [InlineData("NaN", "--set", "Insolation:SolarConstant=NaN")]
    public void Bad_input_exits_2_and_writes_nothing(string what, string option, string value)
    {
        var outDir = _cli.Path_("bad-" + what.Replace(' ', '-'));
        var (code, _, stderr) = _cli.Run("insolation", "--to-ka", "5", option, value, "--out", outDir);
        Assert.Equal(2, code);
        Assert.StartsWith("error:", stderr);
        Assert.False(Directory.Exists(outDir), "no output folder may be left for bad input");
        Assert.Empty(Directory.GetDirectories(_cli.Dir));
    }

    [Fact]
    public void Messages_name_the_value_and_what_is_allowed()
    {
        var (_, _, err) = _cli.Run("insolation", "--lat", "-100,0", "--out", _cli.Path_("x"));
        Assert.Contains("-100", err);
        Assert.Contains("-90 to 90", err);
        (_, _, err) = _cli.Run("insolation", "--what", "weekly", "--out", _cli.Path_("x"));
        Assert.Contains("caloric-summer", err);
        (_, _, err) = _cli.Run("insolation", "--set", "Insolation:SolarKonstant=1360", "--out", _cli.Path_("x"));
        Assert.Contains("did you mean 'Insolation:SolarConstant'", err);
    }

    [Fact]
    public void Existing_output_is_kept_unless_replacement_is_asked_for()
    {
        var outDir = _cli.Path_("keep");
        Directory.CreateDirectory(outDir);
        File.WriteAllText(Path.Combine(outDir, "precious.txt"), "earlier result");
        var (code, _, err) = _cli.Run("insolation", "--to-ka", "2", "--lat", "0", "--out", outDir);
        Assert.Equal(2, code);
        Assert.Contains("--replace", err);
        Assert.True(File.Exists(Path.Combine(outDir, "precious.txt")));
        (code, _, err) = _cli.Run("insolation", "--to-ka", "2", "--lat", "0", "--out", outDir, "--replace");
        Assert.True(code == 0, err);
        Assert.False(File.Exists(Path.Combine(outDir, "precious.txt")));
        Assert.True(File.Exists(Path.Combine(outDir, "insolation.parquet")));
    }

    [Fact]
    public void Idealized_circular_orbit_removes_precession()
    {
        var outDir = _cli.Path_("circ");
        var (code, _, err) = _cli.Run("insolation", "--to-ka", "30", "--lat", "65", "--what", "daily", "--sun-longitude", "90",
            "--set", "Orbit:FixedEccentricity=0", "--set", "Orbit:FixedObliquityDeg=23.5", "--out", outDir);
        Assert.True(code == 0, err);
        var q = ParquetTable.Read(Path.Combine(outDir, "insolation.parquet")).Doubles("insolation_wm2");
        // Circular orbit and fixed tilt: nothing left to vary (exact property of the formula).
        Assert.True(q.Max() - q.Min() < 1e-9, $"range {q.Max() - q.Min()}");
    }

    [Fact]
    public void Help_lists_examples()
    {
        var (code, stdout, _) = _cli.Run("insolation", "--help");
        Assert.Equal(0, code);
        Assert.Contains("Examples", stdout);
        Assert.Contains("--sun-longitude", stdout);
    }
}
