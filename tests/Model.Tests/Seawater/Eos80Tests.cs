using Thermostrat.Model.Seawater;
using Xunit;

namespace Thermostrat.Model.Tests.Seawater;

/// <summary>EOS-80 against the UNESCO check values, and against TEOS-10 at the surface.</summary>
public sealed class Eos80Tests
{
    [Theory]
    // UNESCO (1981) / Fofonoff and Millard (1983), UNESCO Tech. Pap. Mar. Sci. 44, check values as listed in
    // shared/reference/CHECK-VALUES.md (practical salinity, IPTS-68 °C, dbar); asserted to their printed digits.
    [InlineData(0.0, 5.0, 0.0, 999.96675)]
    [InlineData(35.0, 5.0, 0.0, 1027.67547)]
    [InlineData(35.0, 25.0, 0.0, 1023.34306)]
    [InlineData(35.0, 25.0, 10000.0, 1062.53817)]
    public void DensityMatchesUnescoCheckValues(double s, double t68, double p, double rho) =>
        Assert.InRange(Eos80.Density(s, t68, p), rho - 0.5e-5, rho + 0.5e-5);

    [Theory]
    // Secant bulk modulus check values of Fofonoff and Millard (1983), in bar. Quoted from memory (not in the
    // vetted list); the density at 10000 dbar above already exercises K independently.
    [InlineData(0.0, 5.0, 0.0, 20337.80375)]
    [InlineData(35.0, 25.0, 10000.0, 27108.94504)]
    public void SecantBulkModulusMatchesCheckValuesQuotedFromMemory(double s, double t68, double p, double k) =>
        Assert.InRange(Eos80.SecantBulkModulus(s, t68, p), k - 0.5e-5, k + 0.5e-5);

    [Fact]
    public void OneAtmosphereDensityIsTheDensityAtZeroPressure()
    {
        // ρ(S, t, 0) = ρ(S, t, 0)/(1 − 0/K): exact.
        Assert.Equal(Eos80.OneAtmosphereDensity(35.0, 10.0), Eos80.Density(35.0, 10.0, 0.0));
        // S = 0 reduces to the pure-water (SMOW) polynomial: exact.
        Assert.Equal(Eos80.PureWaterDensity(4.0), Eos80.OneAtmosphereDensity(0.0, 4.0));
    }

    [Fact]
    public void AgreesWithTeos10AtTheSurfaceAfterConversions()
    {
        // A known property of the two standards: at the surface EOS-80 (SP, t68) and TEOS-10 (SA, CT) densities
        // agree to a few thousandths of a kg/m³ once SA = SP·35.16504/35 and CT = CT(SA, θ = t) (IOC et al. 2010,
        // TEOS-10 manual; CHECK-VALUES.md records 0.0053 kg/m³ over S 0–40, t 0–35 °C computed with
        // python3-gsw 3.6.16). The bound: 0.02 kg/m³ over 0–40 g/kg and 0–35 °C.
        double worst = 0;
        for (double sa = 0; sa <= 40.0 + 1e-9; sa += 0.5)
        {
            for (double t90 = 0; t90 <= 35.0 + 1e-9; t90 += 0.5)
            {
                double sp = SalinityConversions.PracticalFromAbsolute(sa);
                double eos80 = Eos80.Density(sp, TemperatureConversions.T68FromT90(t90), 0.0);
                double ct = TemperatureConversions.ConservativeFromInSituAtSurface(sa, t90);
                double teos10 = Teos10.Density(sa, ct, 0.0);
                worst = Math.Max(worst, Math.Abs(eos80 - teos10));
            }
        }
        Assert.True(worst < 0.02, $"largest |EOS-80 − TEOS-10| = {worst} kg/m³");
        // And the property is not trivially met: the two are different equations.
        Assert.True(worst > 1e-4, $"largest |EOS-80 − TEOS-10| = {worst} kg/m³ is implausibly small");
    }

    [Fact]
    public void StatedErrorOfTreatingTheBoxTemperatureAsInSituTemperature()
    {
        // Eos80EquationOfState's remarks: fed Θ as if it were in-situ temperature, EOS-80 differs from TEOS-10 at the
        // surface by up to about 0.1 kg/m³ for S_A ≥ 30 g/kg and 0.6 kg/m³ in warm fresh water (python3-gsw 3.6.16
        // gives 0.102 and 0.566 kg/m³ over S_A 0–40 g/kg, 0–35 °C). The bounds are checked here, as is that the
        // difference is real (so the remark is needed).
        IEquationOfState eos80 = EquationsOfState.Create("eos80"), teos10 = EquationsOfState.Create("teos10");
        double worstSalty = 0, worstAll = 0;
        for (double sa = 0; sa <= 40.0 + 1e-9; sa += 0.5)
            for (double t = 0; t <= 35.0 + 1e-9; t += 0.5)
            {
                double d = Math.Abs(eos80.Density(sa, t, 0.0) - teos10.Density(sa, t, 0.0));
                worstAll = Math.Max(worstAll, d);
                if (sa >= 30) worstSalty = Math.Max(worstSalty, d);
            }
        Assert.InRange(worstSalty, 0.05, 0.11);
        Assert.InRange(worstAll, 0.5, 0.6);
    }

    [Fact]
    public void AdapterMapsBoxVariablesOntoNativeOnes()
    {
        // Documented mapping: SP = SA·35/35.16504, t68 = 1.00024 t (t treated as in-situ ITS-90), p unchanged.
        var eos = new Eos80EquationOfState();
        double sa = 35.16504, t = 12.0, p = 1500.0;
        Assert.Equal(Eos80.Density(35.0 * (35.0 / 35.16504) * (35.16504 / 35.0), 1.00024 * t, p), eos.Density(sa, t, p), 12);
        Assert.Equal(Eos80.DensityFromT90(35.0, t, p), eos.Density(sa, t, p), 12);
        // α, β by the chain rule.
        Assert.Equal(1.00024 * Eos80.ThermalExpansion(35.0, 1.00024 * t, p), eos.ThermalExpansion(sa, t, p), 15);
        Assert.Equal(35.0 / 35.16504 * Eos80.HalineContraction(35.0, 1.00024 * t, p), eos.HalineContraction(sa, t, p), 15);
    }

    [Fact]
    public void T68AndT90AreOneScaleFactorApart()
    {
        // t68 = 1.00024 t90 (Saunders 1990, from memory; TEOS-10's gsw_t90_from_t68 divides by the same factor,
        // checked against the check cast in Teos10Tests).
        Assert.Equal(25.006, TemperatureConversions.T68FromT90(25.0), 12);
        Assert.Equal(25.0, TemperatureConversions.T90FromT68(TemperatureConversions.T68FromT90(25.0)), 12);
    }
}
