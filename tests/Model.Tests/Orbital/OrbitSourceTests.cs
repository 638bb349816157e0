using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

/// <summary>Idealized, constant and interpolated orbits, and precomputed forcing series.</summary>
public class OrbitSourceTests
{
    private static readonly Berger1978Orbit Berger = Berger1978Orbit.Shared;

    [Fact]
    public void Fixed_tilt_holds_obliquity_and_follows_the_rest()
    {
        var orbit = new IdealizedOrbit(Berger, fixedObliquityDeg: 23.0);
        foreach (double t in new[] { 0.0, -41_000.0, -127_000.0 })
        {
            OrbitalElements b = Berger.At(t), i = orbit.At(t);
            Assert.Equal(23.0, i.ObliquityDeg);
            Assert.Equal(b.Eccentricity, i.Eccentricity);
            Assert.Equal(b.PerihelionDeg, i.PerihelionDeg);
        }
        Assert.Contains("obliquity fixed at 23°", orbit.Description);
    }

    [Fact]
    public void Circular_orbit_removes_precession_from_insolation()
    {
        // With e = 0, insolation depends on ε only: the equator at equinox gets S0/π at every epoch (CHECK-VALUES.md).
        var orbit = IdealizedOrbit.Circular(Berger);
        foreach (double t in new[] { 0.0, -11_000.0, -23_000.0 })
        {
            OrbitalElements o = orbit.At(t);
            Assert.Equal(0.0, o.Eccentricity);
            Assert.Equal(0.0, o.ClimaticPrecession);
            Assert.Equal(1361.0 / Math.PI, Insolation.DailyMean(o, 0, 0), 1e-9);
        }
        Assert.Contains("circular orbit", orbit.Description);
    }

    [Fact]
    public void Elements_can_be_held_at_their_present_values()
    {
        var orbit = IdealizedOrbit.HoldAtPresent(Berger, eccentricity: true, perihelion: true);
        OrbitalElements now = Berger.At(0), then = orbit.At(-100_000), base100 = Berger.At(-100_000);
        Assert.Equal(now.Eccentricity, then.Eccentricity);
        Assert.Equal(now.PerihelionDeg, then.PerihelionDeg, 1e-12);
        Assert.Equal(base100.ObliquityDeg, then.ObliquityDeg);
    }

    [Fact]
    public void Fully_fixed_orbits_never_consult_the_base()
    {
        // A short table as base: with every element fixed, any time is served.
        var table = TabulatedOrbit.FromRows("short", [0, 1, 2, 3], [0.02, 0.02, 0.02, 0.02], [23, 23, 23, 23], [100, 101, 102, 103]);
        var orbit = new IdealizedOrbit(table, 0.01, 22.5, 400.0);
        Assert.Equal(new OrbitalElements(0.01, 22.5, 40.0), orbit.At(-3_000_000));
        Assert.Empty(orbit.CheckRange(-3_000_000, 0));
        Assert.Equal(new OrbitalElements(0.01, 22.5, 40.0), new ConstantOrbit(new OrbitalElements(0.01, 22.5, 400.0)).At(-7e6));
    }

