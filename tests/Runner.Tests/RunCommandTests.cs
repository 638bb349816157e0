using System.Text.Json;
using Thermostrat.Model.IO;
using Xunit;

namespace Thermostrat.Runner.Tests;

public sealed class RunCommandTests : IDisposable
{
    private readonly CliHarness _cli = new();

    public void Dispose() => _cli.Dispose();

    [Fact]
    public void Short_run_streams_a_table_with_configuration_and_forcing_columns()
    {
        var outDir = _cli.Path_("run");
        var (code, stdout, err) = _cli.Run("run", "--set", "Run:DurationYears=200", "--set", "Run:OutputIntervalYears=10", "--out", outDir);
        Assert.True(code == 0, err);
        var t = ParquetTable.Read(Path.Combine(outDir, "timeseries.parquet"));
        Assert.Equal(21, t.RowCount);
        foreach (var c in new[] { "time_yr", "age_ka", "sst_warm_pool_degc", "ventilation_north_sv", "co2_ppm", "insolation_cold_tongue_wm2", "low_cloud_fraction_cold_tongue" })
            Assert.True(t.Has(c), c + " missing");
        Assert.Equal(200, t.Doubles("time_yr")[^1], 9);
        // age_ka = start age − time/1000 (GUIDE convention: ka before 1950, positive into the past).
        Assert.Equal(-0.2, t.Doubles("age_ka")[^1], 9);
        Assert.Contains("\"DurationYears\": 200", t.Metadata[ParquetTableWriter.ConfigKey]);
        using var run = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "run.json")));
        Assert.True(run.RootElement.GetProperty("integration").GetProperty("accepted_steps").GetInt64() > 0);
        Assert.True(File.Exists(Path.Combine(outDir, "timeseries.png")));
        Assert.Contains("wrote", stdout);
    }

    [Fact]
    public void Main_demo_collapses_and_recovers_the_ventilation()
    {
        // The README's main job: a slow freshening of both ventilation boxes and back. Behaviour the
        // model must show (the hysteresis criterion): collapse at a finite input, recovery at
        // a smaller one, and after collapse a small east–west SST difference.
        var outDir = _cli.Path_("demo");
        var (code, _, err) = _cli.Run("run", CliHarness.Repo("scenarios/freshening-hysteresis.json"), "--out", outDir, "-q");
        Assert.True(code == 0, err);
        var t = ParquetTable.Read(Path.Combine(outDir, "timeseries.parquet"));
        var psi = t.Doubles("upwelling_sv");
        var hosing = t.Doubles("hosing_scheduled_north_sv");
        var dT = t.Doubles("east_west_sst_difference_k");
        int collapse = Array.FindIndex(psi, v => v < 3);
        int recovery = Array.FindIndex(psi, collapse, v => v > 10);
        Assert.True(collapse > 0 && recovery > collapse, "the ventilation must collapse and then recover");
        Assert.True(hosing[recovery] < hosing[collapse] - 0.1, $"collapse at {hosing[collapse]} Sv, recovery at {hosing[recovery]} Sv");
        Assert.True(dT[(collapse + recovery) / 2] < 1.5, $"ΔT after collapse {dT[(collapse + recovery) / 2]} K");
        Assert.InRange(psi[^1], 20, 40);
        // The transient salinity spike at the collapse briefly leaves the TEOS-10 funnel: said, not hidden.
        if (t.Metadata.TryGetValue("thermostrat.warnings", out var w)) Assert.Contains("extrapolated", w);
    }

    [Fact]
    public void Shipped_scenarios_all_load_and_validate()
    {
        // Each shipped scenario must pass configuration checks (a typo in a shipped file is a defect).
        foreach (var file in Directory.GetFiles(CliHarness.Repo("scenarios"), "*.json"))
        {
            var s = Configuration.ConfigLoader.Load<Configuration.Settings>(new Configuration.ConfigRequest { ScenarioFile = file, Environment = new Dictionary<string, string>() });
            Assert.False(string.IsNullOrWhiteSpace(s.Description), Path.GetFileName(file) + " must say what it tests");
            Assert.Contains("Invented scenario", s.Description);
        }
    }

    [Theory]
    [InlineData("unknown process", "Model:Processes:LowClouds:Enabled=false", "did you mean 'Model:Processes:LowCloud'")]
    [InlineData("negative area", "Model:Boxes:ColdTongue:Area_m2=-5", "Model:Boxes:ColdTongue:Area_m2 = -5")]
    [InlineData("latitude", "Model:Boxes:North:NorthDeg=95", "Model:Boxes:North:NorthDeg = 95")]
    [InlineData("schedule after the end", "Model:Forcing:Freshwater:North:Shape=Step", "StartYear")]
    public void Bad_model_configuration_exits_2_with_no_output(string what, string set, string expected)
    {
        var outDir = _cli.Path_("bad");
        var args = new List<string> { "run", "--set", "Run:DurationYears=100", "--set", set, "--out", outDir };
        if (what == "schedule after the end") { args.Insert(3, "--set"); args.Insert(4, "Model:Forcing:Freshwater:North:StartYear=500"); args.Insert(5, "--set"); args.Insert(6, "Model:Forcing:Freshwater:North:Rate_Sv=0.1"); }
        var (code, _, err) = _cli.Run([.. args]);
        Assert.True(code == 2, $"{what}: exit {code}, {err}");
        Assert.Contains(expected, err);
        Assert.False(Directory.Exists(outDir));
        Assert.Empty(Directory.GetDirectories(_cli.Dir));
    }

    [Fact]
    public void Forcing_file_with_a_gap_is_refused()
    {
        var csv = _cli.Path_("co2.csv");
        File.WriteAllText(csv, "age_ka,co2_ppm\n0,280\n1,\n2,270\n");
        var scen = _cli.Path_("s.json");
        File.WriteAllText(scen, """{ "Description": "test", "Run": { "DurationYears": 100 }, "Model": { "Forcing": { "Co2": { "File": "co2.csv" } } } }""");
        var (code, _, err) = _cli.Run("run", scen, "--out", _cli.Path_("gap"));
        Assert.Equal(2, code);
        Assert.Contains("co2.csv", err);
        Assert.False(Directory.Exists(_cli.Path_("gap")));
    }

    [Fact]
    public void A_run_leaving_the_equation_of_state_range_exits_1_with_the_diagnosis_and_no_output()
    {
        // Surface heat gain with no damping at all (loss −500 W/m², no feedback, no atmospheric
        // export) heats the boxes without bound; the run must stop once a temperature is far
        // outside the equation of state's range (−2…40 °C, TEOS-10 funnel), not write hundreds of degrees.
        var outDir = _cli.Path_("blowup");
        var (code, _, err) = _cli.Run("run", "--set", "Run:DurationYears=20000",
            "--set", "Model:Processes:AirSeaExchange:Tropical:Feedback_WmK=0", "--set", "Model:Processes:AirSeaExchange:Tropical:Loss_Wm2=-500",
            "--set", "Model:Processes:AirSeaExchange:Extratropical:Feedback_WmK=0", "--set", "Model:Processes:AirSeaExchange:Extratropical:Loss_Wm2=-500",
            "--set", "Model:Processes:AtmosphericTransport:ExtratropicalLoss_WmK=0", "--set", "Model:Processes:AtmosphericTransport:TropicalExchange_WmK=0",
            "--out", outDir);
        Assert.Equal(1, code);
        Assert.StartsWith("run failed:", err);
        Assert.Contains("is beyond the limits -5 to 50 °C", err);
        Assert.False(Directory.Exists(outDir));
        Assert.Empty(Directory.GetDirectories(_cli.Dir));
    }
}

