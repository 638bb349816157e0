using System.Globalization;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// The calendar used to turn a day of the year into the Sun's true longitude: a year of
/// <see cref="YearLengthDays"/> = 365.2422 days (the tropical year) with the vernal (March) equinox
/// fixed at noon on 21 March, <see cref="VernalEquinoxDayOfYear"/> = 79.5.
/// </summary>
/// <remarks>
/// <para>Days of the year are continuous and counted from 0 at 00:00 on 1 January, so day number n
/// (1 = 1 January) covers [n − 1, n) and its midpoint is n − 0.5. The calendar has no leap days:
/// months have their common-year lengths (31, 28, 31, …) and December absorbs the 0.2422-day
/// remainder, ending at day 365.2422.</para>
/// <para>Between the equinox and a given day, time runs at the Earth's mean motion: the mean anomaly
/// advances by 2π per year, and Kepler's equation E − e sin E = M gives the true anomaly and so
/// the true longitude (e.g. Berger 1978; any celestial mechanics text). Because the equinox is pinned
/// to 21 March while perihelion moves, calendar months drift against the seasons over precession
/// cycles (the "calendar effect"): equal-longitude months (<see cref="MonthKind.EqualLongitude"/>) avoid it.</para>
/// </remarks>
public static class SolarCalendar
{
    /// <summary>Length of the calendar year in days: the tropical year, 365.2422 days.</summary>
    public const double YearLengthDays = 365.2422;

    /// <summary>Seconds in a day (86400 s).</summary>
    public const double SecondsPerDay = 86400.0;

    /// <summary>Seconds in the calendar year (365.2422 × 86400 s).</summary>
    public const double SecondsPerYear = YearLengthDays * SecondsPerDay;

    /// <summary>Day of the year (from 0 at 00:00 on 1 January) of the vernal equinox: noon on 21 March, 79.5.</summary>
    public const double VernalEquinoxDayOfYear = 79.5;

    /// <summary>Month (1–12) of the fixed vernal equinox: March.</summary>
    public const int VernalEquinoxMonth = 3;

    /// <summary>Day of the month of the fixed vernal equinox: 21.</summary>
    public const int VernalEquinoxDayOfMonth = 21;

    /// <summary>True longitude (degrees) at which the first equal-longitude month starts: 280°.</summary>
    /// <remarks>Equal-longitude month k (0 = "January") spans λ ∈ [280° + 30°k, 310° + 30°k), so the vernal
    /// equinox λ = 0 lies two-thirds of the way through the third month, as 21 March does in March.</remarks>
    public const double EqualLongitudeFirstMonthStartDeg = 280.0;

    /// <summary>A sentence describing the calendar, for output metadata.</summary>
    public static string Description { get; } = string.Create(CultureInfo.InvariantCulture,
        $"year of {YearLengthDays} days without leap days; vernal equinox fixed at 21 March 12:00 (day of year {VernalEquinoxDayOfYear}, counted from 0 at 1 January 00:00); December absorbs the extra 0.2422 day");

    private static readonly double[] MonthStarts = [0, 31, 59, 90, 120, 151, 181, 212, 243, 273, 304, 334, YearLengthDays];

    /// <summary>
    /// Start days of the twelve calendar months followed by the end of the year (13 values:
    /// 0, 31, 59, …, 334, 365.2422), in days from 0 at 00:00 on 1 January.
    /// </summary>
    public static ReadOnlySpan<double> CalendarMonthBoundaries => MonthStarts;

    /// <summary>The Sun's true longitude (degrees in [0, 360), 0 at the vernal equinox) on <paramref name="dayOfYear"/>.</summary>
    /// <param name="elements">Orbital elements (the calendar depends on e and ϖ).</param>
    /// <param name="dayOfYear">Day of the year in [0, 365.2422], from 0 at 00:00 on 1 January.</param>
    public static double TrueLongitudeOfDay(in OrbitalElements elements, double dayOfYear) =>
        new InsolationEvaluator(elements).TrueLongitudeOfDayDeg(dayOfYear);

    /// <summary>The day of the year in [0, 365.2422) on which the Sun reaches <paramref name="trueLongitudeDeg"/>.</summary>
    public static double DayOfTrueLongitude(in OrbitalElements elements, double trueLongitudeDeg) =>
        new InsolationEvaluator(elements).DayOfTrueLongitude(trueLongitudeDeg);

    /// <summary>The day of the year of perihelion (true longitude ϖ + 180°); about 2.3, i.e. 3 January, for 1950.</summary>
    public static double DayOfPerihelion(in OrbitalElements elements) =>
        new InsolationEvaluator(elements).DayOfTrueLongitude(elements.PerihelionDeg + 180.0);

    /// <summary>Throws unless <paramref name="dayOfYear"/> is a finite day in [0, 365.2422].</summary>
    internal static void ValidateDay(double dayOfYear, string parameterName)
    {
        if (!(dayOfYear >= 0.0 && dayOfYear <= YearLengthDays))
            throw new ArgumentOutOfRangeException(parameterName, dayOfYear,
                $"{parameterName} = {dayOfYear.ToString("R", CultureInfo.InvariantCulture)} is not allowed; a day of the year must lie in [0, {YearLengthDays.ToString(CultureInfo.InvariantCulture)}] (counted from 0 at 00:00 on 1 January).");
    }
}

/// <summary>Solution of Kepler's equation and the anomaly conversions of an elliptic orbit.</summary>
internal static class Kepler
{
    /// <summary>
    /// The eccentric anomaly E in [−π, π] with E − e sin E = M (reduced to [−π, π]), by Newton's method
    /// from E₀ = M + e sin M (E₀ = ±π for e ≥ 0.8, where that start can overshoot).
    /// </summary>
    public static double EccentricAnomaly(double meanAnomaly, double e)
    {
        double m = Math.IEEERemainder(meanAnomaly, Angles.TwoPi);
        if (e == 0.0) return m;
        double E = e < 0.8 ? m + e * Math.Sin(m) : (m >= 0 ? Math.PI : -Math.PI);
        for (int iteration = 0; iteration < 60; iteration++)
        {
            (double sinE, double cosE) = Math.SinCos(E);
            double step = (E - e * sinE - m) / (1.0 - e * cosE);
            E -= step;
            if (Math.Abs(step) <= 1e-15 * Math.Max(1.0, Math.Abs(E))) break;
        }
        return E;
    }

    /// <summary>True anomaly from the eccentric anomaly: tan(v/2) = √((1+e)/(1−e)) tan(E/2).</summary>
    public static double TrueFromEccentric(double E, double e)
    {
        (double s, double c) = Math.SinCos(0.5 * E);
        return 2.0 * Math.Atan2(Math.Sqrt(1.0 + e) * s, Math.Sqrt(1.0 - e) * c);
    }

    /// <summary>Eccentric anomaly from the true anomaly (inverse of <see cref="TrueFromEccentric"/>).</summary>
    public static double EccentricFromTrue(double v, double e)
    {
        (double s, double c) = Math.SinCos(0.5 * v);
        return 2.0 * Math.Atan2(Math.Sqrt(1.0 - e) * s, Math.Sqrt(1.0 + e) * c);
    }

    /// <summary>Mean anomaly from the true anomaly: M = E − e sin E.</summary>
    public static double MeanFromTrue(double v, double e)
    {
        double E = EccentricFromTrue(v, e);
        return E - e * Math.Sin(E);
    }
}
