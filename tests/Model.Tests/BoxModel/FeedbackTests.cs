using Thermostrat.Model.Models.Tropical;
using Thermostrat.Model.Physics;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>
/// The positive feedbacks that sharpen the zonal SST contrast (Bjerknes 1969; Klein and Hartmann 1993):
/// removing either must reduce the east–west SST difference (issue; common practice).
/// </summary>
public class FeedbackTests
{
    private static readonly double DefaultDifference = ZonalDifference(Equilibrium(Build()));

    [Fact]
    public void TurningOffTheStratusFeedbackReducesTheZonalDifference()
    {
        var m = Build(o => o.Processes[LowCloud.ProcessName].Enabled = false);
        double dT = ZonalDifference(Equilibrium(m));
        Assert.True(dT < DefaultDifference - 0.3, $"ΔT without low cloud {dT:F2} K, default {DefaultDifference:F2} K");
    }

    [Fact]
    public void RemovingTheStabilityDependenceAtFixedMeanCloudReducesTheZonalDifference()
    {
        // The feedback alone: slope s = 0 with each regime's intercept set to its area-mean cloud fraction at the
        // default equilibrium, so the mean cloud is unchanged but no longer follows the local SST.
        var m = Build();
        var y = Equilibrium(m);
        var d = Diagnostics(m, y);
        double Mean(Box a, Box b) => (d(TropicalDiagnostics.LowCloudFraction(a)) * m.Options.Boxes[a].Area_m2 + d(TropicalDiagnostics.LowCloudFraction(b)) * m.Options.Boxes[b].Area_m2)
            / (m.Options.Boxes[a].Area_m2 + m.Options.Boxes[b].Area_m2);
        var p = Parameters(m);
        p[m.ParameterIndex("Model:Processes:LowCloud:Tropical:Slope_perK")] = 0;
        p[m.ParameterIndex("Model:Processes:LowCloud:Tropical:Intercept")] = Mean(Box.WarmPool, Box.ColdTongue);
        p[m.ParameterIndex("Model:Processes:LowCloud:Extratropical:Slope_perK")] = 0;
        p[m.ParameterIndex("Model:Processes:LowCloud:Extratropical:Intercept")] = Mean(Box.North, Box.South);
        double dT = ZonalDifference(Equilibrium(m, p, y));
        Assert.True(dT < DefaultDifference - 0.3, $"ΔT with SST-independent cloud {dT:F2} K, default {DefaultDifference:F2} K");
    }

    [Fact]
    public void TurningOffTheWindCouplingReducesTheZonalDifference()
    {
        var m = Build(o => o.Processes[BjerknesWindStress.ProcessName].Enabled = false);
        var y = Equilibrium(m);
        double dT = ZonalDifference(y);
        Assert.True(dT < DefaultDifference - 0.3, $"ΔT without wind coupling {dT:F2} K, default {DefaultDifference:F2} K");
        // Without coupling the stress is the background τ0 and the overturning it drives is weaker.
        var d = Diagnostics(m, y);
        Assert.Equal(m.Options.Processes.Get<BjerknesWindOptions>(BjerknesWindStress.ProcessName).Background_Nm2, d(TropicalDiagnostics.WindStress), 12);
    }

    [Fact]
    public void WeakerCouplingCoefficientReducesTheZonalDifferenceMonotonically()
    {
        // Continuous version of the switch: ΔT decreases as μ goes to 0 (the Bjerknes feedback weakens).
        var m = Build();
        var p = Parameters(m);
        int mu = m.ParameterIndex("Model:Processes:BjerknesWind:Coupling_NmK");
        double previous = double.PositiveInfinity;
        var guess = Equilibrium(m);
        foreach (double value in new[] { 0.0092, 0.007, 0.005, 0.003, 0.001 })
        {
            p[mu] = value;
            guess = Equilibrium(m, p, guess);
            double dT = ZonalDifference(guess);
            Assert.True(dT < previous, $"ΔT = {dT} at μ = {value} is not below {previous}");
            previous = dT;
        }
    }
}
