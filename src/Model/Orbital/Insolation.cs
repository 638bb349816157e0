using System.Globalization;

namespace Thermostrat.Model.Orbital;

/// <summary>How a year is divided into twelve months for <see cref="Insolation.MonthlyMeans(in OrbitalElements, double, MonthKind, double)"/>.</summary>
public enum MonthKind
{
    /// <summary>Calendar months of a common year (31, 28, 31, … days; December absorbs 0.2422 day), with the vernal equinox fixed at noon on 21 March.</summary>
    Calendar,

    /// <summary>Twelve 30° arcs of true longitude, month k spanning [280° + 30°k, 310° + 30°k); their lengths in days follow Kepler's second law.</summary>
    EqualLongitude,
}

/// <summary>
/// Insolation of Milankovitch's caloric half-years at one latitude: the caloric summer is the half of the
/// year (in time) during which every day receives more insolation than any day of the other half, the caloric winter.
/// </summary>
/// <param name="SummerMeanWm2">Mean insolation over the caloric summer half-year, W/m².</param>
/// <param name="WinterMeanWm2">Mean insolation over the caloric winter half-year, W/m².</param>
/// <param name="SummerEnergyGJm2">Energy received in the caloric summer, GJ/m².</param>
/// <param name="WinterEnergyGJm2">Energy received in the caloric winter, GJ/m².</param>
/// <param name="ThresholdWm2">Daily-mean insolation that separates the two half-years, W/m².</param>
public readonly record struct CaloricHalfYearInsolation(
    double SummerMeanWm2, double WinterMeanWm2, double SummerEnergyGJm2, double WinterEnergyGJm2, double ThresholdWm2)
{
    /// <summary>Deconstructs into the summer and winter mean insolation (W/m²).</summary>
    public void Deconstruct(out double summerMeanWm2, out double winterMeanWm2)
    {
        summerMeanWm2 = SummerMeanWm2;
        winterMeanWm2 = WinterMeanWm2;
    }
}

/// <summary>
/// Top-of-atmosphere insolation from orbital elements: daily means at a latitude, annual and monthly
/// means, area-weighted means over latitude bands, caloric half-years and threshold summer energy.
/// </summary>
/// <remarks>
/// <para>Daily mean (Berger 1978, J. Atmos. Sci. 35, 2362): Q = (S0/π)(a/r)² F with
/// (a/r)² = (1 − e cos(λ − ϖ))² / (1 − e²)² and F = H sin φ sin δ + cos φ cos δ sin H; see
/// <see cref="InsolationEvaluator"/>. Time integrals are taken over the true longitude λ using Kepler's
/// second law, r² dλ/dt = 2π a² √(1 − e²)/T, so that Q dt = (S0/π) F T dλ / (2π √(1 − e²)): the
/// distance factor cancels, which is why annual means do not depend on ϖ (and depend on e only through
/// 1/√(1 − e²)). Integrals use adaptive Gauss–Kronrod quadrature with the polar-day and polar-night
/// transitions as breakpoints (relative accuracy about 1e-10).</para>
/// <para>Calendar days follow <see cref="SolarCalendar"/>: a 365.2422-day year with the vernal equinox fixed at noon on 21 March.</para>
/// <para>For many latitudes and days at one epoch use <see cref="InsolationEvaluator"/> or <see cref="DailyInsolationGrid"/>;
/// for long forced runs precompute a quantity on a time grid with <see cref="OrbitalForcingSeries"/>.</para>
/// </remarks>
public static class Insolation
{
    /// <summary>Default solar constant, 1361 W/m² (nominal total solar irradiance, IAU 2015 Resolution B3).</summary>
    public const double DefaultSolarConstantWm2 = 1361.0;

    /// <summary>Longitudes sampled per year when locating threshold crossings (0.5° ≈ half a day).</summary>
    private const int ThresholdSamples = 720;

    /// <summary>Bisection steps locating a crossing longitude (2π·2⁻⁵⁵ is below double precision).</summary>
    private const int CrossingBisections = 55;

    /// <summary>Accuracy of the caloric threshold relative to the maximum daily insolation.</summary>
    private const double CaloricThresholdTolerance = 1e-12;

    /// <summary>Accuracy (rad) of a threshold-crossing longitude found by Brent's method (about 1e-6 s of time).</summary>
    private const double CrossingTolerance = 1e-13;

    // ---------------------------------------------------------------- daily values

