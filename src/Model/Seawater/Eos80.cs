using System.Numerics;
using System.Runtime.CompilerServices;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// The international equation of state of seawater 1980 (EOS-80) in its native variables:
/// practical salinity S (PSS-78), temperature t on the IPTS-68 scale (°C) and sea pressure.
/// </summary>
/// <remarks>
/// <para>One-atmosphere density ρ(S, t, 0) of Millero and Poisson (1981) with the pure-water
/// (SMOW) density of Bigg (1967); secant bulk modulus K(S, t, P) of Millero et al. (1980), P in
/// bar; ρ(S, t, P) = ρ(S, t, 0) / (1 − P/K). As adopted in UNESCO (1981), Tenth report of the
/// joint panel on oceanographic tables and standards, UNESCO Tech. Pap. Mar. Sci. 36, and
/// written out in Fofonoff and Millard (1983), UNESCO Tech. Pap. Mar. Sci. 44, whose check
/// values the tests reproduce. Valid for S 0–42, t −2–40 °C, p 0–10000 dbar.</para>
/// <para>The coefficients α and β below are exact derivatives of this ρ with respect to the
/// native variables t68 and S; see <see cref="Eos80EquationOfState"/> for the box model's
/// variables. Every method is generic over the number type. At S = 0 the S^{3/2} terms are
/// taken as exactly zero with zero derivative, so that dual numbers stay finite: this is exact for
/// ρ and its first derivatives; ∂β/∂S itself is unbounded as S → 0, and a dual number seeded in S
/// at exactly S = 0 gets the finite remainder without the unbounded term.</para>
/// </remarks>
public static class Eos80
{
    /// <summary>t68 = 1.00024 · t90: the IPTS-68 temperature of an ITS-90 temperature
    /// (Saunders 1990, WOCE Newsletter 10; the factor used by EOS-80 users and by TEOS-10's
    /// <c>gsw_t90_from_t68</c>, which divides by it).</summary>
    public const double T68PerT90 = 1.00024;

    /// <summary>Density of pure water (SMOW) at one standard atmosphere, kg/m³ (Bigg 1967).</summary>
    /// <param name="temperature68">Temperature, IPTS-68 °C.</param>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static T PureWaterDensity<T>(T temperature68) where T : struct, IFloatingPointIeee754<T>
    {
        T t = temperature68;
        return C<T>(999.842594) + t * (C<T>(6.793952e-2) + t * (C<T>(-9.095290e-3)
            + t * (C<T>(1.001685e-4) + t * (C<T>(-1.120083e-6) + t * C<T>(6.536332e-9)))));
    }

    /// <summary>Density at one standard atmosphere (sea pressure 0), kg/m³ (Millero and Poisson 1981).</summary>
    /// <param name="practicalSalinity">Practical salinity, PSS-78.</param>
    /// <param name="temperature68">Temperature, IPTS-68 °C.</param>
    public static T OneAtmosphereDensity<T>(T practicalSalinity, T temperature68) where T : struct, IFloatingPointIeee754<T>
    {
        T s = practicalSalinity, t = temperature68;
        return PureWaterDensity(t) + s * CoefB(t) + S15(s) * CoefC(t) + C<T>(D0) * s * s;
    }

    /// <summary>Secant bulk modulus K(S, t, P) in bar (Millero et al. 1980).</summary>
    /// <param name="practicalSalinity">Practical salinity, PSS-78.</param>
    /// <param name="temperature68">Temperature, IPTS-68 °C.</param>
    /// <param name="pressure_dbar">Sea pressure, dbar (converted to bar inside).</param>
    public static T SecantBulkModulus<T>(T practicalSalinity, T temperature68, T pressure_dbar) where T : struct, IFloatingPointIeee754<T>
    {
        T s = practicalSalinity, t = temperature68, pb = pressure_dbar * C<T>(0.1);
        T s15 = S15(s);
        T k0 = Kw(t) + s * CoefF(t) + s15 * CoefG(t);
        T a = Aw(t) + s * CoefI(t) + C<T>(J0) * s15;
        T b = Bw(t) + s * CoefM(t);
        return k0 + pb * (a + b * pb);
    }

