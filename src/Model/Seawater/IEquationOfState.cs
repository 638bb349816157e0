using System.Numerics;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// An equation of state for seawater: in-situ density and its exact derivatives, generic over
/// the number type so that model Jacobians computed with dual numbers see through it.
/// </summary>
/// <remarks>
/// Arguments are the box model's variables: salinity in g/kg, temperature in °C and sea
/// pressure in dbar. Each implementation documents how it maps them onto the variables of its
/// own standard (for TEOS-10: Absolute Salinity and Conservative Temperature).
/// </remarks>
public interface IEquationOfState
{
    /// <summary>Short identifier used in configuration (e.g. "teos10").</summary>
    string Name { get; }

    /// <summary>In-situ density ρ in kg/m³.</summary>
    T Density<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T>;

    /// <summary>Thermal expansion coefficient α = −(1/ρ) ∂ρ/∂T in 1/K.</summary>
    T ThermalExpansion<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T>;

    /// <summary>Haline contraction coefficient β = (1/ρ) ∂ρ/∂S in kg/g.</summary>
    T HalineContraction<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T>;
}