    /// <summary>Daily-mean insolation (W/m²) at <paramref name="latitudeDeg"/> (−90…90) for the Sun's true longitude <paramref name="trueLongitudeDeg"/> (0 = March equinox).</summary>
    public static double DailyMean(in OrbitalElements elements, double latitudeDeg, double trueLongitudeDeg, double solarConstantWm2 = DefaultSolarConstantWm2) =>
        new InsolationEvaluator(elements, solarConstantWm2).DailyMean(latitudeDeg, trueLongitudeDeg);

    /// <summary>Daily-mean insolation (W/m²) at <paramref name="latitudeDeg"/> on <paramref name="dayOfYear"/> in [0, 365.2422] (from 0 at 00:00 on 1 January; see <see cref="SolarCalendar"/>).</summary>
    public static double DailyMeanOnDay(in OrbitalElements elements, double latitudeDeg, double dayOfYear, double solarConstantWm2 = DefaultSolarConstantWm2) =>
        new InsolationEvaluator(elements, solarConstantWm2).DailyMeanOnDay(latitudeDeg, dayOfYear);

    /// <summary>
    /// Area-weighted daily-mean insolation (W/m²) over the latitude band [<paramref name="southDeg"/>, <paramref name="northDeg"/>]
    /// for true longitude <paramref name="trueLongitudeDeg"/>: ∫Q cos φ dφ / ∫cos φ dφ. Equal bounds give the value at that latitude.
    /// </summary>
    public static double BandDailyMean(in OrbitalElements elements, double southDeg, double northDeg, double trueLongitudeDeg, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateBand(southDeg, northDeg);
        ValidateLongitude(trueLongitudeDeg, nameof(trueLongitudeDeg));
        return BandDailyMeanRad(ev, southDeg, northDeg, trueLongitudeDeg * Angles.DegToRad);
    }

    /// <summary>Area-weighted daily-mean insolation (W/m²) over a latitude band on a calendar day (see <see cref="BandDailyMean"/>).</summary>
    public static double BandDailyMeanOnDay(in OrbitalElements elements, double southDeg, double northDeg, double dayOfYear, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateBand(southDeg, northDeg);
        SolarCalendar.ValidateDay(dayOfYear, nameof(dayOfYear));
        return BandDailyMeanRad(ev, southDeg, northDeg, ev.TrueLongitudeRad(dayOfYear));
    }

    // ---------------------------------------------------------------- annual and monthly means

    /// <summary>
    /// Annual-mean insolation (W/m²) at <paramref name="latitudeDeg"/>: the time mean over one orbit,
    /// (S0/π) ∫F dλ / (2π √(1 − e²)). Independent of ϖ and symmetric between hemispheres.
    /// </summary>
    public static double AnnualMean(in OrbitalElements elements, double latitudeDeg, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateLatitude(latitudeDeg, nameof(latitudeDeg));
        return AnnualMeanScale(ev) * AnnualGeometry(LatitudeTrig.FromDegrees(latitudeDeg), ev.SinObliquity);
    }

    /// <summary>
    /// Area-weighted annual-mean insolation (W/m²) over the latitude band [<paramref name="southDeg"/>, <paramref name="northDeg"/>]
    /// (for a box that spans latitudes). Over the whole globe it equals S0 / (4 √(1 − e²)). Equal bounds give the value at that latitude.
    /// </summary>
    public static double BandAnnualMean(in OrbitalElements elements, double southDeg, double northDeg, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateBand(southDeg, northDeg);
        if (southDeg == northDeg) return AnnualMeanScale(ev) * AnnualGeometry(LatitudeTrig.FromDegrees(southDeg), ev.SinObliquity);
        double muS = LatitudeTrig.FromDegrees(southDeg).Sin, muN = LatitudeTrig.FromDegrees(northDeg).Sin;
        double cosEps = Math.Sqrt(1.0 - ev.SinObliquity * ev.SinObliquity);
        var f = new AnnualGeometryOfMu(ev.SinObliquity);
        double integral = IntegrateWithBreaks(f, muS, muN, -cosEps, cosEps, 2.0 * Math.PI * Math.PI * (muN - muS) * 1e-13);
        return AnnualMeanScale(ev) * integral / (muN - muS);
    }

