using System.Numerics;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// Conversions between practical salinity (PSS-78, dimensionless) and Absolute Salinity (g/kg)
/// for seawater of reference composition.
/// </summary>
/// <remarks>
/// S_A = S_R = (35.16504/35) g/kg · S_P: the Reference Salinity of Millero et al. (2008),
/// Deep-Sea Res. I 55, 50, as used by TEOS-10 (IOC, SCOR and IAPSO 2010, eq. 2.4.1;
/// <c>gsw_SR_from_SP</c>). The Absolute Salinity anomaly δS_A (up to about 0.025 g/kg in the deep
/// North Pacific, more in some marginal seas such as the Baltic) is taken as zero: box-model water
/// is of reference composition. TEOS-10's own <c>gsw_SA_from_SP</c> adds δS_A from an atlas at
/// a given position, so it differs from this conversion by that anomaly.
/// </remarks>
public static class SalinityConversions
{
    /// <summary>u_PS = 35.16504/35 g/kg: Absolute (Reference) Salinity per unit practical salinity.</summary>
    public const double AbsolutePerPractical = 35.16504 / 35.0;

    /// <summary>35/35.16504: practical salinity per g/kg of Absolute (Reference) Salinity.</summary>
    public const double PracticalPerAbsolute = 35.0 / 35.16504;

    /// <summary>Absolute Salinity in g/kg from practical salinity, S_A = u_PS S_P (no anomaly).</summary>
    public static T AbsoluteFromPractical<T>(T practicalSalinity) where T : struct, IFloatingPointIeee754<T> =>
        T.CreateTruncating(AbsolutePerPractical) * practicalSalinity;

    /// <summary>Practical salinity from Absolute Salinity in g/kg, S_P = S_A / u_PS (no anomaly).</summary>
    public static T PracticalFromAbsolute<T>(T absoluteSalinity) where T : struct, IFloatingPointIeee754<T> =>
        T.CreateTruncating(PracticalPerAbsolute) * absoluteSalinity;
}
