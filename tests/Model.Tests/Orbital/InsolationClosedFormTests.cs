using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

/// <summary>
/// Exact consequences of the daily-mean insolation formula listed in shared/reference/CHECK-VALUES.md
/// (Berger 1978; Berger and Loutre 1991; Hartmann, Global Physical Climatology, ch. 2).
/// </summary>
public class InsolationClosedFormTests
{
    private const double S0 = 1361.0;
    private static readonly OrbitalElements Present = Berger1978Orbit.Shared.At(0);

    public static TheoryData<double, double, double> Orbits => new()
    {
        // e, obliquity (deg), ϖ (deg): present, high-eccentricity and low-tilt orbits.
        { 0.016724, 23.446, 102.04 },
        { 0.05, 24.5, 275.0 },
        { 0.03, 22.1, 10.0 },
        { 0.0, 23.446, 0.0 },
    };

    [Fact]
    public void Equator_at_equinox_on_a_circular_orbit_is_S0_over_pi()
    {
        // CHECK-VALUES.md: circular orbit, equinox, equator: Q = S0/π = 433.2 W/m² for S0 = 1361.
        var circular = new OrbitalElements(0.0, 23.446, 102.04);
        double q = Insolation.DailyMean(circular, 0.0, 0.0, S0);
        Assert.Equal(S0 / Math.PI, q, 1e-9);
        Assert.Equal(433.2, q, 0.05);
        Assert.Equal(S0 / Math.PI, Insolation.DailyMean(circular, 0.0, 180.0, S0), 1e-9);
    }

    [Theory]
    [MemberData(nameof(Orbits))]
    public void Equator_at_equinox_scales_with_the_distance_factor(double e, double obliquity, double perihelion)
    {
        // Q = (S0/π)(1 − e cos(λ − ϖ))²/(1 − e²)² at λ = 0, where F = 1 at the equator (CHECK-VALUES.md formula).
        var o = new OrbitalElements(e, obliquity, perihelion);
        double k = 1 - e * Math.Cos(-perihelion * Math.PI / 180);
        Assert.Equal(S0 / Math.PI * k * k / Math.Pow(1 - e * e, 2), Insolation.DailyMean(o, 0, 0, S0), 1e-9);
    }

    [Theory]
    [MemberData(nameof(Orbits))]
    public void North_Pole_at_June_solstice(double e, double obliquity, double perihelion)
    {
        // CHECK-VALUES.md: Q = S0 sin ε (1 − e sin ϖ)² / (1 − e²)².
        var o = new OrbitalElements(e, obliquity, perihelion);
        double expected = S0 * Math.Sin(obliquity * Math.PI / 180) * Math.Pow(1 - e * Math.Sin(perihelion * Math.PI / 180), 2) / Math.Pow(1 - e * e, 2);
        Assert.Equal(expected, Insolation.DailyMean(o, 90, 90, S0), 1e-9);
        // And the South Pole is dark then.
        Assert.Equal(0.0, Insolation.DailyMean(o, -90, 90, S0));
    }

    [Theory]
    [MemberData(nameof(Orbits))]
    public void Global_annual_mean_is_S0_over_four_root_one_minus_e_squared(double e, double obliquity, double perihelion)
    {
        // CHECK-VALUES.md: global, annual mean S0 / (4 √(1 − e²)).
        var o = new OrbitalElements(e, obliquity, perihelion);
        Assert.Equal(S0 / (4 * Math.Sqrt(1 - e * e)), Insolation.BandAnnualMean(o, -90, 90, S0), 1e-7);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(45.0)]
    [InlineData(90.0)]
    [InlineData(200.0)]
    [InlineData(300.0)]
    public void Global_daily_mean_is_S0_over_four_times_the_distance_factor(double lambda)
    {
        // The Earth intercepts π R² S and spreads it over 4π R²: the global daily mean is (S0/4)(a/r)² (exact geometry).
        var o = new OrbitalElements(0.04, 24.0, 250.0);
        double k = 1 - 0.04 * Math.Cos((lambda - 250.0) * Math.PI / 180);
        double expected = S0 / 4 * k * k / Math.Pow(1 - 0.04 * 0.04, 2);
        Assert.Equal(expected, Insolation.BandDailyMean(o, -90, 90, lambda, S0), 1e-7);
    }

    [Theory]
    [MemberData(nameof(Orbits))]
    public void Annual_mean_is_symmetric_between_hemispheres_and_independent_of_perihelion(double e, double obliquity, double perihelion)
    {
        // CHECK-VALUES.md: annual-mean insolation is symmetric between hemispheres and independent of ϖ.
        var o = new OrbitalElements(e, obliquity, perihelion);
        foreach (double lat in new[] { 0.0, 10.0, 35.0, 65.0, 66.0, 80.0, 90.0 })
        {
            double north = Insolation.AnnualMean(o, lat, S0);
            Assert.Equal(north, Insolation.AnnualMean(o, -lat, S0), 1e-8);
            Assert.Equal(north, Insolation.AnnualMean(o with { PerihelionDeg = perihelion + 137.0 }, lat, S0), 1e-8);
        }
    }

