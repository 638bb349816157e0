using Thermostrat.Model.Analysis;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics.Ode;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>
/// Salt-advection threshold and hysteresis of the ventilation (Stommel 1961): freshening both
/// ventilation boxes collapses the ventilation at a fold; the ventilated state comes back only at a
/// smaller input; the collapsed state has almost no zonal SST contrast and a deeper thermocline.
/// </summary>
public class HosingHysteresisTests
{
    private const string Hosing = "Model:Processes:SurfaceFreshwater:HosingVentilationBoxes_Sv";

    private static readonly TropicalBoxModel Model = Build();
    private static readonly double[] OnState = Equilibrium(Model);

    /// <summary>Folds of the equilibrium branch in the symmetric hosing, by pseudo-arclength continuation.</summary>
    private static readonly (double Collapse, double Recovery) Folds = FindFolds();

    private static (double, double) FindFolds()
    {
        var branch = Continuation.Trace(Model, Hosing, OnState, Parameters(Model), new ContinuationOptions
        {
            ParameterMin = -0.5, ParameterMax = 2.0, Direction = ContinuationDirection.Increasing, MaxStep = 0.5, MaxPoints = 3000,
        });
        var folds = branch.OfKind(SpecialPointKind.Fold).Select(f => f.Parameter).ToArray();
        Assert.True(folds.Length == 2, $"expected two folds, found {folds.Length}: {string.Join(", ", folds)}");
        return (folds.Max(), folds.Min());
    }

    [Fact]
    public void ContinuationFindsTwoFoldsBoundingABistableRange()
    {
        // A saddle-node pair with the collapse fold at the larger input (Stommel 1961 structure; exact property).
        Assert.InRange(Folds.Collapse, 0.5, 2.0);
        Assert.True(Folds.Recovery < Folds.Collapse - 0.1, $"folds at {Folds.Recovery} and {Folds.Collapse} Sv");
    }

    [Fact]
    public void InsideTheBistableRangeTwoStableStatesCoexist()
    {
        double h = 0.5 * (Folds.Collapse + Folds.Recovery);
        var p = Parameters(Model);
        p[Model.ParameterIndex(Hosing)] = h;
        var on = Equilibrium(Model, p, OnState);
        // The collapsed state: reached by running past the collapse fold and back to h.
        var pHigh = (double[])p.Clone();
        pHigh[Model.ParameterIndex(Hosing)] = Folds.Collapse + 0.3;
        var high = OdeSolver.Solve(Model, pHigh, 0, OnState, 20000, new SolverOptions { Method = OdeMethod.Rodas4, Output = OutputTimes.FinalOnly });
        var off = Equilibrium(Model, p, [.. high.FinalState]);
        double psiOn = Diagnostics(Model, on, p)(TropicalDiagnostics.Upwelling), psiOff = Diagnostics(Model, off, p)(TropicalDiagnostics.Upwelling);
        Assert.True(psiOn > 5 && psiOff < 1, $"ψ on {psiOn} Sv, off {psiOff} Sv at {h} Sv");
        Assert.True(Stability.Analyze(Model, on, p).IsStable);
        Assert.True(Stability.Analyze(Model, off, p).IsStable);
    }

    [Fact]
    public void QuasiStaticRampCollapsesAtTheUpperFoldAndRecoversAtTheLowerOne()
    {
        // Ramp both ventilation boxes 0 → 1.6 → 0 Sv over 64 kyr (0.05 Sv/kyr, slow against the boxes' adjustment).
        const double peak = 1.6, duration = 64000;
        var model = Build(o =>
        {
            foreach (var s in new[] { o.Forcing.Freshwater.North, o.Forcing.Freshwater.South })
            {
                s.Shape = ScheduleShape.Table;
                s.Points = [new() { Year = 0, Rate_Sv = 0 }, new() { Year = duration / 2, Rate_Sv = peak }, new() { Year = duration, Rate_Sv = 0 }];
            }
        }, durationYears: duration);
        var rows = new List<double[]>();
        var sink = new ListSink(rows);
        TropicalRun.Execute(model, new RunOptions { DurationYears = duration, OutputIntervalYears = 20, Method = RunMethod.Rodas4, MaxStepYears = 20 }, sink, initialState: OnState);
        int psi = sink.Column("upwelling_sv"), hosing = sink.Column("hosing_scheduled_north_sv"), time = sink.Column("time_yr");
        int dT = sink.Column("east_west_sst_difference_k"), hE = sink.Column("thermocline_depth_east_m");
        const double threshold = 3.0; // Sv: between the on branch (≥ 10 Sv at its fold) and the collapsed one (≈ 0)
        var collapse = rows.First(r => r[psi] < threshold);
        var recovery = rows.First(r => r[time] > duration / 2 && r[psi] > threshold);
        // A slow ramp follows the stable branch to its fold and lags it only a little (exact property of quasi-static forcing).
        Assert.InRange(collapse[hosing], Folds.Collapse - 0.02, Folds.Collapse + 0.1);
        Assert.InRange(recovery[hosing], Folds.Recovery - 0.1, Folds.Recovery + 0.02);
        Assert.True(recovery[hosing] < collapse[hosing] - 0.1, $"collapse at {collapse[hosing]} Sv, recovery at {recovery[hosing]} Sv");
        // After the collapse (at the peak of the ramp): the zonal contrast is under 1.5 K and the eastern thermocline deeper.
        var atPeak = rows.MinBy(r => Math.Abs(r[time] - duration / 2))!;
        Assert.True(atPeak[dT] < 1.5, $"ΔT after collapse {atPeak[dT]} K");
        Assert.True(atPeak[hE] > rows[0][hE] + 20, $"h_E after collapse {atPeak[hE]} m, before {rows[0][hE]} m");
        // Back at zero input the ventilated state is restored.
        Assert.Equal(rows[0][psi], rows[^1][psi], 0.5);
    }

    [Fact]
    public void HosingOneHemisphereCollapsesOnlyItsOwnCell()
    {
        // A hemispheric threshold: freshening the north stops northern subduction, the southern cell continues.
        var p = Parameters(Model);
        p[Model.ParameterIndex("Model:Processes:SurfaceFreshwater:HosingNorth_Sv")] = 2.5;
        var run = OdeSolver.Solve(Model, p, 0, OnState, 20000, new SolverOptions { Method = OdeMethod.Rodas4, Output = OutputTimes.FinalOnly });
        var y = Equilibrium(Model, p, [.. run.FinalState]);
        var d = Diagnostics(Model, y, p);
        Assert.True(d(TropicalDiagnostics.VentilationNorth) < 0.5, $"ψ_N = {d(TropicalDiagnostics.VentilationNorth)} Sv");
        Assert.True(d(TropicalDiagnostics.VentilationSouth) > 5, $"ψ_S = {d(TropicalDiagnostics.VentilationSouth)} Sv");
    }

    private sealed class ListSink(List<double[]> rows) : IRowSink
    {
        private IReadOnlyList<ColumnInfo> _columns = [];
        public int Column(string name) => _columns.Select((c, i) => (c, i)).First(x => x.c.Name == name).i;
        public void Begin(IReadOnlyList<ColumnInfo> columns) => _columns = columns;
        public void Write(ReadOnlySpan<double> row) => rows.Add(row.ToArray());
        public void End(RunSummary summary) { }
    }
}
