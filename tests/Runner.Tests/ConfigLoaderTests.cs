using Xunit;
using Thermostrat.Model.Configuration;
using Thermostrat.Runner.Configuration;

namespace Thermostrat.Runner.Tests;

/// <summary>Layered configuration: a typo must never be silently ignored, a bad value never silently used.</summary>
public sealed class ConfigLoaderTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("thermostrat-config-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    private static readonly Dictionary<string, string> NoEnv = new();

    private string Write(string name, string json)
    {
        var p = Path.Combine(_dir, name);
        File.WriteAllText(p, json);
        return p;
    }

    [Fact]
    public void Built_in_defaults_apply_when_nothing_is_given()
    {
        var s = ConfigLoader.Load<Settings>(new ConfigRequest { Environment = NoEnv });
        // IAU 2015 Resolution B3 nominal total solar irradiance (CHECK-VALUES.md, from memory).
        Assert.Equal(1361.0, s.Insolation.SolarConstant);
        Assert.Equal("berger1978", s.Orbit.Source);
    }

    [Fact]
    public void Layers_apply_in_order_file_then_scenario_then_set_then_environment()
    {
        var cfg = Write("a.json", """{ "Insolation": { "SolarConstant": 1362 }, "Orbit": { "FixedObliquityDeg": 22 } }""");
        var scen = Write("s.json", """{ "Config": "a.json", "Orbit": { "FixedObliquityDeg": 23 }, "Description": "test" }""");
        var s = ConfigLoader.Load<Settings>(new ConfigRequest { ScenarioFile = scen, Environment = NoEnv });
        Assert.Equal(1362, s.Insolation.SolarConstant);
        Assert.Equal(23, s.Orbit.FixedObliquityDeg);

        s = ConfigLoader.Load<Settings>(new ConfigRequest { ScenarioFile = scen, Sets = ["Orbit:FixedObliquityDeg=24"], Environment = NoEnv });
        Assert.Equal(24, s.Orbit.FixedObliquityDeg);

        var env = new Dictionary<string, string> { ["THERMOSTRAT_Orbit__FixedObliquityDeg"] = "25", ["PATH"] = "/bin" };
        s = ConfigLoader.Load<Settings>(new ConfigRequest { ScenarioFile = scen, Sets = ["Orbit:FixedObliquityDeg=24"], Environment = env });
        Assert.Equal(25, s.Orbit.FixedObliquityDeg);
    }

    [Fact]
    public void Unknown_key_names_the_key_and_the_closest_valid_key()
    {
        var e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(
            new ConfigRequest { Sets = ["Insolation:SolarConstnat=1360"], Environment = NoEnv }));
        Assert.Contains("Insolation:SolarConstnat", e.Message);
        Assert.Contains("did you mean 'Insolation:SolarConstant'", e.Message);
    }

    [Fact]
    public void Unknown_section_in_a_file_is_an_error()
    {
        var cfg = Write("b.json", """{ "Orbitt": { "Source": "berger1978" } }""");
        var e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(new ConfigRequest { ConfigFiles = [cfg], Environment = NoEnv }));
        Assert.Contains("'Orbitt'", e.Message);
        Assert.Contains("did you mean 'Orbit'", e.Message);
    }

    [Fact]
    public void Out_of_range_value_names_key_value_and_range()
    {
        var e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(
            new ConfigRequest { Sets = ["Orbit:FixedObliquityDeg=95"], Environment = NoEnv }));
        Assert.StartsWith("Orbit:FixedObliquityDeg = 95", e.Message); // the key exactly as typed, no stray separator
        Assert.Contains(">= 0 and <= 90 deg", e.Message);
    }

    [Theory]
    [InlineData("NaN")]
    [InlineData("Infinity")]
    [InlineData("-Infinity")]
    public void Non_finite_value_is_rejected(string value)
    {
        var e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(
            new ConfigRequest { Sets = ["Insolation:SolarConstant=" + value], Environment = NoEnv }));
        Assert.Contains("Insolation:SolarConstant", e.Message);
        Assert.Contains("not a finite number", e.Message);
        Assert.Contains(">= 1000 and <= 2000 W m-2", e.Message);
    }

    [Fact]
    public void Wrong_type_names_key_value_and_what_is_allowed()
    {
        var e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(
            new ConfigRequest { Sets = ["Insolation:SolarConstant=bright"], Environment = NoEnv }));
        Assert.Contains("Insolation:SolarConstant = 'bright' is not valid", e.Message);
        Assert.Contains("a number", e.Message);
        e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(
            new ConfigRequest { Sets = ["Orbit:AllowBeyondFiveMyr=perhaps"], Environment = NoEnv }));
        Assert.Contains("true or false", e.Message);
    }

    [Fact]
    public void Malformed_or_missing_files_are_named()
    {
        var bad = Write("bad.json", "{ \"Orbit\": { ");
        var e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(new ConfigRequest { ConfigFiles = [bad], Environment = NoEnv }));
        Assert.Contains("bad.json is not valid JSON", e.Message);
        e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(new ConfigRequest { ConfigFiles = [Path.Combine(_dir, "nope.json")], Environment = NoEnv }));
        Assert.Contains("not found", e.Message);
        Assert.Contains("nope.json", e.Message);
    }

    [Fact]
    public void Several_problems_are_all_reported()
    {
        var e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(
            new ConfigRequest { Sets = ["Orbit:FixedObliquityDeg=-1", "Insolation:SolarConstant=NaN"], Environment = NoEnv }));
        Assert.Equal(2, e.Problems.Count);
    }

    [Fact]
    public void Set_without_equals_sign_is_a_usage_error()
    {
        var e = Assert.Throws<ConfigurationException>(() => ConfigLoader.Load<Settings>(new ConfigRequest { Sets = ["Orbit:Source"], Environment = NoEnv }));
        Assert.Contains("Section:Key=value", e.Message);
    }

    [Fact]
    public void Closest_key_uses_edit_distance()
    {
        // Levenshtein distance, textbook example (kitten → sitting = 3).
        Assert.Equal(3, KeySuggester.Distance("kitten", "sitting"));
        Assert.Equal("SolarConstant", KeySuggester.Closest("solarconstnt", ["SolarConstant", "Source"]));
        Assert.Null(KeySuggester.Closest("zzzzzzzzzzzz", ["SolarConstant", "Source"]));
    }
}