    [Theory]
    [InlineData(23.446, 1.506648450027802)]
    [InlineData(22.0, 1.5141469174933415)]
    [InlineData(24.5, 1.5009136103670628)]
    public void Annual_mean_at_the_equator_is_a_complete_elliptic_integral(double obliquity, double ellipticE)
    {
        // At φ = 0, F = cos δ, so ∫₀^{2π} F dλ = 4 E(m = sin²ε) and the annual mean is 2 S0 E(m) / (π² √(1 − e²)).
        // E(m) from SciPy 1.10 scipy.special.ellipe (Debian python3-scipy), a reference library.
        var o = new OrbitalElements(0.02, obliquity, 40.0);
        double expected = 2 * S0 * ellipticE / (Math.PI * Math.PI * Math.Sqrt(1 - 0.02 * 0.02));
        Assert.Equal(expected, Insolation.AnnualMean(o, 0, S0), 1e-8);
    }

    [Theory]
    [MemberData(nameof(Orbits))]
    public void Annual_mean_at_the_pole_is_S0_sin_eps_over_pi_root_one_minus_e_squared(double e, double obliquity, double perihelion)
    {
        // At the pole F = π sin δ in polar day, 0 in polar night: ∫F dλ = 2π sin ε, so the annual mean is
        // S0 sin ε / (π √(1 − e²)) (closed form; e.g. Ward 1974, Science 184, 1069 — from memory).
        var o = new OrbitalElements(e, obliquity, perihelion);
        double expected = S0 * Math.Sin(obliquity * Math.PI / 180) / (Math.PI * Math.Sqrt(1 - e * e));
        Assert.Equal(expected, Insolation.AnnualMean(o, 90, S0), 1e-8);
        Assert.Equal(expected, Insolation.BandAnnualMean(o, 90, 90, S0), 1e-8);
    }

    [Theory]
    [InlineData(65.0)]
    [InlineData(30.0)]
    [InlineData(0.0)]
    [InlineData(-50.0)]
    public void Astronomical_summer_energy_is_independent_of_perihelion(double lat)
    {
        // CHECK-VALUES.md, "Kepler's second law compensation": the energy received between the equinoxes
        // (λ = 0° to 180°) does not depend on ϖ for a given e and ε.
        double reference = Insolation.EnergyBetweenLongitudes(new OrbitalElements(0.05, 23.446, 0.0), lat, 0, 180, S0);
        foreach (double w in new[] { 45.0, 90.0, 180.0, 270.0, 333.0 })
            Assert.Equal(reference, Insolation.EnergyBetweenLongitudes(new OrbitalElements(0.05, 23.446, w), lat, 0, 180, S0), 1e-9);
    }

    [Fact]
    public void Southern_summer_exceeds_northern_summer_today_and_the_reverse_at_127_ka()
    {
        // CHECK-VALUES.md: today perihelion falls in early January (λ ≈ 282°), so the 65°S December-solstice
        // insolation exceeds the 65°N June-solstice value (common practice); at 127 ka (ϖ = 275.41°, PMIP4)
        // perihelion fell in northern summer and the reverse holds.
        double north0 = Insolation.DailyMean(Present, 65, 90, S0);
        double south0 = Insolation.DailyMean(Present, -65, 270, S0);
        Assert.True(south0 > north0, $"0 ka: 65°S Dec {south0:F1} vs 65°N Jun {north0:F1}");
        Assert.Equal((1 + Present.ClimaticPrecession) * (1 + Present.ClimaticPrecession) / Math.Pow(1 - Present.ClimaticPrecession, 2), south0 / north0, 1e-9);

        OrbitalElements lig = Berger1978Orbit.Shared.At(IOrbitSource.YearsFromAgeKa(127));
        double north127 = Insolation.DailyMean(lig, 65, 90, S0);
        double south127 = Insolation.DailyMean(lig, -65, 270, S0);
        Assert.True(north127 > south127, $"127 ka: 65°N Jun {north127:F1} vs 65°S Dec {south127:F1}");
        // Last-interglacial 65°N June insolation was well above today's (about +60 W/m²; common practice).
        Assert.InRange(north127 - north0, 40, 80);
    }

    [Fact]
    public void Polar_night_is_dark_and_polar_day_is_continuous_sunlight()
    {
        // North of the Arctic circle at the December solstice the Sun never rises (common practice).
        Assert.Equal(0.0, Insolation.DailyMean(Present, 80, 270, S0));
        // In polar day, H = π: Q = S0 (a/r)² sin φ sin δ (formula of CHECK-VALUES.md with H = π).
        var ev = new InsolationEvaluator(Present, S0);
        double delta = ev.DeclinationDeg(90) * Math.PI / 180;
        double expected = S0 * ev.DistanceFactor(90) * Math.Sin(80 * Math.PI / 180) * Math.Sin(delta);
        Assert.Equal(expected, Insolation.DailyMean(Present, 80, 90, S0), 1e-9);
        Assert.Equal(Present.ObliquityDeg, ev.DeclinationDeg(90), 1e-12);
    }

    [Fact]
    public void Insolation_scales_with_the_solar_constant()
    {
        Assert.Equal(2.0 * Insolation.DailyMeanOnDay(Present, 40, 100, 1361), Insolation.DailyMeanOnDay(Present, 40, 100, 2722), 1e-9);
        Assert.Equal(1361.0, Insolation.DefaultSolarConstantWm2); // IAU 2015 Resolution B3 nominal value.
    }
}
