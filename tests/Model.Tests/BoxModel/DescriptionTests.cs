using System.Text.RegularExpressions;
using Thermostrat.Model.Models.Tropical;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>The metadata the describe command turns into docs/model.md is complete.</summary>
public class DescriptionTests
{
    private static readonly TropicalBoxModel Model = Build();
    private static readonly TropicalModelDescription Description = Model.Describe();

    [Fact]
    public void EveryProcessHasARoleAnEquationAndReferences()
    {
        Assert.Equal(ProcessCatalog.CreateBuiltIn().Names.Count, Description.Processes.Count);
        foreach (var p in Description.Processes)
        {
            Assert.False(string.IsNullOrWhiteSpace(p.Role), p.Name);
            Assert.False(string.IsNullOrWhiteSpace(p.Equation), p.Name);
            Assert.NotEmpty(p.References);
            Assert.All(p.References, r => Assert.Matches(@"\(\d{4}\)", r)); // every reference carries its year
            Assert.Equal("Model:Processes:" + p.Name, p.Section);
        }
        Assert.Equal(Description.Processes.OrderBy(p => p.Order).Select(p => p.Name), Description.Processes.Select(p => p.Name));
    }

    [Fact]
    public void EveryNumericParameterNamesItsSourceUnitAndMeaning()
    {
        // "Every default's Source is a citation or 'tuned: <calibration target>'" (or common practice / derived).
        var citation = new Regex(@"\(\d{4}\)|\d{4}[a-z]?\b");
        foreach (var p in Model.ParameterEntries)
        {
            string source = p.Source;
            Assert.False(string.IsNullOrWhiteSpace(source), $"{p.Key} has no source");
            bool ok = source.StartsWith("tuned: ", StringComparison.Ordinal) || source.StartsWith("common practice", StringComparison.Ordinal)
                || source.StartsWith("derived", StringComparison.Ordinal) || source.StartsWith("idealized basin of our own", StringComparison.Ordinal)
                || citation.IsMatch(source);
            Assert.True(ok, $"{p.Key}: source '{source}' is neither a citation, common practice, derived, our basin, nor 'tuned: <target>'");
            if (p.Attribute is { } a)
            {
                Assert.False(string.IsNullOrWhiteSpace(a.Unit), $"{p.Key} has no unit");
                Assert.False(string.IsNullOrWhiteSpace(a.Meaning), $"{p.Key} has no meaning");
            }
            Assert.StartsWith("Model:", p.Key);
        }
        Assert.Equal(Model.ParameterCount, Model.ParameterEntries.Select(p => p.Key).Distinct(StringComparer.OrdinalIgnoreCase).Count());
    }

    [Fact]
    public void OptionsListEveryConfigurationValueWithItsKey()
    {
        var keys = Description.Options.Select(o => o.Key).ToHashSet();
        Assert.Contains("Model:Boxes:ColdTongue:Area_m2", keys);
        Assert.Contains("Model:Processes:Ventilation:Enabled", keys);
        Assert.Contains("Model:Processes:WarmWaterRecharge:Prognostic", keys);
        Assert.Contains("Model:Forcing:Freshwater:North:Shape", keys);
        Assert.Contains("Model:EquationOfState", keys);
        foreach (var p in Model.ParameterEntries) Assert.Contains(p.Key, keys);
        Assert.All(Description.Options.Where(o => o.IsParameter), o => Assert.False(string.IsNullOrWhiteSpace(o.Source), o.Key));
    }

    [Fact]
    public void StateAndColumnsHaveUniqueSnakeCaseNamesWithUnits()
    {
        var snake = new Regex("^[a-z][a-z0-9_]*$");
        Assert.All(Description.StateVariables, s => { Assert.Matches(snake, s.Name); Assert.False(string.IsNullOrWhiteSpace(s.Unit)); Assert.False(string.IsNullOrWhiteSpace(s.Meaning)); });
        Assert.All(Description.Columns, c => { Assert.Matches(snake, c.Name); Assert.False(string.IsNullOrWhiteSpace(c.Unit)); Assert.False(string.IsNullOrWhiteSpace(c.Meaning)); });
        Assert.Equal(Description.Columns.Count, Description.Columns.Select(c => c.Name).Distinct().Count());
        string[] required = ["time_yr", "age_ka", "sst_warm_pool_degc", "east_west_sst_difference_k", "ventilation_north_sv", "upwelling_sv",
            "low_cloud_fraction_cold_tongue", "net_surface_heat_flux_north_wm2", "density_north_kgm3", "co2_ppm", "insolation_cold_tongue_wm2", "obliquity_deg"];
        foreach (var name in required) Assert.Contains(Description.Columns, c => c.Name == name);
        Assert.Contains(Description.Forcing, f => f.StartsWith("orbit:", StringComparison.Ordinal));
    }

    [Fact]
    public void CommonDescriptionMatchesTheModel()
    {
        var d = Model.Description;
        Assert.Equal(Model.Dimension, d.StateVariables.Count);
        Assert.Equal(Model.ParameterCount, d.Parameters.Count);
        for (int i = 0; i < Model.ParameterCount; i++) Assert.Equal(Model.GetParameterName(i), d.Parameters[i].Name);
        Assert.Equal("yr", d.TimeUnit);
    }
}
