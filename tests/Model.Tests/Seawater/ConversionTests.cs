using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>Salinity, temperature and depth conversions (the check-cast comparisons are in <see cref="Teos10Tests"/>).</summary>
public sealed class ConversionTests
{
    [Fact]
    public void ReferenceCompositionRatioIsExact()
    {
        // Millero et al. (2008): SP = 35 ↔ SR = 35.16504 g/kg exactly by definition.
        Assert.Equal(35.16504, SalinityConversions.AbsoluteFromPractical(35.0), 13);
        Assert.Equal(35.0, SalinityConversions.PracticalFromAbsolute(35.16504), 13);
        Assert.Equal(0.0, SalinityConversions.AbsoluteFromPractical(0.0));
    }

    [Fact]
    public void PotentialAndConservativeTemperatureAreInverses()
    {
        // θ(Θ(θ)) = θ to the Newton tolerance over the oceanographic range (exact property).
        for (double sa = 0; sa <= 42; sa += 3)
            for (double pt = -2; pt <= 40; pt += 2.5)
            {
                double ct = TemperatureConversions.ConservativeFromPotential(sa, pt);
                Assert.Equal(pt, TemperatureConversions.PotentialFromConservative(sa, ct), 1e-11);
            }
    }

    [Fact]
    public void PotentialEnthalpyDerivativeIsExact()
    {
        // Analytic ∂h⁰/∂θ against a central difference (h = 1e-3 K; h⁰ ~ 1e5 J/kg, so rounding ≈ 1e-8 J/kg/K).
        foreach (double sa in new[] { 0.0, 10.0, 35.16504, 42.0 })
            foreach (double pt in new[] { -2.0, 4.0, 20.0, 40.0 })
            {
                const double h = 1e-3;
                double fd = (TemperatureConversions.PotentialEnthalpy(sa, pt + h) - TemperatureConversions.PotentialEnthalpy(sa, pt - h)) / (2 * h);
                Assert.Equal(fd, TemperatureConversions.PotentialEnthalpyTemperatureDerivative(sa, pt), 1e-6);
            }
    }

    [Fact]
    public void ConservativeTemperatureIsCloseToPotentialTemperatureInSeawater()
    {
        // Fact of the trade (McDougall 2003, J. Phys. Oceanogr. 33, 945; quoted from memory): at standard-ocean
        // salinity Θ and θ differ by hundredths of a kelvin (python3-gsw 3.6.16 gives at most 0.011 K over 0–30 °C).
        for (double pt = 0; pt <= 30; pt += 5)
            Assert.InRange(TemperatureConversions.ConservativeFromPotential(35.16504, pt) - pt, -0.02, 0.02);
    }

    [Fact]
    public void PressureFromDepthAgreesWithTeos10()
    {
        // Saunders (1981) against gsw.p_from_z (python3-gsw 3.6.16, Fixtures/Seawater/gsw_p_from_z.csv):
        // within 0.05 % of the pressure (measured at most 0.042 %, 3.4 dbar at 8000 m and 60°).
        var f = SeawaterFixture.Load("gsw_p_from_z.csv");
        Assertions.AllWithin("pressure from depth",
            f.Rows.Select(r => ($"depth {f.Text(r, "depth")} m, latitude {f.Text(r, "latitude")}", f.Value(r, "p"),
                SeawaterDepth.PressureFromDepth(f.Value(r, "depth"), f.Value(r, "latitude")))),
            p => 5e-4 * p + 1e-12);
    }

    [Fact]
    public void PressureFromDepthRejectsBadInputNamingIt()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => SeawaterDepth.PressureFromDepth(-5));
        Assert.Contains("depth_m", ex.Message);
        Assert.Contains("-5", ex.Message);
        ex = Assert.Throws<ArgumentOutOfRangeException>(() => SeawaterDepth.PressureFromDepth(100, double.NaN));
        Assert.Contains("latitude_deg", ex.Message);
    }
}