    /// <summary>Twelve monthly-mean insolation values (W/m²) at <paramref name="latitudeDeg"/>: time means over calendar or equal-longitude months.</summary>
    public static double[] MonthlyMeans(in OrbitalElements elements, double latitudeDeg, MonthKind kind, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var result = new double[12];
        MonthlyMeans(elements, latitudeDeg, kind, result, solarConstantWm2);
        return result;
    }

    /// <summary>Writes the twelve monthly means (W/m²) into <paramref name="destination"/> (length ≥ 12); see <see cref="MonthlyMeans(in OrbitalElements, double, MonthKind, double)"/>.</summary>
    public static void MonthlyMeans(in OrbitalElements elements, double latitudeDeg, MonthKind kind, Span<double> destination, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateLatitude(latitudeDeg, nameof(latitudeDeg));
        if (destination.Length < 12)
            throw new ArgumentException($"destination has length {destination.Length}; twelve monthly values need at least 12.", nameof(destination));
        var lat = LatitudeTrig.FromDegrees(latitudeDeg);
        for (int k = 0; k < 12; k++)
        {
            double lambda1, lambda2, durationDays;
            switch (kind)
            {
                case MonthKind.Calendar:
                    {
                        double d1 = SolarCalendar.CalendarMonthBoundaries[k], d2 = SolarCalendar.CalendarMonthBoundaries[k + 1];
                        lambda1 = ev.TrueLongitudeRad(d1);
                        lambda2 = ev.TrueLongitudeRad(d2 >= SolarCalendar.YearLengthDays ? 0.0 : d2);
                        if (lambda2 <= lambda1) lambda2 += Angles.TwoPi;
                        durationDays = d2 - d1;
                        break;
                    }
                case MonthKind.EqualLongitude:
                    lambda1 = (SolarCalendar.EqualLongitudeFirstMonthStartDeg + 30.0 * k) * Angles.DegToRad;
                    lambda2 = lambda1 + 30.0 * Angles.DegToRad;
                    durationDays = ev.DurationDays(lambda1, lambda2);
                    break;
                default:
                    throw new ArgumentOutOfRangeException(nameof(kind), kind, $"kind = {kind} is not a month kind; allowed: {string.Join(", ", Enum.GetNames<MonthKind>())}.");
            }
            double energy = ev.EnergyScale * IntegrateOverLongitude(lat, ev.SinObliquity, lambda1, lambda2);
            destination[k] = energy / (durationDays * SolarCalendar.SecondsPerDay);
        }
    }

    /// <summary>
    /// Energy (GJ/m²) received at <paramref name="latitudeDeg"/> while the Sun moves from true longitude
    /// <paramref name="startLongitudeDeg"/> forward to <paramref name="endLongitudeDeg"/> (an arc of (end − start) mod 360°;
    /// equal longitudes give 0). From 0° to 180° this is the astronomical (equinox-to-equinox) northern summer,
    /// whose energy does not depend on ϖ (Kepler's second law compensates distance by duration).
    /// </summary>
    public static double EnergyBetweenLongitudes(in OrbitalElements elements, double latitudeDeg, double startLongitudeDeg, double endLongitudeDeg, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateLatitude(latitudeDeg, nameof(latitudeDeg));
        ValidateLongitude(startLongitudeDeg, nameof(startLongitudeDeg));
        ValidateLongitude(endLongitudeDeg, nameof(endLongitudeDeg));
        double arc = Angles.Normalize360(endLongitudeDeg - startLongitudeDeg) * Angles.DegToRad;
        double lambda1 = startLongitudeDeg * Angles.DegToRad;
        return ev.EnergyScale * IntegrateOverLongitude(LatitudeTrig.FromDegrees(latitudeDeg), ev.SinObliquity, lambda1, lambda1 + arc) / 1e9;
    }

    // ---------------------------------------------------------------- half-years and threshold summers

