using Thermostrat.Model.Analysis;
using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Numerics.Ode;
using Thermostrat.Model.Physics;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>
/// Warm-water recharge (Jin 1997): with the instant form the default equilibrium is stable; with the
/// prognostic form the same state is an unstable focus and the run settles on interannual oscillations.
/// </summary>
public class RechargeOscillatorTests
{
    private static TropicalBoxModel Prognostic() =>
        Build(o => o.Processes.Get<WarmWaterRechargeOptions>(WarmWaterRecharge.ProcessName).Prognostic = true);

    [Fact]
    public void PrognosticRechargeHasTheSameEquilibriumAsTheInstantForm()
    {
        var instant = Build();
        var yi = Equilibrium(instant);
        var m = Prognostic();
        Assert.Equal(instant.Dimension + 1, m.Dimension);
        var yp = Equilibrium(m, guess: yi);
        for (int i = 0; i < yi.Length; i++) Assert.Equal(yi[i], yp[i], 1e-8);
        // The recharge anomaly state equals the instant anomaly there.
        Assert.Equal(Diagnostics(instant, yi)(TropicalDiagnostics.WarmWaterAnomaly), yp[^1], 1e-9);
    }

    [Fact]
    public void PrognosticRechargeDestabilizesIntoInterannualOscillations()
    {
        var m = Prognostic();
        var y = Equilibrium(m, guess: Equilibrium(Build()));
        var report = Stability.Analyze(m, y, Parameters(m));
        Assert.False(report.IsStable);
        Assert.True(report.Leading.Imaginary != 0, "the leading eigenvalue should be one of a complex pair (an oscillatory instability)");

        var start = (double[])y.Clone();
        start[(int)Box.ColdTongue] += 0.1;
        var sink = new RecordingSink();
        OdeSolver.Solve(m, 0, start, 200, new SolverOptions { Method = OdeMethod.DormandPrince54, RelativeTolerance = 1e-8, AbsoluteTolerance = 1e-9, Output = OutputTimes.Uniform(0.02) }, sink);
        var late = Enumerable.Range(0, sink.Times.Count).Where(i => sink.Times[i] >= 100).ToArray();
        double[] te = late.Select(i => sink.States[i][(int)Box.ColdTongue]).ToArray();
        double mean = te.Average();
        var ups = Enumerable.Range(1, te.Length - 1).Where(k => te[k - 1] < mean && te[k] >= mean).Select(k => sink.Times[late[k]]).ToArray();
        Assert.True(ups.Length >= 10, $"only {ups.Length} upward crossings in 100 years");
        double period = (ups[^1] - ups[0]) / (ups.Length - 1);
        // Interannual (warm/cold event) periods 2–7 years (common practice; CHECK-VALUES.md).
        Assert.InRange(period, 2.0, 7.0);
        // A bounded, sustained oscillation of a few kelvin (a limit cycle): not decaying between the two halves.
        double firstHalf = te[..(te.Length / 2)].Max() - te[..(te.Length / 2)].Min(), secondHalf = te[(te.Length / 2)..].Max() - te[(te.Length / 2)..].Min();
        Assert.InRange(secondHalf, 1.0, 10.0);
        Assert.Equal(firstHalf, secondHalf, 0.05 * secondHalf);
    }
}
