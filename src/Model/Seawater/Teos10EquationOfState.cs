using System.Numerics;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// TEOS-10 (<see cref="Teos10"/>, the 75-term polynomial) seen through the box model's
/// variables; the default equation of state.
/// </summary>
/// <remarks>
/// Mapping: the salinity argument is Absolute Salinity S_A (g/kg), the temperature argument is
/// Conservative Temperature Θ (°C) and the pressure is sea pressure (dbar): the box model's
/// variables are TEOS-10's own, so nothing is approximated beyond the polynomial itself. To start
/// from practical salinity or potential temperature use <see cref="SalinityConversions"/> and
/// <see cref="TemperatureConversions"/>.
/// </remarks>
public sealed class Teos10EquationOfState : IEquationOfState
{
    /// <inheritdoc />
    public string Name => "teos10";

    /// <inheritdoc />
    public T Density<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T> =>
        Teos10.Density(salinity, temperature, pressure);

    /// <inheritdoc />
    public T ThermalExpansion<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T> =>
        Teos10.ThermalExpansion(salinity, temperature, pressure);

    /// <inheritdoc />
    public T HalineContraction<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T> =>
        Teos10.HalineContraction(salinity, temperature, pressure);
}
