using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

/// <summary>Annual, monthly, half-year and threshold integrals of daily insolation.</summary>
public class SeasonalIntegralTests
{
    private const double S0 = 1361.0;
    private static readonly OrbitalElements Present = Berger1978Orbit.Shared.At(0);
    private static readonly OrbitalElements Eccentric = new(0.05, 24.0, 300.0);

    /// <summary>Time mean of the daily values over N equal steps of the year (midpoint rule in time).</summary>
    private static double TimeMean(in OrbitalElements o, double lat, double fromDay, double toDay, int steps)
    {
        var ev = new InsolationEvaluator(o, S0);
        double sum = 0;
        double h = (toDay - fromDay) / steps;
        for (int i = 0; i < steps; i++) sum += ev.DailyMeanOnDay(lat, fromDay + (i + 0.5) * h);
        return sum / steps;
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(45.0)]
    [InlineData(-65.0)]
    [InlineData(75.0)]
    [InlineData(90.0)]
    public void Annual_mean_from_daily_values_matches_the_exact_annual_mean(double lat)
    {
        // The exact annual mean integrates over longitude with Kepler's second law; averaging daily values
        // over time must agree (midpoint rule in time; 365 daily values agree to ~0.1 W/m², 20000 to ~1e-4).
        foreach (OrbitalElements o in new[] { Present, Eccentric })
        {
            double exact = Insolation.AnnualMean(o, lat, S0);
            Assert.Equal(exact, TimeMean(o, lat, 0, SolarCalendar.YearLengthDays, 365), 0.2);
            Assert.Equal(exact, TimeMean(o, lat, 0, SolarCalendar.YearLengthDays, 20000), 2e-4);
        }
    }

    [Theory]
    [InlineData(MonthKind.Calendar)]
    [InlineData(MonthKind.EqualLongitude)]
    public void Monthly_means_are_time_means_over_their_months(MonthKind kind)
    {
        var ev = new InsolationEvaluator(Eccentric, S0);
        double[] means = Insolation.MonthlyMeans(Eccentric, 60, kind, S0);
        double weighted = 0;
        for (int k = 0; k < 12; k++)
        {
            double start, end;
            if (kind == MonthKind.Calendar)
            {
                start = SolarCalendar.CalendarMonthBoundaries[k];
                end = SolarCalendar.CalendarMonthBoundaries[k + 1];
            }
            else
            {
                start = ev.DayOfTrueLongitude(280 + 30 * k);
                end = ev.DayOfTrueLongitude(310 + 30 * k);
                if (end < start) end += SolarCalendar.YearLengthDays;
            }
            double sampled = TimeMeanWrapped(ev, 60, start, end, 4000);
            Assert.Equal(sampled, means[k], 1e-3);
            weighted += means[k] * (end - start);
        }
        // The duration-weighted monthly means add up to the annual mean (exact property).
        Assert.Equal(Insolation.AnnualMean(Eccentric, 60, S0), weighted / SolarCalendar.YearLengthDays, 1e-7);
    }

    private static double TimeMeanWrapped(in InsolationEvaluator ev, double lat, double from, double to, int steps)
    {
        double sum = 0, h = (to - from) / steps;
        for (int i = 0; i < steps; i++)
        {
            double d = (from + (i + 0.5) * h) % SolarCalendar.YearLengthDays;
            sum += ev.DailyMeanOnDay(lat, d);
        }
        return sum / steps;
    }

    [Fact]
    public void Equal_longitude_months_of_a_circular_orbit_last_a_twelfth_of_a_year()
    {
        // With e = 0 the Sun moves uniformly, so equal-longitude months match the 30° arcs' time means.
        var o = new OrbitalElements(0.0, 23.446, 0.0);
        double[] m = Insolation.MonthlyMeans(o, 0, MonthKind.EqualLongitude, S0);
        // The month containing the March equinox (k = 2, λ 340°–10°) and September's (k = 8) are equal by symmetry.
        Assert.Equal(m[2], m[8], 1e-9);
        Assert.Equal(Insolation.AnnualMean(o, 0, S0), m.Average(), 1e-9);
    }