    /// <summary>
    /// Milankovitch's caloric half-years at <paramref name="latitudeDeg"/>: the caloric summer is the half of the
    /// year (182.6 days) of highest daily insolation, the caloric winter the other half (Milankovitch 1941,
    /// Kanon der Erdbestrahlung; Berger 1978, Quaternary Research 9, 139). Found as the threshold q* for which the
    /// time with Q &gt; q* is half a year; this also covers the tropics, where the summer is not one interval.
    /// </summary>
    /// <remarks>Unlike the astronomical half-year (see <see cref="EnergyBetweenLongitudes"/>), caloric summer energy
    /// does depend (weakly) on ϖ, because the half-year is fixed in duration rather than in longitude.</remarks>
    public static CaloricHalfYearInsolation CaloricHalfYears(in OrbitalElements elements, double latitudeDeg, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateLatitude(latitudeDeg, nameof(latitudeDeg));
        var curve = new ThresholdCurve(ev, LatitudeTrig.FromDegrees(latitudeDeg));
        double halfYearDays = 0.5 * SolarCalendar.YearLengthDays;
        double annualEnergy = AnnualMeanScale(ev) * AnnualGeometry(curve.Latitude, ev.SinObliquity) * SolarCalendar.SecondsPerYear;

        double threshold;
        (double energy, double days) = curve.Above(0.0);
        if (days > halfYearDays)
        {
            // The threshold q* at which the time above it is half a year: T(q) − T/2 changes sign on [0, max Q].
            var excess = new HalfYearExcess(curve, halfYearDays);
            double top = curve.MaxSample;
            threshold = BrentRoot.Solve(excess, 0.0, top, days - halfYearDays, excess.Evaluate(top), CaloricThresholdTolerance * top);
            (energy, days) = curve.Above(threshold);
        }
        else
        {
            threshold = 0.0; // Q > 0 for at most half a year (long polar night): the whole sunlit part is summer.
        }
        // Ties at the threshold (a level stretch of Q, e.g. a constant Q) fill the half-year at Q = q*.
        double summerEnergy = energy + threshold * (halfYearDays - days) * SolarCalendar.SecondsPerDay;
        double winterEnergy = Math.Max(annualEnergy - summerEnergy, 0.0);
        double halfYearSeconds = 0.5 * SolarCalendar.SecondsPerYear;
        return new CaloricHalfYearInsolation(summerEnergy / halfYearSeconds, winterEnergy / halfYearSeconds, summerEnergy / 1e9, winterEnergy / 1e9, threshold);
    }

    /// <summary>
    /// Summer energy (GJ/m²): insolation integrated over the part of the year in which the daily mean exceeds
    /// <paramref name="thresholdWm2"/> (Huybers 2006, Science 313, 508, who sums days with Q ≥ τ, e.g. τ = 275 W/m²;
    /// here the continuous-time integral ∫ Q dt over Q &gt; τ, with 86400 s days).
    /// </summary>
    /// <remarks>Crossings are located on a 0.5° grid of true longitude and refined to machine precision, so an
    /// excursion above the threshold shorter than about half a day can be missed.</remarks>
    public static double IntegratedSummerEnergy(in OrbitalElements elements, double latitudeDeg, double thresholdWm2, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateLatitude(latitudeDeg, nameof(latitudeDeg));
        ValidateThreshold(thresholdWm2);
        return new ThresholdCurve(ev, LatitudeTrig.FromDegrees(latitudeDeg)).Above(thresholdWm2).EnergyJm2 / 1e9;
    }

    /// <summary>Number of days per year on which the daily-mean insolation at <paramref name="latitudeDeg"/> exceeds <paramref name="thresholdWm2"/> (the length of the summer of <see cref="IntegratedSummerEnergy"/>).</summary>
    public static double DaysAboveThreshold(in OrbitalElements elements, double latitudeDeg, double thresholdWm2, double solarConstantWm2 = DefaultSolarConstantWm2)
    {
        var ev = new InsolationEvaluator(elements, solarConstantWm2);
        ValidateLatitude(latitudeDeg, nameof(latitudeDeg));
        ValidateThreshold(thresholdWm2);
        return new ThresholdCurve(ev, LatitudeTrig.FromDegrees(latitudeDeg)).Above(thresholdWm2).DurationDays;
    }

    // ---------------------------------------------------------------- validation

    internal static void ValidateLatitude(double latitudeDeg, string parameterName)
    {
        if (!(latitudeDeg >= -90.0 && latitudeDeg <= 90.0))
            throw new ArgumentOutOfRangeException(parameterName, latitudeDeg,
                $"{parameterName} = {latitudeDeg.ToString("R", CultureInfo.InvariantCulture)} is not allowed; a latitude must lie in [-90, 90] degrees.");
    }

    internal static void ValidateLongitude(double longitudeDeg, string parameterName)
    {
        if (!double.IsFinite(longitudeDeg))
            throw new ArgumentOutOfRangeException(parameterName, longitudeDeg,
                $"{parameterName} = {longitudeDeg.ToString("R", CultureInfo.InvariantCulture)} is not allowed; the true longitude must be a finite number of degrees.");
    }

