using Thermostrat.Model.IO;
using Xunit;

namespace Thermostrat.Runner.Tests;

public sealed class BoundaryCommandTests : IDisposable
{
    private readonly CliHarness _cli = new();

    public void Dispose() => _cli.Dispose();

    [Fact]
    public void Bistable_interval_agrees_with_the_folds_of_a_one_parameter_branch()
    {
        var bd = _cli.Path_("bd");
        var (code, stdout, err) = _cli.Run("boundary", "--model", "stommel-smooth", "--vary", "Eta2", "--from", "0", "--to", "2",
            "--second", "Eta1", "--second-from", "0.2", "--second-to", "5", "--cuts", "25", "--out", bd);
        Assert.True(code == 0, err);
        Assert.Contains("cusp", stdout);
        var map = ParquetTable.Read(Path.Combine(bd, "bistable.parquet"));
        var eta1 = map.Doubles("second_parameter_value");
        int i = Array.FindIndex(eta1, v => Math.Abs(v - 3.0) < 1e-12); // 0.2 + 4.8·14/24 = 3.0
        Assert.True(i >= 0);

        // Independent path: a one-parameter branch at Eta1 = 3 (the model default) and its two folds.
        var br = _cli.Path_("br");
        (code, _, err) = _cli.Run("branch", "--model", "stommel-smooth", "--vary", "Eta2", "--from", "0", "--to", "2", "--out", br);
        Assert.True(code == 0, err);
        var sp = ParquetTable.Read(Path.Combine(br, "special_points.parquet"));
        var folds = sp.Texts("kind").Select((k, j) => (k, v: sp.Doubles("parameter_value")[j])).Where(x => x.k == "fold").Select(x => x.v).Order().ToArray();
        Assert.Equal(2, folds.Length);
        Assert.Equal(folds[0], map.Doubles("lower_threshold")[i], 7);
        Assert.Equal(folds[1], map.Doubles("upper_threshold")[i], 7);
        // Below the cusp there is no bistability (a property of the cusp, Kuznetsov ch. 8).
        Assert.True(double.IsNaN(map.Doubles("lower_threshold")[0]));
    }

    [Fact]
    public void Same_parameter_twice_is_refused()
    {
        var (code, _, err) = _cli.Run("boundary", "--model", "stommel", "--vary", "Eta2", "--from", "0", "--to", "2",
            "--second", "eta2", "--second-from", "0", "--second-to", "1", "--out", _cli.Path_("x"));
        Assert.Equal(2, code);
        Assert.Contains("same parameter", err);
    }
}
