using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics.Ode;
using Thermostrat.Model.Physics;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>
/// Conservation by construction (exact properties): with no hosing total salt is conserved to round-off,
/// and the heat stored equals the sum of the surface fluxes, at any state and time.
/// </summary>
public class ConservationTests
{
    private static IEnumerable<double[]> PerturbedStates(TropicalBoxModel m, int count, int seed)
    {
        var rng = new Random(seed);
        var y0 = Equilibrium(m);
        for (int k = 0; k < count; k++)
        {
            var y = (double[])y0.Clone();
            for (int i = 0; i < Boxes.Count; i++) y[i] += 4 * (rng.NextDouble() - 0.5);
            for (int i = Boxes.Count; i < Boxes.Count + 5; i++) y[i] += 1.0 * (rng.NextDouble() - 0.5);
            yield return y;
        }
    }

    private static (double Net, double Scale) SaltSum(BoxBudgets b)
    {
        double net = 0, scale = 0;
        foreach (double s in b.Salt) { net += s; scale += Math.Abs(s); }
        return (net, scale);
    }

    [Fact]
    public void WithoutHosingTotalSaltIsConservedToRoundOff()
    {
        var m = Build();
        foreach (var y in PerturbedStates(m, 20, 1))
        {
            var (net, scale) = SaltSum(m.Budgets(0, y));
            Assert.True(Math.Abs(net) <= 1e-13 * scale, $"net salt flux {net} against fluxes of {scale}");
            // The deep box, whose salinity is diagnosed from the total, receives exactly what the others lose.
            var b = m.Budgets(0, y);
            double upper = 0;
            for (int i = 0; i < 5; i++) upper += b.Volume_m3[i] * b.Rates[Boxes.Count + i] / TropicalBoxModel.SecondsPerYear;
            Assert.Equal(-upper, b.Salt[(int)Box.Deep], 1e-12 * scale);
        }
    }

    [Fact]
    public void CompensatedHosingConservesSaltAndUncompensatedHosingRemovesS0TimesTheInput()
    {
        var compensated = Build(o => o.Processes.Get<SurfaceFreshwaterOptions>(SurfaceFreshwater.ProcessName).HosingNorth_Sv = 0.7);
        foreach (var y in PerturbedStates(compensated, 5, 2))
        {
            var (net, scale) = SaltSum(compensated.Budgets(0, y));
            Assert.True(Math.Abs(net) <= 1e-13 * scale, $"compensated hosing: net salt flux {net}");
        }
        var open = Build(o =>
        {
            var f = o.Processes.Get<SurfaceFreshwaterOptions>(SurfaceFreshwater.ProcessName);
            f.HosingNorth_Sv = 0.7;
            f.Compensation = HosingCompensation.None;
        });
        Assert.Contains(open.StateVariables, s => s.Name == "mean_salinity_gkg");
        var y0 = open.InitialState();
        var (n2, s2) = SaltSum(open.Budgets(0, y0));
        // Virtual salt flux −S0·F of 0.7 Sv (Stommel 1961 form): exact.
        Assert.Equal(-35.0 * 0.7e6, n2, 1e-9 * s2);
        // The mean salinity falls at −S0·F/V_total per second.
        double vTotal = open.Budgets(0, y0).Volume_m3.Sum();
        Assert.Equal(-35.0 * 0.7e6 / vTotal * TropicalBoxModel.SecondsPerYear, open.Budgets(0, y0).Rates[^1], 1e-12);
    }

    [Fact]
    public void HeatStorageEqualsTheSumOfSurfaceFluxes()
    {
        var m = Build(o => o.Forcing.Co2.Constant_ppm = 560);
        foreach (var y in PerturbedStates(m, 20, 3))
        {
            var b = m.Budgets(0, y);
            double storage = 0, surface = 0, scale = 0;
            for (int i = 0; i < Boxes.Count; i++)
            {
                double s = b.RhoCp * b.Volume_m3[i] * b.Rates[i] / TropicalBoxModel.SecondsPerYear;
                storage += s;
                scale += Math.Abs(s);
            }
            for (int i = 0; i < Boxes.SurfaceCount; i++) surface += b.SurfaceHeatFlux_Wm2[i] * b.Area_m2[i];
            Assert.True(Math.Abs(storage - surface) <= 1e-12 * scale, $"storage {storage} W, surface input {surface} W");
        }
    }

    [Fact]
    public void OverARunTheHeatContentChangeEqualsTheIntegratedSurfaceInput()
    {
        // Integrate the surface input along the trajectory with fine output (Simpson's rule) and compare with
        // the change in heat content; agreement to the quadrature error (exact in the limit).
        var m = Build(durationYears: 200);
        var y0 = m.InitialState();
        y0[(int)Box.ColdTongue] -= 2;
        y0[(int)Box.North] += 1;
        var sink = new RecordingSink();
        OdeSolver.Solve(m, 0, y0, 200, new SolverOptions { Method = OdeMethod.DormandPrince54, RelativeTolerance = 1e-11, AbsoluteTolerance = 1e-12, Output = OutputTimes.Uniform(0.02) }, sink);
        double HeatContent(double[] y) { var b = m.Budgets(0, y); double h = 0; for (int i = 0; i < Boxes.Count; i++) h += b.RhoCp * b.Volume_m3[i] * y[i]; return h; }
        double Input(int k) { var b = m.Budgets(sink.Times[k], sink.States[k]); double q = 0; for (int i = 0; i < 4; i++) q += b.SurfaceHeatFlux_Wm2[i] * b.Area_m2[i]; return q * TropicalBoxModel.SecondsPerYear; }
        int n = sink.Times.Count - 1;
        Assert.Equal(0, n % 2);
        double integral = Input(0) + Input(n);
        for (int k = 1; k < n; k++) integral += (k % 2 == 1 ? 4 : 2) * Input(k);
        integral *= 0.02 / 3;
        double change = HeatContent(sink.States[n]) - HeatContent(sink.States[0]);
        Assert.True(Math.Abs(change - integral) <= 1e-6 * Math.Abs(change), $"heat content change {change:E6} J, integrated input {integral:E6} J");
    }
}
