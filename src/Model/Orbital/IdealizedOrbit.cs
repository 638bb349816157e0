using System.Globalization;

namespace Thermostrat.Model.Orbital;

/// <summary>
/// An orbit for building-block experiments: any of the three elements held fixed at a chosen value, the
/// others taken from a base orbit (e.g. fixed tilt; a circular orbit e = 0; a fixed perihelion).
/// </summary>
/// <remarks>
/// With e = 0 the longitude of perihelion has no effect on insolation. To make a fast idealized forcing,
/// wrap the interpolant inside: <c>new IdealizedOrbit(new InterpolatedOrbit(Berger1978Orbit.Shared, …), …)</c>,
/// so the fixed values are returned exactly.
/// </remarks>
public sealed class IdealizedOrbit : IOrbitSource
{
    /// <param name="baseOrbit">Source of the elements that are not fixed.</param>
    /// <param name="fixedEccentricity">Eccentricity to hold, 0 ≤ e &lt; 1, or null to follow the base orbit.</param>
    /// <param name="fixedObliquityDeg">Obliquity to hold, degrees in [0, 90], or null to follow the base orbit.</param>
    /// <param name="fixedPerihelionDeg">Longitude of perihelion ϖ to hold (Berger's convention, 102.04° in 1950), any finite degrees, or null to follow the base orbit.</param>
    public IdealizedOrbit(IOrbitSource baseOrbit, double? fixedEccentricity = null, double? fixedObliquityDeg = null, double? fixedPerihelionDeg = null)
    {
        ArgumentNullException.ThrowIfNull(baseOrbit);
        if (fixedEccentricity is { } e && !(e >= 0.0 && e < 1.0))
            throw new ArgumentOutOfRangeException(nameof(fixedEccentricity), e, $"fixedEccentricity = {e.ToString("R", CultureInfo.InvariantCulture)} is not allowed; the eccentricity must satisfy 0 ≤ e < 1.");
        if (fixedObliquityDeg is { } o && !(o >= 0.0 && o <= 90.0))
            throw new ArgumentOutOfRangeException(nameof(fixedObliquityDeg), o, $"fixedObliquityDeg = {o.ToString("R", CultureInfo.InvariantCulture)} is not allowed; the obliquity must lie in [0, 90] degrees.");
        if (fixedPerihelionDeg is { } p && !double.IsFinite(p))
            throw new ArgumentOutOfRangeException(nameof(fixedPerihelionDeg), p, $"fixedPerihelionDeg = {p.ToString("R", CultureInfo.InvariantCulture)} is not allowed; the longitude of perihelion must be a finite number of degrees.");
        BaseOrbit = baseOrbit;
        FixedEccentricity = fixedEccentricity;
        FixedObliquityDeg = fixedObliquityDeg;
        FixedPerihelionDeg = fixedPerihelionDeg is { } q ? Angles.Normalize360(q) : null;
    }

    /// <summary>
    /// Holds the selected elements at the base orbit's present values (t = 0, i.e. 1950).
    /// </summary>
    public static IdealizedOrbit HoldAtPresent(IOrbitSource baseOrbit, bool eccentricity = false, bool obliquity = false, bool perihelion = false)
    {
        ArgumentNullException.ThrowIfNull(baseOrbit);
        OrbitalElements now = baseOrbit.At(0.0);
        return new IdealizedOrbit(baseOrbit,
            eccentricity ? now.Eccentricity : null,
            obliquity ? now.ObliquityDeg : null,
            perihelion ? now.PerihelionDeg : null);
    }

    /// <summary>A circular orbit (e = 0) with the base orbit's obliquity.</summary>
    public static IdealizedOrbit Circular(IOrbitSource baseOrbit) => new(baseOrbit, fixedEccentricity: 0.0);

    /// <summary>The orbit the free elements come from.</summary>
    public IOrbitSource BaseOrbit { get; }

    /// <summary>Held eccentricity, or null.</summary>
    public double? FixedEccentricity { get; }

    /// <summary>Held obliquity in degrees, or null.</summary>
    public double? FixedObliquityDeg { get; }

    /// <summary>Held longitude of perihelion in degrees [0, 360), or null.</summary>
    public double? FixedPerihelionDeg { get; }

    private bool AllFixed => FixedEccentricity.HasValue && FixedObliquityDeg.HasValue && FixedPerihelionDeg.HasValue;

    /// <inheritdoc/>
    public string Description
    {
        get
        {
            var held = new List<string>();
            if (FixedEccentricity is { } e) held.Add(e == 0 ? "eccentricity fixed at 0 (circular orbit)" : string.Create(CultureInfo.InvariantCulture, $"eccentricity fixed at {e:0.######}"));
            if (FixedObliquityDeg is { } o) held.Add(string.Create(CultureInfo.InvariantCulture, $"obliquity fixed at {o:0.####}°"));
            if (FixedPerihelionDeg is { } p) held.Add(string.Create(CultureInfo.InvariantCulture, $"perihelion fixed at ϖ = {p:0.###}°"));
            return held.Count == 0 ? BaseOrbit.Description : $"{BaseOrbit.Description}, with {string.Join(", ", held)}";
        }
    }

    /// <inheritdoc/>
    public OrbitalElements At(double yearsSince1950)
    {
        if (AllFixed)
        {
            IOrbitSource.ValidateTime(yearsSince1950);
            return new OrbitalElements(FixedEccentricity!.Value, FixedObliquityDeg!.Value, FixedPerihelionDeg!.Value);
        }
        OrbitalElements b = BaseOrbit.At(yearsSince1950);
        return new OrbitalElements(FixedEccentricity ?? b.Eccentricity, FixedObliquityDeg ?? b.ObliquityDeg, FixedPerihelionDeg ?? b.PerihelionDeg);
    }

    /// <inheritdoc/>
    public IReadOnlyList<string> CheckRange(double tStartYears, double tEndYears)
    {
        if (AllFixed)
        {
            IOrbitSource.ValidateSpan(tStartYears, tEndYears);
            return [];
        }
        return BaseOrbit.CheckRange(tStartYears, tEndYears);
    }
}
