using System.Numerics;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// TEOS-10 seawater properties from the 75-term polynomial for specific volume (Roquet et al.
/// 2015, Ocean Modelling 90, 29; the polynomial of the TEOS-10 GSW toolbox), in TEOS-10's
/// native variables: Absolute Salinity S_A (g/kg), Conservative Temperature Θ (°C), sea
/// pressure p (dbar).
/// </summary>
/// <remarks>
/// Fitted to the full TEOS-10 Gibbs function in the "oceanographic funnel" within S_A 0–42 g/kg,
/// Θ −2–40 °C, p 0–8000 dbar (see the paper for its error there). α and β are exact derivatives of the polynomial, as in
/// <c>gsw_alpha</c> and <c>gsw_beta</c>. Generic over the number type.
/// </remarks>
public static class Teos10
{
    private const double YPerCT = 0.025;   // ys = Θ / 40 °C
    private const double ZPerDbar = 1e-4;  // z = p / 10⁴ dbar

    /// <summary>Specific volume v = 1/ρ, m³/kg.</summary>
    /// <param name="absoluteSalinity">S_A, g/kg.</param>
    /// <param name="conservativeTemperature">Θ, °C.</param>
    /// <param name="pressure_dbar">Sea pressure, dbar.</param>
    public static T SpecificVolume<T>(T absoluteSalinity, T conservativeTemperature, T pressure_dbar) where T : struct, IFloatingPointIeee754<T> =>
        Teos10Polynomial.SpecificVolume(Xs(absoluteSalinity), C<T>(YPerCT) * conservativeTemperature, C<T>(ZPerDbar) * pressure_dbar);

    /// <summary>In-situ density ρ = 1/v, kg/m³.</summary>
    /// <param name="absoluteSalinity">S_A, g/kg.</param>
    /// <param name="conservativeTemperature">Θ, °C.</param>
    /// <param name="pressure_dbar">Sea pressure, dbar.</param>
    public static T Density<T>(T absoluteSalinity, T conservativeTemperature, T pressure_dbar) where T : struct, IFloatingPointIeee754<T> =>
        T.One / SpecificVolume(absoluteSalinity, conservativeTemperature, pressure_dbar);

    /// <summary>Thermal expansion with respect to Θ, α = (1/v) ∂v/∂Θ, 1/K (<c>gsw_alpha</c>).</summary>
    /// <param name="absoluteSalinity">S_A, g/kg.</param>
    /// <param name="conservativeTemperature">Θ, °C.</param>
    /// <param name="pressure_dbar">Sea pressure, dbar.</param>
    public static T ThermalExpansion<T>(T absoluteSalinity, T conservativeTemperature, T pressure_dbar) where T : struct, IFloatingPointIeee754<T>
    {
        T v = Teos10Polynomial.SpecificVolumeAndYDerivative(Xs(absoluteSalinity), C<T>(YPerCT) * conservativeTemperature,
            C<T>(ZPerDbar) * pressure_dbar, out T dvdys);
        return C<T>(YPerCT) * dvdys / v;
    }

    /// <summary>Haline contraction at constant Θ, β = −(1/v) ∂v/∂S_A, kg/g (<c>gsw_beta</c>).</summary>
    /// <param name="absoluteSalinity">S_A, g/kg.</param>
    /// <param name="conservativeTemperature">Θ, °C.</param>
    /// <param name="pressure_dbar">Sea pressure, dbar.</param>
    /// <remarks>∂xs/∂S_A = sfac / (2 xs).</remarks>
    public static T HalineContraction<T>(T absoluteSalinity, T conservativeTemperature, T pressure_dbar) where T : struct, IFloatingPointIeee754<T>
    {
        T xs = Xs(absoluteSalinity);
        T v = Teos10Polynomial.SpecificVolumeAndXDerivative(xs, C<T>(YPerCT) * conservativeTemperature,
            C<T>(ZPerDbar) * pressure_dbar, out T dvdxs);
        return -dvdxs * C<T>(0.5 * Teos10Polynomial.SalinityFactor) / (xs * v);
    }

    private static T Xs<T>(T absoluteSalinity) where T : struct, IFloatingPointIeee754<T> =>
        T.Sqrt(C<T>(Teos10Polynomial.SalinityFactor) * absoluteSalinity + C<T>(Teos10Polynomial.SalinityOffset));

    private static T C<T>(double value) where T : struct, IFloatingPointIeee754<T> => T.CreateTruncating(value);
}