    [Fact]
    public void Band_annual_mean_is_the_area_weighted_mean_of_latitudes()
    {
        // ∫ A(φ) cos φ dφ / ∫ cos φ dφ over 0–30°N by a 2000-point midpoint rule in sin φ.
        int n = 2000;
        double s0 = 0, s1 = Math.Sin(30 * Math.PI / 180), sum = 0;
        for (int i = 0; i < n; i++)
        {
            double mu = s0 + (i + 0.5) * (s1 - s0) / n;
            sum += Insolation.AnnualMean(Present, Math.Asin(mu) * 180 / Math.PI, S0);
        }
        Assert.Equal(sum / n, Insolation.BandAnnualMean(Present, 0, 30, S0), 1e-5);
        // Tropical annual-mean insolation is about 410–420 W/m² (shared/design/MODEL-NOTES.md; common practice).
        Assert.InRange(Insolation.BandAnnualMean(Present, -10, 10, S0), 405, 425);
    }

    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(0.03, 40.0)]
    [InlineData(0.06, 200.0)]
    public void Caloric_half_years_with_zero_tilt_have_a_closed_form(double e, double perihelion)
    {
        // With ε = 0, Q = (S0/π) cos φ (a/r)², highest around perihelion. The caloric summer is the half-year
        // centred on perihelion, i.e. mean anomaly in [−π/2, π/2], true anomaly in [−v*, v*]; its energy is
        // (S0/π) cos φ · T/(2π√(1−e²)) · 2v* (Kepler's second law), so its mean is (S0 cos φ/π) · 2v*/(π√(1−e²)).
        var o = new OrbitalElements(e, 0.0, perihelion);
        double eAnomaly = Kepler.EccentricAnomaly(Math.PI / 2, e);
        double vStar = Kepler.TrueFromEccentric(eAnomaly, e);
        foreach (double lat in new[] { 0.0, 40.0, -70.0 })
        {
            double c = S0 * Math.Cos(lat * Math.PI / 180) / Math.PI;
            var halves = Insolation.CaloricHalfYears(o, lat, S0);
            Assert.Equal(c * 2 * vStar / (Math.PI * Math.Sqrt(1 - e * e)), halves.SummerMeanWm2, 1e-6);
            Assert.Equal(c * 2 * (Math.PI - vStar) / (Math.PI * Math.Sqrt(1 - e * e)), halves.WinterMeanWm2, 1e-6);
        }
    }

    [Theory]
    [InlineData(65.0)]
    [InlineData(20.0)]
    [InlineData(5.0)]
    [InlineData(-80.0)]
    [InlineData(90.0)]
    public void Caloric_half_years_split_the_annual_energy_at_one_threshold(double lat)
    {
        var h = Insolation.CaloricHalfYears(Eccentric, lat, S0);
        double annual = Insolation.AnnualMean(Eccentric, lat, S0);
        // Summer + winter = the year (exact), summer ≥ winter, and the summer is the time above the threshold.
        Assert.Equal(annual, 0.5 * (h.SummerMeanWm2 + h.WinterMeanWm2), 1e-8);
        Assert.True(h.SummerMeanWm2 >= h.WinterMeanWm2);
        Assert.Equal(h.SummerEnergyGJm2, Insolation.IntegratedSummerEnergy(Eccentric, lat, h.ThresholdWm2, S0), 1e-6);
        double days = Insolation.DaysAboveThreshold(Eccentric, lat, h.ThresholdWm2, S0);
        if (h.ThresholdWm2 > 0) Assert.Equal(SolarCalendar.YearLengthDays / 2, days, 1e-6);
        var (summer, winter) = h;
        Assert.Equal(h.SummerMeanWm2, summer);
        Assert.Equal(h.WinterMeanWm2, winter);
    }

    /// <summary>Milankovitch's definition taken literally: sort equal time steps by insolation and average the upper half.</summary>
    private static double SortedUpperHalfMean(in OrbitalElements o, double lat)
    {
        var ev = new InsolationEvaluator(o, S0);
        int n = 40000;
        var q = new double[n];
        for (int i = 0; i < n; i++) q[i] = ev.DailyMeanOnDay(lat, (i + 0.5) * SolarCalendar.YearLengthDays / n);
        Array.Sort(q);
        return q.Skip(n / 2).Average();
    }

    [Theory]
    [InlineData(65.0)]
    [InlineData(10.0)]
    public void Caloric_summer_agrees_with_sorting_sampled_days(double lat)
    {
        Assert.Equal(SortedUpperHalfMean(Present, lat), Insolation.CaloricHalfYears(Present, lat, S0).SummerMeanWm2, 2e-3);
    }

    [Fact]
    public void Caloric_summer_depends_on_perihelion_unlike_the_astronomical_summer()
    {
        // The caloric half-year is fixed in duration (182.6 days), not in longitude, so Kepler's compensation
        // (exact for the equinox-to-equinox half-year, tested above) does not hold for it: with e = 0.05 at 65°N,
        // perihelion in northern summer (ϖ = 270°) gives a caloric summer about 6 % richer than ϖ = 90°.
        // Both values are checked against the literal sorted-days definition.
        var aphelionSummer = new OrbitalElements(0.05, 23.44, 90.0);
        var perihelionSummer = new OrbitalElements(0.05, 23.44, 270.0);
        double a = Insolation.CaloricHalfYears(aphelionSummer, 65, S0).SummerMeanWm2;
        double p = Insolation.CaloricHalfYears(perihelionSummer, 65, S0).SummerMeanWm2;
        Assert.Equal(SortedUpperHalfMean(aphelionSummer, 65), a, 2e-3);
        Assert.Equal(SortedUpperHalfMean(perihelionSummer, 65), p, 2e-3);
        Assert.InRange(p / a, 1.03, 1.10);
    }

    [Theory]
    [InlineData(0.0, 0.0)]
    [InlineData(0.05, 120.0)]
    public void Threshold_summer_with_zero_tilt_has_a_closed_form(double e, double perihelion)
    {
        // With ε = 0, Q > τ exactly where (1 + e cos v)²/(1 − e²)² > τπ/(S0 cos φ), i.e. |v| < v_τ with
        // cos v_τ = (√k (1 − e²) − 1)/e; energy = (S0/π) cos φ · T/(2π√(1−e²)) · 2v_τ (Kepler's second law).
        var o = new OrbitalElements(e, 0.0, perihelion);
        double lat = 30, tau = 370;
        double c = S0 * Math.Cos(lat * Math.PI / 180) / Math.PI;
        double vTau;
        if (e == 0) vTau = c > tau ? Math.PI : 0;
        else vTau = Math.Acos(Math.Clamp((Math.Sqrt(tau / c) * (1 - e * e) - 1) / e, -1, 1));
        double expected = c * SolarCalendar.SecondsPerYear / (2 * Math.PI * Math.Sqrt(1 - e * e)) * 2 * vTau / 1e9;
        Assert.Equal(expected, Insolation.IntegratedSummerEnergy(o, lat, tau, S0), 1e-7);
    }

    [Fact]
    public void Threshold_summer_limits()
    {
        // τ = 0 collects the whole year's energy; a threshold above the maximum collects nothing (exact).
        double annualGJ = Insolation.AnnualMean(Present, 65, S0) * SolarCalendar.SecondsPerYear / 1e9;
        Assert.Equal(annualGJ, Insolation.IntegratedSummerEnergy(Present, 65, 0, S0), 1e-7);
        Assert.Equal(0.0, Insolation.IntegratedSummerEnergy(Present, 65, 2000, S0));
        // Energies decrease as the threshold rises.
        double previous = double.MaxValue;
        for (double tau = 0; tau <= 500; tau += 25)
        {
            double j = Insolation.IntegratedSummerEnergy(Present, 65, tau, S0);
            Assert.True(j <= previous);
            previous = j;
        }
    }

    [Fact]
    public void Threshold_summer_energy_at_65N_is_mostly_set_by_obliquity()
    {
        // Huybers (2006, Science 313, 508): summer energy above τ = 275 W/m² at 65°N varies mainly with obliquity;
        // precession nearly cancels (Kepler's second law). Exact property checked here: for a circular orbit
        // it does not depend on ϖ at all, and with e = 0.05 a full turn of ϖ changes it by only a few percent
        // while a 2° change of tilt changes it by more.
        double j0 = Insolation.IntegratedSummerEnergy(new OrbitalElements(0, 23.446, 0), 65, 275, S0);
        Assert.Equal(j0, Insolation.IntegratedSummerEnergy(new OrbitalElements(0, 23.446, 180), 65, 275, S0), 1e-9);
        double[] byPerihelion = Enumerable.Range(0, 12).Select(k => Insolation.IntegratedSummerEnergy(new OrbitalElements(0.05, 23.446, 30 * k), 65, 275, S0)).ToArray();
        double precessionRange = byPerihelion.Max() - byPerihelion.Min();
        double tiltChange = Insolation.IntegratedSummerEnergy(new OrbitalElements(0.05, 24.446, 0), 65, 275, S0)
                          - Insolation.IntegratedSummerEnergy(new OrbitalElements(0.05, 22.446, 0), 65, 275, S0);
        Assert.True(precessionRange < 0.06 * byPerihelion.Average(), $"precession range {precessionRange:F3} GJ/m²");
        Assert.True(tiltChange > precessionRange, $"tilt change {tiltChange:F3} vs precession range {precessionRange:F3} GJ/m²");
    }
}
