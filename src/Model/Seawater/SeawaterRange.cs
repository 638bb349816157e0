using System.Globalization;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// The range of seawater states in which the library's equations of state are used, and the
/// checks that reject input outside it.
/// </summary>
/// <remarks>
/// The bounds are the box of the TEOS-10 75-term polynomial (Roquet et al. 2015, Ocean
/// Modelling 90, 29): salinity 0–42 g/kg, temperature −2–40 °C, sea pressure 0–8000 dbar.
/// Inside that box the polynomial was fitted only in the "oceanographic funnel" (cold and salty
/// at depth); the box is what is accepted as input. The equation-of-state methods themselves do
/// not check their arguments (they are the model's hot path); callers that take user input do.
/// </remarks>
public static class SeawaterRange
{
    /// <summary>Lowest accepted salinity, g/kg.</summary>
    public const double MinSalinity = 0.0;

    /// <summary>Highest accepted salinity, g/kg.</summary>
    public const double MaxSalinity = 42.0;

    /// <summary>Lowest accepted temperature, °C.</summary>
    public const double MinTemperature = -2.0;

    /// <summary>Highest accepted temperature, °C.</summary>
    public const double MaxTemperature = 40.0;

    /// <summary>Lowest accepted sea pressure, dbar.</summary>
    public const double MinPressure_dbar = 0.0;

    /// <summary>Highest accepted sea pressure, dbar.</summary>
    public const double MaxPressure_dbar = 8000.0;

    /// <summary>Returns <paramref name="salinity"/> (g/kg) or throws if it is NaN or outside 0–42 g/kg.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN or out of range; the message names it and the range.</exception>
    public static double CheckSalinity(double salinity, string argumentName) =>
        CheckRange(salinity, MinSalinity, MaxSalinity, "g/kg", argumentName);

    /// <summary>Returns <paramref name="temperature"/> (°C) or throws if it is NaN or outside −2–40 °C.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN or out of range; the message names it and the range.</exception>
    public static double CheckTemperature(double temperature, string argumentName) =>
        CheckRange(temperature, MinTemperature, MaxTemperature, "°C", argumentName);

    /// <summary>Returns <paramref name="pressure_dbar"/> or throws if it is NaN or outside 0–8000 dbar.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN or out of range; the message names it and the range.</exception>
    public static double CheckPressure(double pressure_dbar, string argumentName) =>
        CheckRange(pressure_dbar, MinPressure_dbar, MaxPressure_dbar, "dbar", argumentName);

    internal static double CheckRange(double value, double min, double max, string unit, string argumentName)
    {
        if (double.IsNaN(value) || value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(argumentName, value,
                string.Create(CultureInfo.InvariantCulture,
                    $"{argumentName} = {value} {unit} is outside the allowed range {min} to {max} {unit}."));
        }
        return value;
    }
}