    internal static void ValidateSolarConstant(double solarConstantWm2)
    {
        if (!(solarConstantWm2 > 0.0 && double.IsFinite(solarConstantWm2)))
            throw new ArgumentOutOfRangeException(nameof(solarConstantWm2), solarConstantWm2,
                $"solarConstantWm2 = {solarConstantWm2.ToString("R", CultureInfo.InvariantCulture)} is not allowed; the solar constant must be a positive finite irradiance in W/m² (default {DefaultSolarConstantWm2}).");
    }

    private static void ValidateThreshold(double thresholdWm2)
    {
        if (!(thresholdWm2 >= 0.0 && double.IsFinite(thresholdWm2)))
            throw new ArgumentOutOfRangeException(nameof(thresholdWm2), thresholdWm2,
                $"thresholdWm2 = {thresholdWm2.ToString("R", CultureInfo.InvariantCulture)} is not allowed; the threshold must be a finite insolation ≥ 0 W/m².");
    }

    private static void ValidateBand(double southDeg, double northDeg)
    {
        ValidateLatitude(southDeg, nameof(southDeg));
        ValidateLatitude(northDeg, nameof(northDeg));
        if (northDeg < southDeg)
            throw new ArgumentException(string.Create(CultureInfo.InvariantCulture,
                $"northDeg = {northDeg:R} is south of southDeg = {southDeg:R}; a latitude band needs southDeg ≤ northDeg."), nameof(northDeg));
    }

    // ---------------------------------------------------------------- quadrature internals

    /// <summary>(S0/π) / (2π √(1 − e²)): annual mean per unit of ∫F dλ over a full turn.</summary>
    private static double AnnualMeanScale(in InsolationEvaluator ev) =>
        ev.SolarConstantWm2 / Math.PI / (Angles.TwoPi * Math.Sqrt(1.0 - ev.Eccentricity * ev.Eccentricity));

    /// <summary>Area-weighted band mean of the daily mean at true longitude λ (rad).</summary>
    private static double BandDailyMeanRad(in InsolationEvaluator ev, double southDeg, double northDeg, double lambda)
    {
        double sinDelta = ev.SinObliquity * Math.Sin(lambda);
        double cosDelta = Math.Sqrt(1.0 - sinDelta * sinDelta);
        if (southDeg == northDeg)
        {
            var lat = LatitudeTrig.FromDegrees(southDeg);
            return ev.DistanceScaleRad(lambda) * InsolationEvaluator.DailyGeometry(lat.Sin, lat.Cos, sinDelta, cosDelta);
        }
        double muS = LatitudeTrig.FromDegrees(southDeg).Sin, muN = LatitudeTrig.FromDegrees(northDeg).Sin;
        var f = new DailyGeometryOfMu(sinDelta, cosDelta);
        // The polar day and night edges lie at |φ| = 90° − |δ|, i.e. μ = ±cos δ.
        double integral = IntegrateWithBreaks(f, muS, muN, -cosDelta, cosDelta, Math.PI * (muN - muS) * 1e-13);
        return ev.DistanceScaleRad(lambda) * integral / (muN - muS);
    }

    /// <summary>∫₀^{2π} F dλ at one latitude, as 2∫ over [−π/2, π/2] (F depends on λ only through sin λ).</summary>
    internal static double AnnualGeometry(in LatitudeTrig lat, double sinObliquity)
    {
        var f = new DailyGeometryOfLongitude(lat.Sin, lat.Cos, sinObliquity);
        double a = TransitionAngle(lat, sinObliquity);
        double tol = Math.PI * Math.PI * 1e-13;
        return double.IsNaN(a)
            ? 2.0 * GaussKronrod.Integrate(f, -0.5 * Math.PI, 0.5 * Math.PI, tol)
            : 2.0 * IntegrateWithBreaks(f, -0.5 * Math.PI, 0.5 * Math.PI, -a, a, tol);
    }

    /// <summary>
    /// The angle α in [0, π/2] with sin α = cos φ / sin ε, where polar day or night begins (sin λ = ±sin α);
    /// NaN when the latitude has no polar day or night.
    /// </summary>
    private static double TransitionAngle(in LatitudeTrig lat, double sinObliquity)
    {
        if (sinObliquity <= 0.0 || lat.Cos > sinObliquity) return double.NaN;
        return Math.Asin(lat.Cos / sinObliquity);
    }

