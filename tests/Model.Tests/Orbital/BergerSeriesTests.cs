using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

public class BergerSeriesTests
{
    /// <summary>
    /// Epoch table of data/orbital/README.md: Berger (1978) present-day values and the PMIP protocols
    /// (Otto-Bliesner et al. 2017, GMD 10, 3979; Kageyama et al. 2017, GMD 10, 4035; the PMIP values are
    /// quoted there from memory of those papers). Tolerances are half a unit of the last printed digit
    /// (plus rounding slack for values that sit on a rounding boundary).
    /// </summary>
    public static TheoryData<string, double, double, double, double> Epochs => new()
    {
        // label, t (years since 1950), e, obliquity (deg), perihelion ϖ (deg)
        { "1950 CE, Berger (1978) present-day values", 0.0, 0.016724, 23.446, 102.04 },
        { "1850 CE, PMIP4 pre-industrial", -100.0, 0.016764, 23.459, 100.33 },
        { "6 ka, PMIP4 mid-Holocene", -6000.0, 0.018682, 24.105, 0.87 },
        { "21 ka, PMIP Last Glacial Maximum", -21000.0, 0.018994, 22.949, 114.42 },
        { "127 ka, PMIP4 last interglacial", -127000.0, 0.039378, 24.040, 275.41 },
    };

    [Theory]
    [MemberData(nameof(Epochs))]
    public void Elements_match_published_epoch_values(string label, double t, double e, double obliquity, double perihelion)
    {
        OrbitalElements o = Berger1978Orbit.Shared.At(t);
        Assert.True(Math.Abs(o.Eccentricity - e) <= 6e-7, $"{label}: e = {o.Eccentricity:F7}, published {e}");
        Assert.True(Math.Abs(o.ObliquityDeg - obliquity) <= 6e-4, $"{label}: ε = {o.ObliquityDeg:F5}, published {obliquity}");
        double dPeri = Math.Abs(Math.IEEERemainder(o.PerihelionDeg - perihelion, 360.0));
        Assert.True(dPeri <= 6e-3, $"{label}: ϖ = {o.PerihelionDeg:F4}, published {perihelion}");
    }

    [Fact]
    public void Series_has_the_published_number_of_terms()
    {
        // Berger (1978), Tables 1, 4 and 5: 47 obliquity, 19 eccentricity and 78 precession terms (data/orbital/README.md).
        Assert.Equal((47, 19, 78), Berger1978Orbit.TermCounts);
    }

    [Fact]
    public void Climatic_precession_and_ages_follow_the_conventions()
    {
        OrbitalElements o = Berger1978Orbit.Shared.At(IOrbitSource.YearsFromAgeKa(127));
        // ϖ = 275.41° at 127 ka (PMIP4 lig127k): e·sin ϖ is strongly negative (perihelion in northern summer).
        Assert.Equal(0.039378 * Math.Sin(275.41 * Math.PI / 180), o.ClimaticPrecession, 5);
        Assert.Equal(-127000.0, IOrbitSource.YearsFromAgeKa(127.0));
        Assert.Equal(21.0, IOrbitSource.AgeKaFromYears(-21000.0));
    }

    [Fact]
    public void Within_one_million_years_no_warning()
    {
        Assert.Empty(Berger1978Orbit.Shared.CheckRange(-1_000_000, 0));
        Assert.Empty(Berger1978Orbit.Shared.CheckRange(0, 1_000_000));
    }

    [Fact]
    public void Beyond_one_million_years_a_warning_names_the_limit()
    {
        IReadOnlyList<string> warnings = Berger1978Orbit.Shared.CheckRange(-2_000_000, 0);
        string w = Assert.Single(warnings);
        Assert.Contains("±1 Myr", w);
        Assert.Contains("2000 ka", w);
        // Evaluation itself still works between 1 and 5 Myr.
        OrbitalElements o = Berger1978Orbit.Shared.At(-2_000_000);
        Assert.InRange(o.Eccentricity, 0.0, 0.08);
    }

    [Fact]
    public void Beyond_five_million_years_an_error_unless_allowed()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Berger1978Orbit.Shared.CheckRange(-6_000_000, 0));
        Assert.Contains("±5 Myr", ex.Message);
        Assert.Contains("AllowBeyondFiveMyr", ex.Message);
        Assert.Throws<ArgumentOutOfRangeException>(() => Berger1978Orbit.Shared.At(-5_000_001));

        var allowed = Berger1978Orbit.Load(allowBeyondFiveMyr: true);
        string w = Assert.Single(allowed.CheckRange(-6_000_000, 0));
        Assert.Contains("±1 Myr", w);
        Assert.True(double.IsFinite(allowed.At(-6_000_000).Eccentricity));
    }

    [Fact]
    public void Bad_times_are_rejected_with_the_argument_named()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => Berger1978Orbit.Shared.At(double.NaN));
        Assert.Equal("yearsSince1950", ex.ParamName);
        Assert.Throws<ArgumentException>(() => Berger1978Orbit.Shared.CheckRange(0, -10));
    }

    [Fact]
    public void Elements_stay_within_known_bounds_over_the_last_million_years()
    {
        // Berger (1978) and common knowledge of the trade: e in about 0.000–0.06, ε in about 22.0–24.5°.
        for (double age = 0; age <= 1000; age += 0.5)
        {
            OrbitalElements o = Berger1978Orbit.Shared.At(IOrbitSource.YearsFromAgeKa(age));
            Assert.InRange(o.Eccentricity, 0.0, 0.061);
            Assert.InRange(o.ObliquityDeg, 22.0, 24.6);
            Assert.InRange(o.PerihelionDeg, 0.0, 360.0);
        }
    }
}
