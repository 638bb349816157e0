using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Orbital;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>The run facade streams rows of (time, age, state, diagnostics, forcing) without the runner.</summary>
public class RunFacadeTests
{
    private sealed class Collect : IRowSink
    {
        public IReadOnlyList<ColumnInfo> Columns = [];
        public List<double[]> Rows = [];
        public RunSummary? Summary;
        public void Begin(IReadOnlyList<ColumnInfo> columns) => Columns = columns;
        public void Write(ReadOnlySpan<double> row) => Rows.Add(row.ToArray());
        public void End(RunSummary summary) => Summary = summary;
        public int Col(string name) => Columns.Select((c, i) => (c, i)).Single(x => x.c.Name == name).i;
    }

    [Fact]
    public void RowsCoverTheRunWithTimeAgeStateDiagnosticsAndForcing()
    {
        var run = new RunOptions { StartAgeKa = 21, DurationYears = 2000, OutputIntervalYears = 100 };
        var m = TropicalRun.CreateModel(new TropicalModelOptions(), run, Berger1978Orbit.Shared);
        var sink = new Collect();
        var summary = TropicalRun.Execute(m, run, sink);
        Assert.Equal(21, sink.Rows.Count);
        Assert.Equal(21, summary.Rows);
        Assert.Same(summary, sink.Summary);
        Assert.Equal(m.Columns.Count, sink.Rows[0].Length);
        // time_yr from 0 to the duration; age_ka = start age − time/1000 (paleoclimate convention, positive into the past).
        Assert.Equal(0, sink.Rows[0][sink.Col("time_yr")]);
        Assert.Equal(2000, sink.Rows[^1][sink.Col("time_yr")], 9);
        Assert.Equal(19, sink.Rows[^1][sink.Col("age_ka")], 9);
        // The first row is the initial state.
        Assert.Equal(m.InitialState()[0], sink.Rows[0][sink.Col("sst_warm_pool_degc")]);
        // Forcing columns: orbital elements at 21 ka (PMIP LGM protocol: ε = 22.949°, e = 0.018994; data/orbital/README.md).
        Assert.Equal(22.949, sink.Rows[0][sink.Col("obliquity_deg")], 2e-3);
        Assert.Equal(0.018994, sink.Rows[0][sink.Col("eccentricity")], 2e-5);
        Assert.Equal(280, sink.Rows[0][sink.Col("co2_ppm")]);
        // Derived column equals its definition.
        foreach (var r in sink.Rows) Assert.Equal(r[sink.Col("sst_warm_pool_degc")] - r[sink.Col("sst_cold_tongue_degc")], r[sink.Col("east_west_sst_difference_k")], 12);
    }

    [Fact]
    public void AveragedRowsAreMeansOfTheSamplesAndAnnualMeansRemoveTheSeasonalCycle()
    {
        var o = new TropicalModelOptions();
        o.Forcing.SeasonalCycle = true;
        var run = new RunOptions { DurationYears = 20, OutputIntervalYears = 1, SamplesPerOutput = 24, Method = RunMethod.DormandPrince54 };
        var m = TropicalRun.CreateModel(o, run, new ConstantOrbit(Present));
        var start = Equilibrium(Build());
        var annual = new Collect();
        TropicalRun.Execute(m, run, annual, initialState: start);
        var instant = new Collect();
        TropicalRun.Execute(m, new RunOptions { DurationYears = 20, OutputIntervalYears = 1.0 / 24, Method = RunMethod.DormandPrince54 }, instant, initialState: start);
        Assert.Equal(21, annual.Rows.Count);
        int tn = annual.Col("sst_north_degc");
        // Row k (k ≥ 1) is the mean of the 24 samples in ((k−1), k] years (definition).
        for (int k = 1; k <= 20; k++)
        {
            double mean = Enumerable.Range(24 * (k - 1) + 1, 24).Average(i => instant.Rows[i][tn]);
            Assert.Equal(mean, annual.Rows[k][tn], 1e-6);
            Assert.Equal(k, annual.Rows[k][annual.Col("time_yr")], 9);
        }
        // The seasonal cycle of the northern box (a few kelvin) is absent from the annual means after spin-up.
        var late = instant.Rows.Skip(24 * 10).Select(r => r[tn]).ToArray();
        var lateAnnual = annual.Rows.Skip(11).Select(r => r[tn]).ToArray();
        Assert.True(late.Max() - late.Min() > 1.0, $"seasonal range {late.Max() - late.Min()} K");
        Assert.True(lateAnnual.Max() - lateAnnual.Min() < 0.05, $"range of annual means {lateAnnual.Max() - lateAnnual.Min()} K");
    }

    [Fact]
    public void ProgressAndCancellation()
    {
        var run = new RunOptions { DurationYears = 1000, OutputIntervalYears = 10 };
        var m = TropicalRun.CreateModel(new TropicalModelOptions(), run, new ConstantOrbit(Present));
        var reports = new List<double>();
        TropicalRun.Execute(m, run, new Collect(), new SyncProgress(reports.Add));
        Assert.Equal(101, reports.Count);
        Assert.Equal(1.0, reports[^1]);
        Assert.True(reports.Zip(reports.Skip(1)).All(p => p.Second >= p.First));
        using var cts = new CancellationTokenSource();
        var sink = new CancelAfter(5, cts);
        Assert.ThrowsAny<OperationCanceledException>(() => TropicalRun.Execute(m, run, sink, cancellationToken: cts.Token));
        Assert.Equal(5, sink.Rows);
    }

    private sealed class SyncProgress(Action<double> report) : IProgress<double>
    {
        public void Report(double value) => report(value);
    }

    private sealed class CancelAfter(int rows, CancellationTokenSource cts) : IRowSink
    {
        public int Rows;
        public void Begin(IReadOnlyList<ColumnInfo> columns) { }
        public void Write(ReadOnlySpan<double> row) { if (++Rows == rows) cts.Cancel(); }
        public void End(RunSummary summary) { }
    }
}
