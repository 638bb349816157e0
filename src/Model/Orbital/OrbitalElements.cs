namespace Thermostrat.Model.Orbital;

/// <summary>
/// The three orbital elements that set the seasonal and latitudinal distribution of insolation.
/// </summary>
/// <param name="Eccentricity">Eccentricity e of the Earth's orbit, dimensionless, 0 ≤ e &lt; 1 (0.016724 in 1950).</param>
/// <param name="ObliquityDeg">Obliquity ε (axial tilt) in degrees, 0 ≤ ε ≤ 90 (23.446° in 1950).</param>
/// <param name="PerihelionDeg">
/// Longitude of perihelion ϖ in degrees, measured from the moving vernal equinox with the Earth's
/// heliocentric position, as in Berger (1978): 102.04° in 1950. The Sun's true (geocentric) longitude
/// at perihelion is ϖ + 180° (≈ 282°: perihelion in early January). Any finite value; read it modulo 360°.
/// </param>
/// <remarks>
/// Sign convention (Berger 1978, J. Atmos. Sci. 35, 2362): with the Sun's true longitude λ = 0 at
/// the March equinox, the Earth–Sun distance factor is (a/r)² = (1 − e cos(λ − ϖ))² / (1 − e²)².
/// The climatic precession index e·sin ϖ is largest when northern summer falls at aphelion.
/// </remarks>
public readonly record struct OrbitalElements(double Eccentricity, double ObliquityDeg, double PerihelionDeg)
{
    /// <summary>Climatic precession index e·sin ϖ (dimensionless).</summary>
    public double ClimaticPrecession => Eccentricity * Math.Sin(PerihelionDeg * Angles.DegToRad);

    /// <summary>e·cos ϖ (dimensionless), the companion of <see cref="ClimaticPrecession"/>.</summary>
    public double EccentricityCosPerihelion => Eccentricity * Math.Cos(PerihelionDeg * Angles.DegToRad);

    /// <summary>The Sun's true longitude at perihelion, ϖ + 180°, in degrees in [0, 360).</summary>
    public double SunLongitudeAtPerihelionDeg => Angles.Normalize360(PerihelionDeg + 180.0);

    /// <summary>
    /// Throws <see cref="ArgumentOutOfRangeException"/> naming <paramref name="parameterName"/> unless
    /// 0 ≤ e &lt; 1, 0 ≤ ε ≤ 90° and ϖ is finite.
    /// </summary>
    public void Validate(string parameterName = "elements")
    {
        if (!(Eccentricity >= 0.0 && Eccentricity < 1.0))
            throw new ArgumentOutOfRangeException(parameterName, Eccentricity,
                $"{parameterName}.Eccentricity = {Eccentricity:R} is not allowed; the eccentricity must satisfy 0 ≤ e < 1.");
        if (!(ObliquityDeg >= 0.0 && ObliquityDeg <= 90.0))
            throw new ArgumentOutOfRangeException(parameterName, ObliquityDeg,
                $"{parameterName}.ObliquityDeg = {ObliquityDeg:R} is not allowed; the obliquity must lie in [0, 90] degrees.");
        if (!double.IsFinite(PerihelionDeg))
            throw new ArgumentOutOfRangeException(parameterName, PerihelionDeg,
                $"{parameterName}.PerihelionDeg = {PerihelionDeg:R} is not allowed; the longitude of perihelion must be a finite number of degrees.");
    }

    /// <summary>Elements from e·sin ϖ, e·cos ϖ and ε (ϖ = atan2(e·sin ϖ, e·cos ϖ) in [0, 360); ϖ = 0 when e = 0).</summary>
    public static OrbitalElements FromComponents(double eSinPerihelion, double eCosPerihelion, double obliquityDeg) =>
        new(Math.Sqrt(eSinPerihelion * eSinPerihelion + eCosPerihelion * eCosPerihelion), obliquityDeg,
            Angles.Normalize360(Math.Atan2(eSinPerihelion, eCosPerihelion) * Angles.RadToDeg));

    /// <inheritdoc/>
    public override string ToString() =>
        FormattableString.Invariant($"e = {Eccentricity:F6}, obliquity = {ObliquityDeg:F4}°, perihelion ϖ = {PerihelionDeg:F3}°");
}
