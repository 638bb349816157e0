namespace Thermostrat.Model.Seawater;

/// <summary>
/// Temperature scales and TEOS-10 temperature variables: IPTS-68 ↔ ITS-90, and Conservative
/// Temperature Θ ↔ potential temperature θ (reference pressure 0 dbar).
/// </summary>
/// <remarks>
/// <para>Θ = h⁰(S_A, θ)/c_p⁰, with h⁰ the potential enthalpy at sea pressure 0 and
/// c_p⁰ = 3991.86795711963 J kg⁻¹ K⁻¹ (IOC, SCOR and IAPSO 2010, TEOS-10 manual, eqs. 3.3.1 and
/// 3.3.3). h⁰(S_A, θ) is the polynomial in √(sfac S_A) and θ/40 °C obtained exactly from the
/// TEOS-10 Gibbs function (IAPWS-08 saline part plus IAPWS-09 pure-water part) at p = 0, as in
/// the GSW toolbox's <c>gsw_CT_from_pt</c>; it is exact, not a fit. θ from Θ is found by Newton
/// iteration on that polynomial with its exact derivative, to 1e-12 K.</para>
/// <para>In-situ temperature is converted only at the surface, where θ (referenced to 0 dbar)
/// equals the in-situ temperature t by definition, so <see cref="ConservativeFromInSituAtSurface"/>
/// is exact at p = 0. Converting in-situ temperature at depth needs the pressure-dependent Gibbs
/// function (an adiabatic correction of a few tenths of a kelvin at 4000 dbar), which this library
/// does not implement.</para>
/// </remarks>
public static class TemperatureConversions
{
    /// <summary>c_p⁰, J kg⁻¹ K⁻¹: the heat capacity that scales potential enthalpy into Θ (TEOS-10 eq. 3.3.3).</summary>
    public const double Cp0 = 3991.86795711963;

    /// <summary>Largest number of Newton iterations in <see cref="PotentialFromConservative"/>.</summary>
    private const int MaxNewtonIterations = 20;

    /// <summary>Newton tolerance on θ, K: far below the 6e-10 K accepted by the TEOS-10 check values.</summary>
    private const double NewtonTolerance_K = 1e-12;

    /// <summary>IPTS-68 temperature from ITS-90, t68 = 1.00024 t90 (°C; Saunders 1990, quoted from memory).</summary>
    public static double T68FromT90(double temperature90) => Eos80.T68PerT90 * temperature90;

    /// <summary>ITS-90 temperature from IPTS-68, t90 = t68 / 1.00024 (°C; as <c>gsw_t90_from_t68</c>).</summary>
    public static double T90FromT68(double temperature68) => temperature68 / Eos80.T68PerT90;

    /// <summary>Potential enthalpy h⁰(S_A, θ) at sea pressure 0, J/kg.</summary>
    /// <param name="absoluteSalinity">S_A, g/kg.</param>
    /// <param name="potentialTemperature">θ (reference pressure 0 dbar), ITS-90 °C.</param>
    public static double PotentialEnthalpy(double absoluteSalinity, double potentialTemperature)
    {
        double x2 = Teos10Polynomial.SalinityFactor * absoluteSalinity;
        double x = Math.Sqrt(x2);
        double y = potentialTemperature * 0.025;
        // h0 = H0(y) + x²[A(y) + x(B(y) + x(C(x) + y D(y)))], coefficients of the TEOS-10 Gibbs function at p = 0.
        return 61.01362420681071 + y * (168776.46138048015 + y * (-2735.2785605119625 + y * (2574.2164453821433
                + y * (-1536.6644434977543 + y * (545.7340497931629 + (-50.91091728474331 - 18.30489878927802 * y) * y)))))
            + x2 * (268.5520265845071 + y * (-12019.028203559312 + y * (3734.858026725145 + y * (-2046.7671145057618
                + y * (465.28655623826234 + (-0.6370820302376359 - 10.650848542359153 * y) * y))))
            + x * (937.2099110620707 + y * (588.1802812170108 + y * (248.39476522971285 + (-3.871557904936333
                - 2.6268019854268356 * y) * y))
            + x * (-1687.914374187449 + x * (246.9598888781377 + x * (123.59576582457964 - 48.5891069025409 * x))
            + y * (936.3206544460336 + y * (-942.7827304544439 + y * (369.4389437509002
                + (-33.83664947895248 - 9.987880382780322 * y) * y))))));
    }