    /// <summary>∫ F dλ from λ1 to λ2 ≥ λ1 (rad) at one latitude, split at the polar-day and polar-night transitions.</summary>
    internal static double IntegrateOverLongitude(in LatitudeTrig lat, double sinObliquity, double lambda1, double lambda2)
    {
        if (lambda2 <= lambda1) return 0.0;
        var f = new DailyGeometryOfLongitude(lat.Sin, lat.Cos, sinObliquity);
        double tol = Math.PI * (lambda2 - lambda1) * 1e-13;
        double alpha = TransitionAngle(lat, sinObliquity);
        if (double.IsNaN(alpha)) return IntegratePieces(f, lambda1, lambda2, tol);
        // Transitions where sin λ = ±sin α: λ = α, π − α, π + α, 2π − α (mod 2π); also split at every π/2
        // so that no piece is longer than a quarter turn.
        Span<double> basis = [alpha, Math.PI - alpha, Math.PI + alpha, Angles.TwoPi - alpha, 0.0, 0.5 * Math.PI, Math.PI, 1.5 * Math.PI];
        double total = 0.0, start = lambda1;
        double turn0 = Math.Floor(lambda1 / Angles.TwoPi) * Angles.TwoPi;
        Span<double> cuts = stackalloc double[basis.Length];
        for (double turn = turn0; start < lambda2; turn += Angles.TwoPi)
        {
            int n = 0;
            foreach (double b in basis)
            {
                double c = turn + b;
                if (c > start && c < lambda2) cuts[n++] = c;
            }
            cuts[..n].Sort();
            foreach (double c in cuts[..n])
            {
                total += GaussKronrod.Integrate(f, start, c, tol);
                start = c;
            }
            double turnEnd = Math.Min(turn + Angles.TwoPi, lambda2);
            if (turnEnd > start)
            {
                total += GaussKronrod.Integrate(f, start, turnEnd, tol);
                start = turnEnd;
            }
        }
        return total;
    }

    private static double IntegratePieces<TF>(in TF f, double a, double b, double tol) where TF : struct, IRealFunction
    {
        double total = 0.0;
        double quarter = 0.5 * Math.PI;
        for (double x = a; x < b; x += quarter)
            total += GaussKronrod.Integrate(f, x, Math.Min(x + quarter, b), tol);
        return total;
    }

    /// <summary>∫ f over [a, b] split at the breakpoints p1 and p2 where they fall inside.</summary>
    private static double IntegrateWithBreaks<TF>(in TF f, double a, double b, double p1, double p2, double tol) where TF : struct, IRealFunction
    {
        if (p2 < p1) (p1, p2) = (p2, p1);
        double total = 0.0, start = a;
        if (p1 > start && p1 < b) { total += GaussKronrod.Integrate(f, start, p1, tol); start = p1; }
        if (p2 > start && p2 < b) { total += GaussKronrod.Integrate(f, start, p2, tol); start = p2; }
        return total + GaussKronrod.Integrate(f, start, b, tol);
    }

    /// <summary>F(λ) at fixed latitude.</summary>
    private readonly struct DailyGeometryOfLongitude(double sinLat, double cosLat, double sinObliquity) : IRealFunction
    {
        public double Evaluate(double lambda)
        {
            double sinDelta = sinObliquity * Math.Sin(lambda);
            return InsolationEvaluator.DailyGeometry(sinLat, cosLat, sinDelta, Math.Sqrt(1.0 - sinDelta * sinDelta));
        }
    }

    /// <summary>F(μ = sin φ) at fixed declination.</summary>
    private readonly struct DailyGeometryOfMu(double sinDelta, double cosDelta) : IRealFunction
    {
        public double Evaluate(double mu) =>
            InsolationEvaluator.DailyGeometry(mu, Math.Sqrt(Math.Max(0.0, 1.0 - mu * mu)), sinDelta, cosDelta);
    }

    /// <summary>∫F dλ over a year as a function of μ = sin φ.</summary>
    private readonly struct AnnualGeometryOfMu(double sinObliquity) : IRealFunction
    {
        public double Evaluate(double mu) => AnnualGeometry(LatitudeTrig.FromSine(mu), sinObliquity);
    }

