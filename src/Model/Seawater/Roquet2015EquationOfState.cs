using System.Numerics;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// The simplified nonlinear equation of state of Roquet, Madec, Brodeau and Nycander (2015),
/// J. Phys. Oceanogr. 45, 2564: linear plus cabbeling (λ1, λ2, ν) and thermobaricity (μ1, μ2),
/// <code>
/// ρ = ρ0 − a0 (1 + ½ λ1 Ta + μ1 z) Ta + b0 (1 − ½ λ2 Sa − μ2 z) Sa − ν Ta Sa,
/// Ta = T − 10 °C,  Sa = S − 35 g/kg,  z depth in m (positive down).
/// </code>
/// </summary>
/// <remarks>
/// <para>Arguments: salinity is Absolute Salinity (g/kg) and temperature Conservative Temperature
/// (°C), the variables the equation was fitted in (to TEOS-10). The depth is taken from the sea
/// pressure hydrostatically with constant density, z = p·10⁴ Pa/dbar / (ρ0 g), g = 9.81 m/s²
/// (about 0.994 m per dbar). Against the depth of a pressure level from TEOS-10
/// (<c>gsw.z_from_p</c>, python3-gsw 3.6.16) this overstates depth by 0.1–0.4 % at 1000 dbar and
/// 1.7–2.0 % at 8000 dbar (latitude 0–45°), and the thermobaric terms by as much.</para>
/// <para>The equation has no compressibility term: at fixed (S, T) density grows with depth
/// only through thermobaricity. It is meant for density differences at a common depth, not for
/// the absolute in-situ density at depth.</para>
/// <para>Coefficients (the constants below) are those of the paper in the form in which the
/// equation is distributed as an option of a public ocean-model code; ρ0 = 1026 kg/m³ is quoted
/// from memory.</para>
/// </remarks>
public sealed class Roquet2015EquationOfState : IEquationOfState
{
    /// <summary>Reference density ρ0, kg/m³.</summary>
    public const double Rho0 = 1026.0;
    /// <summary>Reference temperature, °C.</summary>
    public const double T0 = 10.0;
    /// <summary>Reference salinity, g/kg.</summary>
    public const double S0 = 35.0;
    /// <summary>Linear thermal coefficient a0, kg m⁻³ K⁻¹.</summary>
    public const double A0 = 1.6550e-1;
    /// <summary>Linear haline coefficient b0, kg m⁻³ (g/kg)⁻¹.</summary>
    public const double B0 = 7.6554e-1;
    /// <summary>Thermal cabbeling λ1, K⁻¹.</summary>
    public const double Lambda1 = 5.9520e-2;
    /// <summary>Haline cabbeling λ2, (g/kg)⁻¹.</summary>
    public const double Lambda2 = 5.4914e-4;
    /// <summary>Thermohaline cabbeling ν, kg m⁻³ K⁻¹ (g/kg)⁻¹.</summary>
    public const double Nu = 2.4341e-3;
    /// <summary>Thermobaric coefficient μ1, K⁻¹ m⁻¹.</summary>
    public const double Mu1 = 1.4970e-4;
    /// <summary>Halobaric coefficient μ2, (g/kg)⁻¹ m⁻¹.</summary>
    public const double Mu2 = 1.1090e-5;
    /// <summary>Gravitational acceleration used to turn pressure into depth, m/s².</summary>
    public const double Gravity = 9.81;

    /// <summary>Metres of depth per dbar of pressure, 10⁴ / (ρ0 g).</summary>
    public const double MetresPerDbar = 1e4 / (Rho0 * Gravity);

    /// <inheritdoc />
    public string Name => "roquet2015";

    /// <inheritdoc />
    public T Density<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T>
    {
        T ta = temperature - C<T>(T0);
        T sa = salinity - C<T>(S0);
        T z = C<T>(MetresPerDbar) * pressure;
        T half = C<T>(0.5);
        return C<T>(Rho0)
            - C<T>(A0) * (T.One + half * C<T>(Lambda1) * ta + C<T>(Mu1) * z) * ta
            + C<T>(B0) * (T.One - half * C<T>(Lambda2) * sa - C<T>(Mu2) * z) * sa
            - C<T>(Nu) * ta * sa;
    }

    /// <inheritdoc />
    /// <remarks>∂ρ/∂T = −a0 (1 + λ1 Ta + μ1 z) − ν Sa.</remarks>
    public T ThermalExpansion<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T>
    {
        T ta = temperature - C<T>(T0);
        T sa = salinity - C<T>(S0);
        T z = C<T>(MetresPerDbar) * pressure;
        T dRhoDt = -C<T>(A0) * (T.One + C<T>(Lambda1) * ta + C<T>(Mu1) * z) - C<T>(Nu) * sa;
        return -dRhoDt / Density(salinity, temperature, pressure);
    }

    /// <inheritdoc />
    /// <remarks>∂ρ/∂S = b0 (1 − λ2 Sa − μ2 z) − ν Ta.</remarks>
    public T HalineContraction<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T>
    {
        T ta = temperature - C<T>(T0);
        T sa = salinity - C<T>(S0);
        T z = C<T>(MetresPerDbar) * pressure;
        T dRhoDs = C<T>(B0) * (T.One - C<T>(Lambda2) * sa - C<T>(Mu2) * z) - C<T>(Nu) * ta;
        return dRhoDs / Density(salinity, temperature, pressure);
    }

    private static T C<T>(double value) where T : struct, IFloatingPointIeee754<T> => T.CreateTruncating(value);
}