    /// <summary>In-situ density ρ(S, t, p) = ρ(S, t, 0) / (1 − P/K(S, t, P)), kg/m³.</summary>
    /// <param name="practicalSalinity">Practical salinity, PSS-78.</param>
    /// <param name="temperature68">In-situ temperature, IPTS-68 °C.</param>
    /// <param name="pressure_dbar">Sea pressure, dbar.</param>
    public static T Density<T>(T practicalSalinity, T temperature68, T pressure_dbar) where T : struct, IFloatingPointIeee754<T>
    {
        T pb = pressure_dbar * C<T>(0.1);
        T k = SecantBulkModulus(practicalSalinity, temperature68, pressure_dbar);
        return OneAtmosphereDensity(practicalSalinity, temperature68) / (T.One - pb / k);
    }

    /// <summary>In-situ density from an ITS-90 temperature: <see cref="Density{T}"/> at t68 = 1.00024 t90, kg/m³.</summary>
    public static T DensityFromT90<T>(T practicalSalinity, T temperature90, T pressure_dbar) where T : struct, IFloatingPointIeee754<T> =>
        Density(practicalSalinity, C<T>(T68PerT90) * temperature90, pressure_dbar);

    /// <summary>Thermal expansion −(1/ρ) ∂ρ/∂t68 at constant S and p, 1/K (per IPTS-68 kelvin).</summary>
    /// <remarks>From ρ = ρ0/(1 − P/K): −(1/ρ)∂ρ/∂t = −(∂ρ0/∂t)/ρ0 + P (∂K/∂t) / (K (K − P)).</remarks>
    public static T ThermalExpansion<T>(T practicalSalinity, T temperature68, T pressure_dbar) where T : struct, IFloatingPointIeee754<T>
    {
        T s = practicalSalinity, t = temperature68, pb = pressure_dbar * C<T>(0.1);
        T s15 = S15(s);
        T rho0 = PureWaterDensity(t) + s * CoefB(t) + s15 * CoefC(t) + C<T>(D0) * s * s;
        T rho0T = PureWaterDensityT(t) + s * CoefBT(t) + s15 * CoefCT(t);
        T k = Kw(t) + s * CoefF(t) + s15 * CoefG(t) + pb * (Aw(t) + s * CoefI(t) + C<T>(J0) * s15 + pb * (Bw(t) + s * CoefM(t)));
        T kT = KwT(t) + s * CoefFT(t) + s15 * CoefGT(t) + pb * (AwT(t) + s * CoefIT(t) + pb * (BwT(t) + s * CoefMT(t)));
        return -rho0T / rho0 + pb * kT / (k * (k - pb));
    }

    /// <summary>Haline contraction (1/ρ) ∂ρ/∂S at constant t68 and p, per unit practical salinity.</summary>
    /// <remarks>From ρ = ρ0/(1 − P/K): (1/ρ)∂ρ/∂S = (∂ρ0/∂S)/ρ0 − P (∂K/∂S) / (K (K − P)).</remarks>
    public static T HalineContraction<T>(T practicalSalinity, T temperature68, T pressure_dbar) where T : struct, IFloatingPointIeee754<T>
    {
        T s = practicalSalinity, t = temperature68, pb = pressure_dbar * C<T>(0.1);
        T sr = SqrtOrZero(s);
        T s15 = s * sr;
        T oneHalf = C<T>(1.5);
        T rho0 = PureWaterDensity(t) + s * CoefB(t) + s15 * CoefC(t) + C<T>(D0) * s * s;
        T rho0S = CoefB(t) + oneHalf * sr * CoefC(t) + C<T>(2 * D0) * s;
        T k = Kw(t) + s * CoefF(t) + s15 * CoefG(t) + pb * (Aw(t) + s * CoefI(t) + C<T>(J0) * s15 + pb * (Bw(t) + s * CoefM(t)));
        T kS = CoefF(t) + oneHalf * sr * CoefG(t) + pb * (CoefI(t) + C<T>(1.5 * J0) * sr + pb * CoefM(t));
        return rho0S / rho0 - pb * kS / (k * (k - pb));
    }