public sealed class DescribeCommandTests : IDisposable
{
    private readonly CliHarness _cli = new();

    public void Dispose() => _cli.Dispose();

    [Theory]
    [InlineData("tropical", "docs/model.md")]
    [InlineData("stommel", "docs/reference-models/stommel.md")]
    [InlineData("recharge-oscillator", "docs/reference-models/recharge-oscillator.md")]
    public void Committed_model_documents_match_the_code(string model, string doc)
    {
        // docs/ are generated by `describe --markdown`; a stale document misleads readers.
        var fresh = _cli.Path_(model + ".md");
        var (code, _, err) = _cli.Run("describe", "--model", model, "--markdown", fresh);
        Assert.True(code == 0, err);
        Assert.True(File.ReadAllText(CliHarness.Repo(doc)) == File.ReadAllText(fresh),
            $"{doc} is out of date: regenerate it with `thermostrat describe --model {model} --markdown {doc}`");
    }

    [Fact]
    public void Description_lists_equations_sources_and_switched_off_processes()
    {
        var (code, stdout, _) = _cli.Run("describe", "--set", "Model:Processes:LowCloud:Enabled=false");
        Assert.Equal(0, code);
        Assert.Contains("Switched off", stdout);
        Assert.Contains("LowCloud", stdout[stdout.IndexOf("Switched off", StringComparison.Ordinal)..]);
        Assert.Contains("Myhre", stdout);   // the CO2 forcing's source is named
        Assert.Contains("Model:Processes:Ventilation", stdout);
    }
}