    /// <summary>Time above a threshold minus half a year (days), decreasing in the threshold.</summary>
    private readonly struct HalfYearExcess(ThresholdCurve curve, double halfYearDays) : IRealFunction
    {
        public double Evaluate(double threshold) => curve.Above(threshold, withEnergy: false).DurationDays - halfYearDays;
    }

    /// <summary>Daily insolation along the orbit at one latitude, sampled in true longitude, for threshold sets {Q &gt; τ}.</summary>
    private sealed class ThresholdCurve
    {
        private readonly InsolationEvaluator _ev;
        private readonly double[] _samples = new double[ThresholdSamples];
        private readonly double _step = Angles.TwoPi / ThresholdSamples;

        public ThresholdCurve(in InsolationEvaluator ev, LatitudeTrig latitude)
        {
            _ev = ev;
            Latitude = latitude;
            double max = 0.0;
            for (int i = 0; i < ThresholdSamples; i++)
            {
                _samples[i] = Q(i * _step);
                max = Math.Max(max, _samples[i]);
            }
            MaxSample = max;
        }

        public LatitudeTrig Latitude { get; }

        public double MaxSample { get; }

        private double Q(double lambda) => _ev.DailyMeanRad(Latitude.Sin, Latitude.Cos, lambda);

        /// <summary>Energy (J/m²) received (0 unless <paramref name="withEnergy"/>) and days spent while Q &gt; τ.</summary>
        public (double EnergyJm2, double DurationDays) Above(double threshold, bool withEnergy = true)
        {
            int n = ThresholdSamples;
            int firstRise = -1;
            for (int i = 0; i < n; i++)
            {
                if (_samples[i] <= threshold && _samples[(i + 1) % n] > threshold) { firstRise = i; break; }
            }
            if (firstRise < 0)
            {
                // No crossing on the grid: above all year or never.
                bool allAbove = _samples[0] > threshold;
                if (!allAbove) return (0.0, 0.0);
                double all = withEnergy ? _ev.EnergyScale * IntegrateOverLongitude(Latitude, _ev.SinObliquity, 0.0, Angles.TwoPi) : 0.0;
                return (all, SolarCalendar.YearLengthDays);
            }
            double energy = 0.0, days = 0.0;
            double rise = Crossing(firstRise, threshold);
            // Walk once around the orbit from the first rise, pairing each rise with the next fall.
            for (int k = 1; k <= n; k++)
            {
                int i = (firstRise + k) % n;
                int next = (i + 1) % n;
                bool isFall = _samples[i] > threshold && _samples[next] <= threshold;
                bool isRise = _samples[i] <= threshold && _samples[next] > threshold;
                if (isFall)
                {
                    double fall = Crossing(i, threshold);
                    double unwrappedFall = fall + (firstRise + k >= n ? Angles.TwoPi : 0.0);
                    if (unwrappedFall < rise) unwrappedFall += Angles.TwoPi;
                    if (withEnergy) energy += _ev.EnergyScale * IntegrateOverLongitude(Latitude, _ev.SinObliquity, rise, unwrappedFall);
                    days += _ev.DurationDays(rise, unwrappedFall);
                }
                else if (isRise)
                {
                    rise = Crossing(i, threshold) + (firstRise + k >= n ? Angles.TwoPi : 0.0);
                }
            }
            return (energy, days);
        }

        /// <summary>
        /// The longitude in [λ_i, λ_{i+1}] where Q crosses the threshold: Brent's method on Q − τ for τ &gt; 0;
        /// for τ = 0 (the edge of a polar night, where Q − τ vanishes on a whole interval) bisection on the predicate Q &gt; 0.
        /// </summary>
        private double Crossing(int i, double threshold)
        {
            double a = i * _step, b = (i + 1) * _step;
            double qa = _samples[i], qb = _samples[(i + 1) % ThresholdSamples];
            if (threshold > 0.0)
                return BrentRoot.Solve(new Excess(this, threshold), a, b, qa - threshold, qb - threshold, CrossingTolerance);
            bool aboveAtA = qa > threshold;
            for (int k = 0; k < CrossingBisections; k++)
            {
                double mid = 0.5 * (a + b);
                if ((Q(mid) > threshold) == aboveAtA) a = mid; else b = mid;
            }
            return 0.5 * (a + b);
        }

        private readonly struct Excess(ThresholdCurve curve, double threshold) : IRealFunction
        {
            public double Evaluate(double lambda) => curve.Q(lambda) - threshold;
        }
    }
}
