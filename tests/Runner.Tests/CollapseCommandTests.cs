using System.Text.Json;
using Thermostrat.Model.IO;
using Xunit;

namespace Thermostrat.Runner.Tests;

public sealed class CollapseCommandTests : IDisposable
{
    private readonly CliHarness _cli = new();

    public void Dispose() => _cli.Dispose();

    private JsonElement Run(string name, params string[] extra)
    {
        var outDir = _cli.Path_(name);
        var (code, _, err) = _cli.Run(["collapse", "--model", "stommel", "--vary", "Eta2", "--from", "1", "--to", "1.6", "--watch", "flow_q",
            "--duration", "200", .. extra, "--out", outDir]);
        Assert.True(code == 0, err);
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "run.json")));
        return doc.RootElement.Clone();
    }

    [Fact]
    public void Transient_threshold_lies_just_beyond_the_fold_and_ramps_overshoot_more_when_faster()
    {
        var slow = Run("slow", "--ramp-rate", "0.0005");
        var fast = Run("fast", "--ramp-rate", "0.004");
        double threshold = slow.GetProperty("threshold").GetDouble();
        double fold = slow.GetProperty("nearest_fold").GetDouble();
        var bracket = slow.GetProperty("bracket").EnumerateArray().Select(e => e.GetDouble()).ToArray();
        Assert.InRange(threshold, Math.Min(bracket[0], bracket[1]), Math.Max(bracket[0], bracket[1]));
        // With a finite run length the transient threshold lies beyond the fold (near it the run
        // lingers by the saddle-node's ghost) — but close to it.
        Assert.InRange(threshold - fold, 0, 0.01);
        double oSlow = slow.GetProperty("ramp_overshoot_beyond_fold").GetDouble();
        double oFast = fast.GetProperty("ramp_overshoot_beyond_fold").GetDouble();
        // A ramp through a saddle-node overshoots by an amount growing with the rate (∝ rate^(2/3),
        // Haberman 1979, SIAM J. Appl. Math. 37, 69): 8× the rate gives 4× the overshoot; accept 2.5–6.
        Assert.True(oSlow > 0 && oFast > oSlow, $"overshoots {oSlow} (slow) and {oFast} (fast)");
        Assert.InRange(oFast / oSlow, 2.5, 6.0);
        var runs = ParquetTable.Read(Path.Combine(_cli.Path_("slow"), "collapse_runs.parquet"));
        Assert.Contains(1.0, runs.Doubles("collapsed"));
        Assert.Contains(0.0, runs.Doubles("collapsed"));
    }

    [Fact]
    public void Bad_level_and_duration_are_refused()
    {
        var (code, _, err) = _cli.Run("collapse", "--model", "stommel", "--vary", "Eta2", "--from", "1", "--to", "1.6", "--duration", "-5", "--out", _cli.Path_("a"));
        Assert.Equal(2, code);
        Assert.Contains("--duration = -5", err);
        (code, _, err) = _cli.Run("collapse", "--model", "stommel", "--vary", "Eta2", "--from", "1", "--to", "1.6", "--duration", "5", "--below", "1.5", "--out", _cli.Path_("b"));
        Assert.Equal(2, code);
        Assert.Contains("between 0 and 1", err);
        (code, _, err) = _cli.Run("collapse", "--model", "stommel", "--vary", "Eta2", "--from", "1", "--to", "1.6", "--duration", "5", "--watch", "flow", "--out", _cli.Path_("c"));
        Assert.Equal(2, code);
        Assert.Contains("did you mean 'flow_q'", err);
    }
}
