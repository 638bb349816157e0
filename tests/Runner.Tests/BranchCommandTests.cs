using Thermostrat.Model.IO;
using Xunit;

namespace Thermostrat.Runner.Tests;

public sealed class BranchCommandTests : IDisposable
{
    private readonly CliHarness _cli = new();

    public void Dispose() => _cli.Dispose();

    [Fact]
    public void Stommel_branch_has_its_fold_and_flow_reversal_and_writes_tables()
    {
        var outDir = _cli.Path_("stommel");
        var (code, stdout, err) = _cli.Run("branch", "--model", "stommel", "--vary", "Eta2", "--from", "0", "--to", "2", "--out", outDir);
        Assert.True(code == 0, err);
        var sp = ParquetTable.Read(Path.Combine(outDir, "special_points.parquet"));
        var kinds = sp.Texts("kind");
        var values = sp.Doubles("parameter_value");
        // Stommel (1961) nondimensional model, η1 = 3, η3 = 0.3. Steady states: T = η1/(1+|q|),
        // S = η2/(η3+|q|), q = T − S. The flow reverses (q = 0, the corner of |q|) where T = S,
        // i.e. η2 = η1·η3 = 0.9; the smooth fold is the maximum over q > 0 of
        // η2(q) = (η3 + q)(η1/(1 + q) − q), found here independently by golden-section search.
        int corner = Array.IndexOf(kinds, "corner-turn");
        Assert.True(corner >= 0, "the flow reversal must be reported as a non-smooth turning point");
        Assert.Equal(0.9, values[corner], 8);
        int fold = Array.IndexOf(kinds, "fold");
        Assert.True(fold >= 0);
        static double Eta2(double q) => (0.3 + q) * (3.0 / (1 + q) - q);
        double a = 0.01, b = 2.0, g = (Math.Sqrt(5) - 1) / 2;
        for (int i = 0; i < 200; i++)
        {
            double c = b - g * (b - a), d = a + g * (b - a);
            if (Eta2(c) > Eta2(d)) b = d; else a = c;
        }
        Assert.Equal(Eta2(0.5 * (a + b)), values[fold], 8);
        var br = ParquetTable.Read(Path.Combine(outDir, "branch.parquet"));
        var stab = br.Texts("stability");
        Assert.Contains("stable", stab);
        Assert.Contains("saddle", stab);
        Assert.Equal("Eta2", br.Metadata["thermostrat.parameter"]);
        Assert.True(File.Exists(Path.Combine(outDir, "branch.png")));
        Assert.Contains("F1", stdout);
    }

    [Fact]
    public void Recharge_oscillator_Hopf_point_with_period()
    {
        var (code, stdout, err) = _cli.Run("branch", "--model", "recharge-oscillator", "--vary", "mu", "--from", "0.3", "--to", "1", "--out", _cli.Path_("ro"));
        Assert.True(code == 0, err);
        var sp = ParquetTable.Read(Path.Combine(_cli.Path_("ro"), "special_points.parquet"));
        int h = Array.IndexOf(sp.Texts("kind"), "hopf");
        Assert.True(h >= 0);
        // Jin (1997) with the default parameters: critical coupling μ = 2/3 (trace zero); the
        // analytic check of the period is in the model tests.
        Assert.Equal(2.0 / 3.0, sp.Doubles("parameter_value")[h], 8);
        Assert.True(sp.Doubles("period")[h] > 0);
    }

    [Theory]
    [InlineData(new[] { "--vary", "Eta9", "--from", "0", "--to", "2" }, "did you mean 'Eta1'")]
    [InlineData(new[] { "--vary", "Eta2", "--from", "2", "--to", "0" }, "empty or inverted")]
    [InlineData(new[] { "--vary", "Eta2", "--from", "0", "--to", "2", "--start-at", "5" }, "outside the range")]
    [InlineData(new[] { "--vary", "Eta2", "--from", "0", "--to", "2", "--with", "Eta1=abc" }, "not a finite number")]
    public void Bad_input_exits_2(string[] args, string expected)
    {
        var outDir = _cli.Path_("bad");
        var (code, _, err) = _cli.Run(["branch", "--model", "stommel", .. args, "--out", outDir]);
        Assert.Equal(2, code);
        Assert.Contains(expected, err);
        Assert.False(Directory.Exists(outDir));
    }

    [Fact]
    public void Unknown_model_names_the_closest()
    {
        var (code, _, err) = _cli.Run("branch", "--model", "stomel", "--vary", "Eta2", "--from", "0", "--to", "2", "--out", _cli.Path_("m"));
        Assert.Equal(2, code);
        Assert.Contains("did you mean 'stommel'", err);
    }
}
