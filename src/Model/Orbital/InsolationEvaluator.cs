using System.Globalization;
using System.Runtime.CompilerServices;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// Daily-mean top-of-atmosphere insolation for one set of orbital elements, with everything that
/// depends only on the elements precomputed (e, sin ε, ϖ, the distance and calendar constants).
/// Construct one per epoch and evaluate many latitudes and days.
/// </summary>
/// <remarks>
/// <para>Daily-mean insolation (Berger 1978, J. Atmos. Sci. 35, 2362; e.g. Hartmann, Global Physical
/// Climatology, ch. 2), with λ the Sun's true longitude (0 at the March equinox), φ the latitude,
/// δ the declination and H the hour angle of sunset:</para>
/// <code>
/// Q = (S0/π) · (1 − e cos(λ − ϖ))² / (1 − e²)² · (H sin φ sin δ + cos φ cos δ sin H),
/// sin δ = sin ε sin λ,   cos H = −tan φ tan δ   (H = π in polar day, 0 in polar night).
/// </code>
/// <para>ϖ is Berger's longitude of perihelion (102.04° in 1950); the Sun's longitude at perihelion is
/// ϖ + 180°. Days are mapped to λ by <see cref="SolarCalendar"/> (365.2422-day year, equinox at
/// noon on 21 March) through Kepler's equation.</para>
/// </remarks>
public readonly struct InsolationEvaluator
{
    private readonly double _e;
    private readonly double _sinObliquity;
    private readonly double _perihelionRad;
    private readonly double _distanceScale;       // (S0/π) / (1 − e²)²
    private readonly double _meanAnomalyAtEquinox; // rad
    private readonly double _energyScale;          // J m⁻² per unit of ∫F dλ: (S0/π)·T/(2π√(1−e²))

    /// <summary>Precomputes the epoch-dependent constants.</summary>
    /// <param name="elements">Orbital elements (validated: 0 ≤ e &lt; 1, 0 ≤ ε ≤ 90°, ϖ finite).</param>
    /// <param name="solarConstantWm2">Total solar irradiance at 1 AU in W/m², positive and finite; default 1361 (IAU 2015 Resolution B3).</param>
    public InsolationEvaluator(in OrbitalElements elements, double solarConstantWm2 = Insolation.DefaultSolarConstantWm2)
    {
        elements.Validate(nameof(elements));
        Insolation.ValidateSolarConstant(solarConstantWm2);
        Elements = elements;
        SolarConstantWm2 = solarConstantWm2;
        _e = elements.Eccentricity;
        _sinObliquity = Math.Sin(elements.ObliquityDeg * Angles.DegToRad);
        _perihelionRad = Angles.Normalize360(elements.PerihelionDeg) * Angles.DegToRad;
        double oneMinusE2 = 1.0 - _e * _e;
        _distanceScale = solarConstantWm2 / Math.PI / (oneMinusE2 * oneMinusE2);
        // True anomaly of the vernal equinox: v = λ − (ϖ + π) at λ = 0.
        _meanAnomalyAtEquinox = Kepler.MeanFromTrue(-_perihelionRad - Math.PI, _e);
        _energyScale = solarConstantWm2 / Math.PI * SolarCalendar.SecondsPerYear / (Angles.TwoPi * Math.Sqrt(oneMinusE2));
    }

    /// <summary>The orbital elements this evaluator was built for.</summary>
    public OrbitalElements Elements { get; }

    /// <summary>Solar constant S0 in W/m².</summary>
    public double SolarConstantWm2 { get; }

    /// <summary>Daily-mean insolation (W/m²) at <paramref name="latitudeDeg"/> when the Sun's true longitude is <paramref name="trueLongitudeDeg"/>.</summary>
    /// <param name="latitudeDeg">Latitude in degrees, −90 to 90.</param>
    /// <param name="trueLongitudeDeg">The Sun's true longitude in degrees (0 = March equinox, 90 = June solstice); any finite value.</param>
    public double DailyMean(double latitudeDeg, double trueLongitudeDeg)
    {
        Insolation.ValidateLatitude(latitudeDeg, nameof(latitudeDeg));
        Insolation.ValidateLongitude(trueLongitudeDeg, nameof(trueLongitudeDeg));
        var lat = LatitudeTrig.FromDegrees(latitudeDeg);
        return DailyMeanRad(lat.Sin, lat.Cos, trueLongitudeDeg * Angles.DegToRad);
    }

    /// <summary>Daily-mean insolation (W/m²) at <paramref name="latitudeDeg"/> on <paramref name="dayOfYear"/> (see <see cref="SolarCalendar"/>).</summary>
    /// <param name="latitudeDeg">Latitude in degrees, −90 to 90.</param>
    /// <param name="dayOfYear">Day of the year in [0, 365.2422], from 0 at 00:00 on 1 January (day number n has midpoint n − 0.5).</param>
    public double DailyMeanOnDay(double latitudeDeg, double dayOfYear)
    {
        Insolation.ValidateLatitude(latitudeDeg, nameof(latitudeDeg));
        SolarCalendar.ValidateDay(dayOfYear, nameof(dayOfYear));
        var lat = LatitudeTrig.FromDegrees(latitudeDeg);
        return DailyMeanRad(lat.Sin, lat.Cos, TrueLongitudeRad(dayOfYear));
    }

    /// <summary>The Sun's true longitude (degrees in [0, 360)) on <paramref name="dayOfYear"/>, by Kepler's equation.</summary>
    public double TrueLongitudeOfDayDeg(double dayOfYear)
    {
        SolarCalendar.ValidateDay(dayOfYear, nameof(dayOfYear));
        return Angles.Normalize360(TrueLongitudeRad(dayOfYear) * Angles.RadToDeg);
    }

    /// <summary>The day of the year in [0, 365.2422) on which the Sun's true longitude is <paramref name="trueLongitudeDeg"/>.</summary>
    public double DayOfTrueLongitude(double trueLongitudeDeg)
    {
        Insolation.ValidateLongitude(trueLongitudeDeg, nameof(trueLongitudeDeg));
        return DayOfTrueLongitudeRad(trueLongitudeDeg * Angles.DegToRad);
    }

    /// <summary>The distance factor (a/r)² = (1 − e cos(λ − ϖ))² / (1 − e²)² at true longitude <paramref name="trueLongitudeDeg"/>.</summary>
    public double DistanceFactor(double trueLongitudeDeg)
    {
        Insolation.ValidateLongitude(trueLongitudeDeg, nameof(trueLongitudeDeg));
        return DistanceScaleRad(trueLongitudeDeg * Angles.DegToRad) * Math.PI / SolarConstantWm2;
    }

    /// <summary>The solar declination δ in degrees at true longitude <paramref name="trueLongitudeDeg"/>: sin δ = sin ε sin λ.</summary>
    public double DeclinationDeg(double trueLongitudeDeg)
    {
        Insolation.ValidateLongitude(trueLongitudeDeg, nameof(trueLongitudeDeg));
        return Math.Asin(_sinObliquity * Math.Sin(trueLongitudeDeg * Angles.DegToRad)) * Angles.RadToDeg;
    }

    // ---- unchecked internals, angles in radians ----

    internal double Eccentricity => _e;
    internal double SinObliquity => _sinObliquity;

    /// <summary>J/m² received per unit of ∫ F dλ (λ in radians): (S0/π)·T_year/(2π√(1−e²)) by Kepler's second law.</summary>
    internal double EnergyScale => _energyScale;

    /// <summary>(S0/π)(a/r)² at true longitude λ (rad).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal double DistanceScaleRad(double lambda)
    {
        double k = 1.0 - _e * Math.Cos(lambda - _perihelionRad);
        return _distanceScale * k * k;
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal double DailyMeanRad(double sinLat, double cosLat, double lambda)
    {
        double sinDelta = _sinObliquity * Math.Sin(lambda);
        double cosDelta = Math.Sqrt(1.0 - sinDelta * sinDelta);
        return DistanceScaleRad(lambda) * DailyGeometry(sinLat, cosLat, sinDelta, cosDelta);
    }

    /// <summary>
    /// The geometric factor F = H sin φ sin δ + cos φ cos δ sin H of the daily mean (Q = (S0/π)(a/r)² F),
    /// with cos H = −tan φ tan δ clipped to polar day (H = π) and polar night (H = 0).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    internal static double DailyGeometry(double sinLat, double cosLat, double sinDelta, double cosDelta)
    {
        double a = sinLat * sinDelta, b = cosLat * cosDelta;
        if (a >= b) return Math.PI * a;   // polar day (a = b = 0 at a pole at equinox gives 0)
        if (a <= -b) return 0.0;          // polar night
        return Math.Acos(-a / b) * a + Math.Sqrt(b * b - a * a);
    }

    /// <summary>True longitude (rad, [0, 2π)) on a day of the year: M = M_VE + 2π(d − d_VE)/T, Kepler, λ = v + ϖ + π.</summary>
    internal double TrueLongitudeRad(double dayOfYear)
    {
        double meanAnomaly = _meanAnomalyAtEquinox + Angles.TwoPi * (dayOfYear - SolarCalendar.VernalEquinoxDayOfYear) / SolarCalendar.YearLengthDays;
        double E = Kepler.EccentricAnomaly(meanAnomaly, _e);
        double v = Kepler.TrueFromEccentric(E, _e);
        return Angles.NormalizeTwoPi(v + _perihelionRad + Math.PI);
    }

    /// <summary>Day of the year in [0, T) at true longitude λ (rad).</summary>
    internal double DayOfTrueLongitudeRad(double lambda)
    {
        double v = Math.IEEERemainder(lambda - _perihelionRad - Math.PI, Angles.TwoPi);
        double meanAnomaly = Kepler.MeanFromTrue(v, _e);
        double day = SolarCalendar.VernalEquinoxDayOfYear + (meanAnomaly - _meanAnomalyAtEquinox) * SolarCalendar.YearLengthDays / Angles.TwoPi;
        day %= SolarCalendar.YearLengthDays;
        if (day < 0) day += SolarCalendar.YearLengthDays;
        return day >= SolarCalendar.YearLengthDays ? 0.0 : day;
    }

    /// <summary>Days the Sun takes to move from λ1 to λ2 ≥ λ1 (rad; may span more than one turn).</summary>
    internal double DurationDays(double lambda1, double lambda2)
    {
        double span = lambda2 - lambda1;
        if (span <= 0) return 0.0;
        double turns = Math.Floor(span / Angles.TwoPi);
        double partial = DayOfTrueLongitudeRad(lambda2) - DayOfTrueLongitudeRad(lambda1);
        if (partial < 0) partial += SolarCalendar.YearLengthDays;
        // Near a whole number of turns the day difference may round to the wrong side of the year's end.
        double remainder = span - turns * Angles.TwoPi;
        if (remainder < 1e-12 && partial > 0.5 * SolarCalendar.YearLengthDays) partial = 0.0;
        else if (remainder > Angles.TwoPi - 1e-12 && partial < 0.5 * SolarCalendar.YearLengthDays) partial = SolarCalendar.YearLengthDays;
        return turns * SolarCalendar.YearLengthDays + partial;
    }

    /// <inheritdoc/>
    public override string ToString() => string.Create(CultureInfo.InvariantCulture, $"InsolationEvaluator({Elements}, S0 = {SolarConstantWm2} W/m²)");
}

/// <summary>sin φ and cos φ of a latitude, with cos φ = 0 exactly at the poles.</summary>
internal readonly record struct LatitudeTrig(double Sin, double Cos)
{
    public static LatitudeTrig FromDegrees(double latitudeDeg)
    {
        if (latitudeDeg == 90.0) return new(1.0, 0.0);
        if (latitudeDeg == -90.0) return new(-1.0, 0.0);
        (double s, double c) = Math.SinCos(latitudeDeg * Angles.DegToRad);
        return new(s, c);
    }

    /// <summary>From μ = sin φ (cos φ = √(1 − μ²)).</summary>
    public static LatitudeTrig FromSine(double mu) => new(mu, Math.Sqrt(Math.Max(0.0, 1.0 - mu * mu)));
}