    /// <summary>∂h⁰/∂θ at sea pressure 0, J kg⁻¹ K⁻¹: the exact derivative of <see cref="PotentialEnthalpy"/>.</summary>
    public static double PotentialEnthalpyTemperatureDerivative(double absoluteSalinity, double potentialTemperature)
    {
        double x2 = Teos10Polynomial.SalinityFactor * absoluteSalinity;
        double x = Math.Sqrt(x2);
        double y = potentialTemperature * 0.025;
        double dH0 = 168776.46138048015 + y * (2 * -2735.2785605119625 + y * (3 * 2574.2164453821433
            + y * (4 * -1536.6644434977543 + y * (5 * 545.7340497931629 + y * (6 * -50.91091728474331 + y * (7 * -18.30489878927802))))));
        double dA = -12019.028203559312 + y * (2 * 3734.858026725145 + y * (3 * -2046.7671145057618
            + y * (4 * 465.28655623826234 + y * (5 * -0.6370820302376359 + y * (6 * -10.650848542359153)))));
        double dB = 588.1802812170108 + y * (2 * 248.39476522971285 + y * (3 * -3.871557904936333 + y * (4 * -2.6268019854268356)));
        double dYD = 936.3206544460336 + y * (2 * -942.7827304544439 + y * (3 * 369.4389437509002
            + y * (4 * -33.83664947895248 + y * (5 * -9.987880382780322))));
        return 0.025 * (dH0 + x2 * (dA + x * (dB + x * dYD)));
    }

    /// <summary>Conservative Temperature Θ = h⁰(S_A, θ)/c_p⁰ from potential temperature, °C (<c>gsw_CT_from_pt</c>).</summary>
    /// <param name="absoluteSalinity">S_A, g/kg.</param>
    /// <param name="potentialTemperature">θ (reference pressure 0 dbar), ITS-90 °C.</param>
    public static double ConservativeFromPotential(double absoluteSalinity, double potentialTemperature) =>
        PotentialEnthalpy(absoluteSalinity, potentialTemperature) / Cp0;

    /// <summary>Conservative Temperature from in-situ temperature at sea pressure 0 (where θ = t), °C.</summary>
    /// <param name="absoluteSalinity">S_A, g/kg.</param>
    /// <param name="inSituTemperature">In-situ temperature at the sea surface, ITS-90 °C.</param>
    public static double ConservativeFromInSituAtSurface(double absoluteSalinity, double inSituTemperature) =>
        ConservativeFromPotential(absoluteSalinity, inSituTemperature);

    /// <summary>Potential temperature θ (reference pressure 0 dbar) from Conservative Temperature, °C
    /// (<c>gsw_pt_from_CT</c>), by Newton iteration on Θ(S_A, θ) with its exact derivative.</summary>
    /// <param name="absoluteSalinity">S_A, g/kg.</param>
    /// <param name="conservativeTemperature">Θ, °C.</param>
    /// <exception cref="ArithmeticException">No convergence (only for arguments far outside the oceanographic range).</exception>
    public static double PotentialFromConservative(double absoluteSalinity, double conservativeTemperature)
    {
        double pt = conservativeTemperature; // |Θ − θ| < 2 K over the oceanographic range
        for (int iteration = 0; iteration < MaxNewtonIterations; iteration++)
        {
            double residual = ConservativeFromPotential(absoluteSalinity, pt) - conservativeTemperature;
            double step = residual * Cp0 / PotentialEnthalpyTemperatureDerivative(absoluteSalinity, pt);
            pt -= step;
            if (Math.Abs(step) <= NewtonTolerance_K) return pt;
        }
        throw new ArithmeticException(
            $"Potential temperature from Conservative Temperature did not converge for S_A = {absoluteSalinity} g/kg, Θ = {conservativeTemperature} °C.");
    }

    /// <summary>In-situ temperature at sea pressure 0 (equal to θ there) from Conservative Temperature, °C.</summary>
    public static double InSituAtSurfaceFromConservative(double absoluteSalinity, double conservativeTemperature) =>
        PotentialFromConservative(absoluteSalinity, conservativeTemperature);
}