    [Theory]
    [InlineData(1.0, null, null, "fixedEccentricity")]
    [InlineData(-0.1, null, null, "fixedEccentricity")]
    [InlineData(null, 91.0, null, "fixedObliquityDeg")]
    [InlineData(null, double.NaN, null, "fixedObliquityDeg")]
    [InlineData(null, null, double.PositiveInfinity, "fixedPerihelionDeg")]
    public void Bad_fixed_values_are_rejected(double? e, double? obliquity, double? perihelion, string parameter)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new IdealizedOrbit(Berger, e, obliquity, perihelion));
        Assert.Equal(parameter, ex.ParamName);
        Assert.Contains("allowed", ex.Message);
    }

    [Fact]
    public void Interpolated_orbit_reproduces_the_series()
    {
        // 100-year spacing: cubic interpolation error ∝ h⁴ is ~1e-9 for precession periods ≥ 19 kyr.
        var fast = new InterpolatedOrbit(Berger, -1_000_000, 0, 100);
        Assert.Empty(fast.Warnings);
        Assert.True(fast.SpacingYears <= 100);
        var rnd = new Random(7);
        for (int i = 0; i < 2000; i++)
        {
            double t = -1_000_000 * rnd.NextDouble();
            OrbitalElements a = Berger.At(t), b = fast.At(t);
            Assert.Equal(a.ClimaticPrecession, b.ClimaticPrecession, 5e-9);
            Assert.Equal(a.EccentricityCosPerihelion, b.EccentricityCosPerihelion, 5e-9);
            Assert.Equal(a.ObliquityDeg, b.ObliquityDeg, 1e-8);
        }
        Assert.Equal(Berger.At(0).Eccentricity, fast.At(0).Eccentricity, 1e-15);
        Assert.Equal(Berger.At(-1_000_000).Eccentricity, fast.At(-1_000_000).Eccentricity, 1e-15);
    }

    [Fact]
    public void Interpolated_orbit_refuses_times_outside_its_span_and_keeps_warnings()
    {
        var fast = new InterpolatedOrbit(Berger, -200_000, 0, 500);
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => fast.At(-200_001));
        Assert.Contains("outside the interpolated span", ex.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => fast.CheckRange(-300_000, 0));

        var far = new InterpolatedOrbit(Berger, -1_500_000, -1_000_000, 1000);
        Assert.Contains(far.Warnings, w => w.Contains("±1 Myr"));
        Assert.Throws<ArgumentOutOfRangeException>(() => new InterpolatedOrbit(Berger, -6e6, 0, 1000));
        Assert.Throws<ArgumentOutOfRangeException>(() => new InterpolatedOrbit(Berger, -1000, 0, 0));
        Assert.Throws<ArgumentException>(() => new InterpolatedOrbit(Berger, 0, 0, 10));
    }

    [Fact]
    public void Idealized_orbit_over_an_interpolant_keeps_fixed_values_exact()
    {
        var orbit = new IdealizedOrbit(new InterpolatedOrbit(Berger, -50_000, 0, 100), fixedPerihelionDeg: 90.0);
        Assert.Equal(90.0, orbit.At(-12_345).PerihelionDeg);
    }

    [Fact]
    public void Forcing_series_matches_direct_evaluation()
    {
        // Band annual-mean insolation (depends on ε and e) on a 250-year grid over 200 kyr.
        var orbit = new InterpolatedOrbit(Berger, -200_000, 0, 100);
        var series = OrbitalForcingSeries.Create(orbit, -200_000, 0, 250, "annual mean 5°S–5°N, W/m²", o => Insolation.BandAnnualMean(o, -5, 5));
        var rnd = new Random(3);
        for (int i = 0; i < 50; i++)
        {
            double t = -200_000 * rnd.NextDouble();
            Assert.Equal(Insolation.BandAnnualMean(orbit.At(t), -5, 5), series.ValueAt(t), 1e-6);
        }
        Assert.Throws<ArgumentOutOfRangeException>(() => series.ValueAt(10));
    }

    [Fact]
    public void Multi_channel_series_is_deterministic_and_checks_its_quantities()
    {
        string[] names = ["65°N June 21 daily mean, W/m²", "climatic precession"];
        OrbitalForcingSeries.QuantityWriter write = (o, d) =>
        {
            d[0] = Insolation.DailyMeanOnDay(o, 65, 171.5);
            d[1] = o.ClimaticPrecession;
        };
        var parallel = new OrbitalForcingSeries(Berger, -100_000, 0, 200, names, write, parallel: true);
        var serial = new OrbitalForcingSeries(Berger, -100_000, 0, 200, names, write, parallel: false);
        Span<double> a = stackalloc double[2], b = stackalloc double[2];
        for (double t = -100_000; t <= 0; t += 777)
        {
            parallel.ValuesAt(t, a);
            serial.ValuesAt(t, b);
            Assert.Equal(a[0], b[0]);
            Assert.Equal(a[1], b[1]);
            Assert.Equal(Berger.At(t).ClimaticPrecession, a[1], 1e-8);
        }
        var bad = Assert.Throws<InvalidOperationException>(() =>
            new OrbitalForcingSeries(Berger, -10_000, 0, 1000, ["x", "y"], (o, d) => d[0] = 1.0));
        Assert.Contains("'y'", bad.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => parallel.ValueAt(-50_000, channel: 2));
    }
}
