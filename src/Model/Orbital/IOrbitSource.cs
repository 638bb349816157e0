namespace Thermostrat.Model.Orbital;

/// <summary>
/// A source of orbital elements as a function of time: the Berger (1978) series, an imported
/// tabulated solution, an idealized orbit, or a fast interpolant of any of these.
/// </summary>
/// <remarks>
/// Time t is in years relative to 1950 CE, negative into the past (t = −21000 is 21 ka);
/// see <see cref="YearsFromAgeKa"/>. Implementations are immutable and safe to call from several threads.
/// </remarks>
public interface IOrbitSource
{
    /// <summary>The orbital elements at <paramref name="yearsSince1950"/> (years relative to 1950 CE; negative = past).</summary>
    /// <exception cref="ArgumentOutOfRangeException">The time is not finite or outside the range the source can serve.</exception>
    OrbitalElements At(double yearsSince1950);

    /// <summary>A one-line human-readable description of the source, for output metadata.</summary>
    string Description { get; }

    /// <summary>
    /// Checks that the source can serve every time in [<paramref name="tStartYears"/>, <paramref name="tEndYears"/>]
    /// (years relative to 1950). Returns warnings as data (empty when there is nothing to say); throws
    /// <see cref="ArgumentOutOfRangeException"/> when the span cannot be served at all.
    /// </summary>
    IReadOnlyList<string> CheckRange(double tStartYears, double tEndYears);

    /// <summary>Years relative to 1950 for an age in ka (thousands of years before 1950, positive into the past): t = −1000·age.</summary>
    static double YearsFromAgeKa(double ageKa) => -1000.0 * ageKa;

    /// <summary>Age in ka (positive into the past) for a time in years relative to 1950: age = −t/1000.</summary>
    static double AgeKaFromYears(double yearsSince1950) => -yearsSince1950 / 1000.0;

    /// <summary>Shared argument check for <see cref="CheckRange"/> implementations.</summary>
    internal static void ValidateSpan(double tStartYears, double tEndYears)
    {
        if (!double.IsFinite(tStartYears))
            throw new ArgumentOutOfRangeException(nameof(tStartYears), tStartYears, $"tStartYears = {tStartYears:R} must be a finite number of years relative to 1950.");
        if (!double.IsFinite(tEndYears))
            throw new ArgumentOutOfRangeException(nameof(tEndYears), tEndYears, $"tEndYears = {tEndYears:R} must be a finite number of years relative to 1950.");
        if (tEndYears < tStartYears)
            throw new ArgumentException($"tEndYears = {tEndYears:R} is before tStartYears = {tStartYears:R}; the span must satisfy tStartYears ≤ tEndYears.", nameof(tEndYears));
    }

    /// <summary>Shared check that a single time is finite.</summary>
    internal static void ValidateTime(double yearsSince1950)
    {
        if (!double.IsFinite(yearsSince1950))
            throw new ArgumentOutOfRangeException(nameof(yearsSince1950), yearsSince1950, $"yearsSince1950 = {yearsSince1950:R} must be a finite number of years relative to 1950.");
    }
}
