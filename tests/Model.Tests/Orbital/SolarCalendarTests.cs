using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

public class SolarCalendarTests
{
    private static readonly OrbitalElements Present = Berger1978Orbit.Shared.At(0);

    [Fact]
    public void Kepler_equation_matches_a_worked_example()
    {
        // Meeus, Astronomical Algorithms (2nd ed.), Example 30.a: e = 0.100, M = 5° gives E = 5.554589°. From memory;
        // the value also satisfies E − e sin E = M, asserted below.
        double E = Kepler.EccentricAnomaly(5.0 * Math.PI / 180, 0.1) * 180 / Math.PI;
        Assert.Equal(5.554589, E, 1e-6);
        Assert.Equal(5.0 * Math.PI / 180, E * Math.PI / 180 - 0.1 * Math.Sin(E * Math.PI / 180), 1e-14);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(0.0167)]
    [InlineData(0.06)]
    [InlineData(0.3)]
    [InlineData(0.9)]
    public void Kepler_equation_is_solved_to_machine_precision(double e)
    {
        for (double m = -3.14; m <= 3.14; m += 0.01)
        {
            double E = Kepler.EccentricAnomaly(m, e);
            Assert.True(Math.Abs(E - e * Math.Sin(E) - m) < 1e-13, $"e = {e}, M = {m}");
        }
    }

    [Theory]
    [InlineData(0.016724, 102.04)]
    [InlineData(0.06, 10.0)]
    [InlineData(0.04, 275.41)]
    [InlineData(0.0, 0.0)]
    public void Day_and_true_longitude_round_trip(double e, double perihelion)
    {
        var o = new OrbitalElements(e, 23.446, perihelion);
        for (double day = 0; day < SolarCalendar.YearLengthDays; day += 0.37)
        {
            double lambda = SolarCalendar.TrueLongitudeOfDay(o, day);
            double back = SolarCalendar.DayOfTrueLongitude(o, lambda);
            double diff = Math.IEEERemainder(back - day, SolarCalendar.YearLengthDays);
            Assert.True(Math.Abs(diff) < 1e-9, $"day {day} → λ {lambda} → day {back}");
        }
    }

    [Fact]
    public void Vernal_equinox_falls_on_21_March_for_every_orbit()
    {
        // The calendar is fixed to the vernal equinox at noon on 21 March (day 79.5 from 0 at 1 January 00:00).
        Assert.Equal(79.5, SolarCalendar.VernalEquinoxDayOfYear);
        Assert.Equal(365.2422, SolarCalendar.YearLengthDays);
        foreach (double w in new[] { 0.0, 102.04, 200.0, 275.41 })
        {
            var o = new OrbitalElements(0.05, 23.446, w);
            Assert.Equal(0.0, Math.IEEERemainder(SolarCalendar.TrueLongitudeOfDay(o, 79.5), 360.0), 1e-9);
            Assert.Equal(79.5, SolarCalendar.DayOfTrueLongitude(o, 0.0), 1e-9);
        }
    }

    [Fact]
    public void On_a_circular_orbit_longitude_advances_uniformly()
    {
        var o = new OrbitalElements(0.0, 23.446, 102.04);
        foreach (double day in new[] { 0.0, 10.0, 79.5, 171.0, 300.25 })
        {
            double expected = (day - 79.5) * 360.0 / 365.2422;
            Assert.Equal(0.0, Math.IEEERemainder(SolarCalendar.TrueLongitudeOfDay(o, day) - expected, 360.0), 1e-9);
        }
    }

    [Fact]
    public void Perihelion_falls_on_about_3_January_today()
    {
        // Perihelion in early January, about 3 January (common practice; the 1950 orbit gives day 2.3 = 3 January).
        double day = SolarCalendar.DayOfPerihelion(Present);
        Assert.InRange(day, 1.0, 4.0);
        Assert.Equal(Present.PerihelionDeg + 180.0 - 360.0 * Math.Floor((Present.PerihelionDeg + 180.0) / 360.0),
            SolarCalendar.TrueLongitudeOfDay(Present, day), 1e-9);
        Assert.Equal(282.04, Present.SunLongitudeAtPerihelionDeg, 0.01);
    }

    [Fact]
    public void Northern_summer_half_year_is_longer_today_by_about_a_week()
    {
        // With perihelion in January, the Sun spends about 186.4 days between the March and September
        // equinoxes and 178.8 days between September and March (common practice; Kepler's second law).
        var ev = new InsolationEvaluator(Present);
        double summer = ev.DayOfTrueLongitude(180) - ev.DayOfTrueLongitude(0);
        Assert.InRange(summer, 186.0, 187.0);
        Assert.InRange(SolarCalendar.YearLengthDays - summer, 178.4, 179.4);
    }

    [Fact]
    public void Month_boundaries_have_common_year_lengths()
    {
        ReadOnlySpan<double> b = SolarCalendar.CalendarMonthBoundaries;
        Assert.Equal(13, b.Length);
        int[] lengths = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
        for (int k = 0; k < 11; k++) Assert.Equal(lengths[k], b[k + 1] - b[k]);
        Assert.Equal(31.2422, b[12] - b[11], 1e-12);
    }

    [Theory]
    [InlineData(-0.1)]
    [InlineData(365.3)]
    [InlineData(double.NaN)]
    public void Days_outside_the_year_are_rejected(double day)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => SolarCalendar.TrueLongitudeOfDay(Present, day));
        Assert.Equal("dayOfYear", ex.ParamName);
        Assert.Contains("365.2422", ex.Message);
    }
}
