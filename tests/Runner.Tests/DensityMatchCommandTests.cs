using System.Text.Json;
using Thermostrat.Model.Analysis;
using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Runner.Tests;

public sealed class DensityMatchCommandTests : IDisposable
{
    private readonly CliHarness _cli = new();

    public void Dispose() => _cli.Dispose();

    [Fact]
    public void Json_output_gives_every_equation_of_state_and_equalises_densities()
    {
        var outDir = _cli.Path_("dm");
        var (code, stdout, err) = _cli.Run("density-match", "--water-a", "S=35.6,T=19", "--water-b", "S=34.9,T=27", "--layer-m", "100", "--json", "--out", outDir);
        Assert.True(code == 0, err);
        using var doc = JsonDocument.Parse(stdout);
        var rows = doc.RootElement.EnumerateArray().ToList();
        Assert.Equal(EquationsOfState.Names.Count, rows.Count);
        foreach (var r in rows)
        {
            // Exact property of the answer: A with the reported salinity change has B's density.
            var eos = EquationsOfState.Create(r.GetProperty("equation_of_state").GetString()!);
            double ds = r.GetProperty("salinity_change_gkg").GetDouble();
            Assert.True(ds < 0, "the colder, saltier water must freshen to become as light");
            Assert.Equal(eos.Density(34.9, 27.0, 0.0), eos.Density(35.6 + ds, 19.0, 0.0), 8);
            // Freshwater convention h = H (S/S' − 1).
            Assert.Equal(100 * (35.6 / (35.6 + ds) - 1), r.GetProperty("freshwater_input_m").GetDouble(), 9);
        }
        Assert.True(File.Exists(Path.Combine(outDir, "ts_diagram.png")));
        Assert.True(File.Exists(Path.Combine(outDir, "density_match.parquet")));
        Assert.True(File.Exists(Path.Combine(outDir, "run.json")));
    }

    [Fact]
    public void Table_output_reports_no_solution_clearly()
    {
        // A is far denser than anything of its temperature can be made lighter than B? No: B is
        // fresher than any salinity A can reach at A's temperature (B fresh and cold at 4 °C,
        // A at 35 °C): no salinity change of A in 0–42 g/kg makes A as dense as B.
        var (code, stdout, err) = _cli.Run("density-match", "--water-a", "S=0,T=35", "--water-b", "S=40,T=0", "--out", _cli.Path_("ns"), "--eos", "teos10");
        Assert.True(code == 0, err);
        Assert.Contains("no solution", stdout);
        Assert.Contains("no salinity change in range", stdout);
    }

    [Theory]
    [InlineData("S=43,T=10", "S = 43", "0 to 42 g/kg")]
    [InlineData("S=35,T=-3", "T = -3", "-2 to 40")]
    [InlineData("S=NaN,T=10", "S = NaN", "0 to 42 g/kg")]
    [InlineData("S=35", "needs both", "T=")]
    [InlineData("S=35,T=10,q=4", "unknown key 'q'", "z (depth, m)")]
    public void Bad_water_masses_exit_2_with_the_range(string water, string expect1, string expect2)
    {
        var outDir = _cli.Path_("bad");
        var (code, _, err) = _cli.Run("density-match", "--water-a", water, "--water-b", "S=35,T=20", "--out", outDir);
        Assert.Equal(2, code);
        Assert.Contains(expect1, err);
        Assert.Contains(expect2, err);
        Assert.False(Directory.Exists(outDir));
    }

    [Fact]
    public void Negative_layer_thickness_is_rejected()
    {
        var (code, _, err) = _cli.Run("density-match", "--water-a", "S=35,T=10", "--water-b", "S=35,T=20", "--layer-m", "-5", "--out", _cli.Path_("neg"));
        Assert.Equal(2, code);
        Assert.Contains("--layer-m = -5", err);
        Assert.Contains("> 0 m", err);
    }

    [Fact]
    public void Command_agrees_with_the_library_it_presents()
    {
        var (code, stdout, _) = _cli.Run("density-match", "--water-a", "S=36,T=16,z=120", "--water-b", "S=35,T=25", "--eos", "eos80", "--json", "--out", _cli.Path_("lib"));
        Assert.Equal(0, code);
        var lib = DensityThreshold.Solve(EquationsOfState.Create("eos80"), WaterMass.AtDepth(36, 16, 120), new WaterMass(35, 25), 100);
        using var doc = JsonDocument.Parse(stdout);
        Assert.Equal(lib.SalinityChange_gkg.Value, doc.RootElement[0].GetProperty("salinity_change_gkg").GetDouble(), 12);
    }
}
