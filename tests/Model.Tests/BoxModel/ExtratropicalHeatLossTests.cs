using Thermostrat.Model.Models.Tropical;
using Xunit;
using static Thermostrat.Model.Tests.BoxModel.BoxModelFixture;

namespace Thermostrat.Model.Tests.BoxModel;

/// <summary>
/// The heat-budget constraint on the thermocline: if the extratropics lose less heat, the tropics must
/// gain less, so the upwelled water must be warmer — the eastern thermocline deepens and the zonal SST
/// difference shrinks (MODEL-NOTES; Boccaletti et al. 2004). Checked monotone over documented ranges.
/// </summary>
public class ExtratropicalHeatLossTests
{
    private static readonly TropicalBoxModel Model = Build();

    private static List<(double Lever, double DeltaT, double EastDepth, double UpwelledT, double Loss)> Sweep(string key, double[] values)
    {
        var p = Parameters(Model);
        int i = Model.ParameterIndex(key);
        var guess = Equilibrium(Model);
        var result = new List<(double, double, double, double, double)>();
        foreach (double v in values)
        {
            p[i] = v;
            guess = Equilibrium(Model, p, guess);
            var d = Diagnostics(Model, guess, p);
            double loss = -(d(TropicalDiagnostics.NetSurfaceHeatFlux(Box.North)) * Model.Options.Boxes.North.Area_m2
                + d(TropicalDiagnostics.NetSurfaceHeatFlux(Box.South)) * Model.Options.Boxes.South.Area_m2);
            result.Add((v, ZonalDifference(guess), d(TropicalDiagnostics.ThermoclineEast), d(TropicalDiagnostics.UpwelledTemperature), loss));
        }
        return result;
    }

    [Fact]
    public void WeakerExtratropicalLossDeepensTheThermoclineAndReducesTheZonalDifference()
    {
        // D_x from 4 down to 0 W m⁻² K⁻¹ (the documented range of the lever).
        var s = Sweep("Model:Processes:AtmosphericTransport:ExtratropicalLoss_WmK", [4.0, 3.5, 3.0, 2.5, 2.0, 1.5, 1.0, 0.5, 0.0]);
        for (int k = 1; k < s.Count; k++)
        {
            Assert.True(s[k].Loss < s[k - 1].Loss, $"ocean heat loss of the ventilation boxes {s[k].Loss:E3} W at D_x = {s[k].Lever} is not below {s[k - 1].Loss:E3}");
            Assert.True(s[k].UpwelledT > s[k - 1].UpwelledT, $"upwelled temperature at D_x = {s[k].Lever}");
            Assert.True(s[k].EastDepth > s[k - 1].EastDepth, $"h_E = {s[k].EastDepth} m at D_x = {s[k].Lever} is not deeper than {s[k - 1].EastDepth} m");
            Assert.True(s[k].DeltaT < s[k - 1].DeltaT, $"ΔT = {s[k].DeltaT} K at D_x = {s[k].Lever} is not below {s[k - 1].DeltaT} K");
        }
        Assert.True(s[^1].EastDepth - s[0].EastDepth > 10, "the lever should move the eastern thermocline by more than 10 m over its range");
    }

    [Fact]
    public void LowerExtratropicalCloudAlbedoActsTheSameWay()
    {
        // Extratropical low-cloud albedo from 0.6 down to 0.2: more sunlight, warmer ventilation boxes, less ocean heat loss there.
        var s = Sweep("Model:Processes:LowCloud:Extratropical:CloudAlbedo", [0.6, 0.5, 0.45, 0.4, 0.3, 0.2]);
        for (int k = 1; k < s.Count; k++)
        {
            Assert.True(s[k].Loss < s[k - 1].Loss, $"loss at albedo {s[k].Lever}");
            Assert.True(s[k].EastDepth > s[k - 1].EastDepth, $"h_E = {s[k].EastDepth} m at albedo {s[k].Lever}");
            Assert.True(s[k].DeltaT < s[k - 1].DeltaT, $"ΔT = {s[k].DeltaT} K at albedo {s[k].Lever}");
        }
    }
}