    // ---- Coefficients (UNESCO 1981; Fofonoff and Millard 1983, section 3) and their t-derivatives ----
    // (Inlined explicitly: there are too many for the JIT's default inlining budget.)

    private const double D0 = 4.8314e-4;
    private const double J0 = 1.91075e-4;

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T PureWaterDensityT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(6.793952e-2) + t * (C<T>(2 * -9.095290e-3) + t * (C<T>(3 * 1.001685e-4)
            + t * (C<T>(4 * -1.120083e-6) + t * C<T>(5 * 6.536332e-9))));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefB<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(8.24493e-1) + t * (C<T>(-4.0899e-3) + t * (C<T>(7.6438e-5) + t * (C<T>(-8.2467e-7) + t * C<T>(5.3875e-9))));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefBT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(-4.0899e-3) + t * (C<T>(2 * 7.6438e-5) + t * (C<T>(3 * -8.2467e-7) + t * C<T>(4 * 5.3875e-9)));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefC<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(-5.72466e-3) + t * (C<T>(1.0227e-4) + t * C<T>(-1.6546e-6));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefCT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(1.0227e-4) + t * C<T>(2 * -1.6546e-6);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T Kw<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(19652.21) + t * (C<T>(148.4206) + t * (C<T>(-2.327105) + t * (C<T>(1.360477e-2) + t * C<T>(-5.155288e-5))));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T KwT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(148.4206) + t * (C<T>(2 * -2.327105) + t * (C<T>(3 * 1.360477e-2) + t * C<T>(4 * -5.155288e-5)));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefF<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(54.6746) + t * (C<T>(-0.603459) + t * (C<T>(1.09987e-2) + t * C<T>(-6.1670e-5)));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefFT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(-0.603459) + t * (C<T>(2 * 1.09987e-2) + t * C<T>(3 * -6.1670e-5));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefG<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(7.944e-2) + t * (C<T>(1.6483e-2) + t * C<T>(-5.3009e-4));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefGT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(1.6483e-2) + t * C<T>(2 * -5.3009e-4);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T Aw<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(3.239908) + t * (C<T>(1.43713e-3) + t * (C<T>(1.16092e-4) + t * C<T>(-5.77905e-7)));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T AwT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(1.43713e-3) + t * (C<T>(2 * 1.16092e-4) + t * C<T>(3 * -5.77905e-7));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefI<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(2.2838e-3) + t * (C<T>(-1.0981e-5) + t * C<T>(-1.6078e-6));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefIT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(-1.0981e-5) + t * C<T>(2 * -1.6078e-6);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T Bw<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(8.50935e-5) + t * (C<T>(-6.12293e-6) + t * C<T>(5.2787e-8));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T BwT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(-6.12293e-6) + t * C<T>(2 * 5.2787e-8);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefM<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(-9.9348e-7) + t * (C<T>(2.0816e-8) + t * C<T>(9.1697e-10));

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T CoefMT<T>(T t) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(2.0816e-8) + t * C<T>(2 * 9.1697e-10);

    /// <summary>√S, with √0 taken as an exact zero (no infinite derivative for dual numbers).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T SqrtOrZero<T>(T s) where T : struct, IFloatingPointIeee754<T> => T.IsZero(s) ? T.Zero : T.Sqrt(s);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T S15<T>(T s) where T : struct, IFloatingPointIeee754<T> => s * SqrtOrZero(s);

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static T C<T>(double value) where T : struct, IFloatingPointIeee754<T> => T.CreateTruncating(value);
}
