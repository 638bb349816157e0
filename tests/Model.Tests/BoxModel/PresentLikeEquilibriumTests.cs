using Thermostrat.Model.Analysis;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics.Ode;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>The default model's equilibrium under the present orbit against tropical-Pacific facts of the trade.</summary>
public class PresentLikeEquilibriumTests
{
    private static readonly TropicalBoxModel Model = Build();
    private static readonly double[] State = Equilibrium(Model);
    private static readonly Func<string, double> D = Diagnostics(Model, State);

    [Fact]
    public void WarmPoolAndColdTongueTemperaturesArePresentLike()
    {
        // Annual-mean SST: western warm pool ≈ 29–30 °C, eastern cold tongue ≈ 23–25 °C
        // (common practice; CHECK-VALUES.md, tropical Pacific climatology); bands from the issue.
        Assert.InRange(State[(int)Box.WarmPool], 28.0, 31.0);
        Assert.InRange(State[(int)Box.ColdTongue], 22.0, 26.0);
        Assert.InRange(ZonalDifference(State), 3.0, 7.0);
    }

    [Fact]
    public void ThermoclineIsShallowerInTheEast()
    {
        // 20 °C isotherm ≈ 40–60 m in the east, 150–200 m in the west (common practice; CHECK-VALUES.md).
        double east = D(TropicalDiagnostics.ThermoclineEast), west = D(TropicalDiagnostics.ThermoclineWest);
        Assert.True(east < west, $"h_E = {east} m should be shallower than h_W = {west} m");
        Assert.InRange(east, 30.0, 100.0);
        Assert.InRange(west, 120.0, 260.0);
    }

    [Fact]
    public void VentilationAndCloudArePresentLike()
    {
        // Subtropical cells 20–40 Sv in total (common practice; MODEL-NOTES); the band is 10–60 Sv.
        Assert.InRange(D(TropicalDiagnostics.Upwelling), 10.0, 60.0);
        Assert.InRange(D(TropicalDiagnostics.VentilationNorth), 5.0, 30.0);
        Assert.InRange(D(TropicalDiagnostics.VentilationSouth), 5.0, 30.0);
        // Cold-tongue low-cloud fraction between 0.3 and 0.8 (issue; Klein and Hartmann 1993 climatologies).
        Assert.InRange(D(TropicalDiagnostics.LowCloudFraction(Box.ColdTongue)), 0.3, 0.8);
        // The warm pool, with the least stable lower troposphere, has less low cloud than the cold tongue.
        Assert.True(D(TropicalDiagnostics.LowCloudFraction(Box.WarmPool)) < D(TropicalDiagnostics.LowCloudFraction(Box.ColdTongue)));
    }

    [Fact]
    public void SurfaceFluxesHaveTheObservedSigns()
    {
        // The equatorial ocean gains heat (most where cold water upwells) and the ventilation boxes lose it
        // (common practice: cold-tongue net heat gain ≈ 100 W/m², extratropical loss).
        double e = D(TropicalDiagnostics.NetSurfaceHeatFlux(Box.ColdTongue)), w = D(TropicalDiagnostics.NetSurfaceHeatFlux(Box.WarmPool));
        Assert.True(e > w && w > 0, $"Q_E = {e}, Q_W = {w} W/m²");
        Assert.True(D(TropicalDiagnostics.NetSurfaceHeatFlux(Box.North)) < 0);
        Assert.True(D(TropicalDiagnostics.NetSurfaceHeatFlux(Box.South)) < 0);
        // Steady state: the surface fluxes balance (exact property of an equilibrium with closed ocean transports).
        double total = 0, scale = 0;
        foreach (var b in Boxes.Surface)
        {
            double q = D(TropicalDiagnostics.NetSurfaceHeatFlux(b)) * Model.Options.Boxes[b].Area_m2;
            total += q;
            scale += Math.Abs(q);
        }
        Assert.True(Math.Abs(total) < 1e-8 * scale, $"net surface heat input {total} W at equilibrium");
    }

    [Fact]
    public void EquilibriumIsStableAndIsTheAttractorOfTheConfiguredStart()
    {
        var report = Stability.Analyze(Model, State, Parameters(Model));
        Assert.True(report.IsStable, $"leading eigenvalue {report.Leading}");
        // A long transient from the configured initial state ends at the same equilibrium (uniqueness near the default).
        var run = OdeSolver.Solve(Model, 0, Model.InitialState(), 30000, new SolverOptions { Method = OdeMethod.Rodas4, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-9, Output = OutputTimes.FinalOnly });
        for (int i = 0; i < State.Length; i++) Assert.Equal(State[i], run.FinalState[i], 1e-3);
    }
}
