using System.Globalization;
using System.Numerics;

namespace Thermostrat.Model.Seawater;

/// <summary>Coefficients of the linear equation of state (all configurable).</summary>
/// <remarks>
/// Defaults: ρ0 = 1027 kg/m³, T0 = 10 °C, S0 = 35 g/kg (common practice for a reference
/// ocean); α = 2e-4 1/K and β = 7.6e-4 kg/g, the textbook near-surface values (e.g. Vallis,
/// Atmospheric and Oceanic Fluid Dynamics; quoted from memory).
/// </remarks>
public sealed record LinearEosParameters
{
    /// <summary>Reference density ρ0, kg/m³ (positive).</summary>
    public double ReferenceDensity_kgm3 { get; init; } = 1027.0;

    /// <summary>Reference temperature T0, °C.</summary>
    public double ReferenceTemperature_C { get; init; } = 10.0;

    /// <summary>Reference salinity S0, g/kg.</summary>
    public double ReferenceSalinity_gkg { get; init; } = 35.0;

    /// <summary>Thermal expansion coefficient α, 1/K, relative to ρ0.</summary>
    public double ThermalExpansion_perK { get; init; } = 2e-4;

    /// <summary>Haline contraction coefficient β, kg/g (per g/kg), relative to ρ0.</summary>
    public double HalineContraction_perGkg { get; init; } = 7.6e-4;

    /// <summary>Throws if a coefficient is not finite or ρ0 is not positive.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A coefficient is invalid; the message names it.</exception>
    public void Validate()
    {
        Check(nameof(ReferenceDensity_kgm3), ReferenceDensity_kgm3, positive: true);
        Check(nameof(ReferenceTemperature_C), ReferenceTemperature_C, positive: false);
        Check(nameof(ReferenceSalinity_gkg), ReferenceSalinity_gkg, positive: false);
        Check(nameof(ThermalExpansion_perK), ThermalExpansion_perK, positive: false);
        Check(nameof(HalineContraction_perGkg), HalineContraction_perGkg, positive: false);
    }

    private static void Check(string name, double value, bool positive)
    {
        if (!double.IsFinite(value) || (positive && value <= 0))
        {
            throw new ArgumentOutOfRangeException(name, value, string.Create(CultureInfo.InvariantCulture,
                $"Linear equation of state: {name} = {value} is not allowed; it must be a finite number{(positive ? " greater than 0" : "")}."));
        }
    }
}

/// <summary>
/// The linear equation of state ρ = ρ0 [1 − α (T − T0) + β (S − S0)], independent of pressure
/// (the form of Stommel 1961 and of most conceptual box models).
/// </summary>
/// <remarks>
/// Arguments map directly: salinity in g/kg, temperature in °C; pressure is ignored.
/// The configured α and β are defined relative to ρ0 (∂ρ/∂T = −ρ0 α exactly). The interface's
/// coefficients are relative to the in-situ density, −(1/ρ)∂ρ/∂T = α ρ0/ρ: they equal the
/// configured values exactly at the reference state, differ from them by the factor ρ0/ρ
/// (a few parts in 10⁴ over the ocean's range) elsewhere, and their ratio α/β is the
/// configured ratio everywhere.
/// </remarks>
public sealed class LinearEquationOfState : IEquationOfState
{
    private readonly double _rho0, _t0, _s0, _alpha, _beta;

    /// <summary>Creates the equation of state; <paramref name="parameters"/> defaults to <see cref="LinearEosParameters"/>'s defaults.</summary>
    /// <exception cref="ArgumentOutOfRangeException">A coefficient is not finite or ρ0 ≤ 0.</exception>
    public LinearEquationOfState(LinearEosParameters? parameters = null)
    {
        Parameters = parameters ?? new LinearEosParameters();
        Parameters.Validate();
        _rho0 = Parameters.ReferenceDensity_kgm3;
        _t0 = Parameters.ReferenceTemperature_C;
        _s0 = Parameters.ReferenceSalinity_gkg;
        _alpha = Parameters.ThermalExpansion_perK;
        _beta = Parameters.HalineContraction_perGkg;
    }

    /// <summary>The coefficients in use.</summary>
    public LinearEosParameters Parameters { get; }

    /// <inheritdoc />
    public string Name => "linear";

    /// <inheritdoc />
    public T Density<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T>
    {
        T rho0 = T.CreateTruncating(_rho0);
        return rho0 * (T.One - T.CreateTruncating(_alpha) * (temperature - T.CreateTruncating(_t0))
                             + T.CreateTruncating(_beta) * (salinity - T.CreateTruncating(_s0)));
    }

    /// <inheritdoc />
    public T ThermalExpansion<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T> =>
        T.CreateTruncating(_alpha) * (T.CreateTruncating(_rho0) / Density(salinity, temperature, pressure));

    /// <inheritdoc />
    public T HalineContraction<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T> =>
        T.CreateTruncating(_beta) * (T.CreateTruncating(_rho0) / Density(salinity, temperature, pressure));
}
