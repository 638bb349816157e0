using System.Numerics;

namespace Thermostrat.Model.Seawater;

/// <summary>
/// EOS-80 (<see cref="Eos80"/>) seen through the box model's variables.
/// </summary>
/// <remarks>
/// <para>Mapping: the salinity argument (g/kg, Absolute Salinity) becomes practical salinity
/// S_P = S_A · 35/35.16504 (the reference-composition ratio of TEOS-10, no salinity anomaly; see
/// <see cref="SalinityConversions"/>); the temperature argument is treated as the in-situ ITS-90
/// temperature and converted to IPTS-68 by t68 = 1.00024 t90; pressure passes through (dbar).
/// α and β are the native coefficients times dt68/dt90 = 1.00024 and dS_P/dS_A = 35/35.16504,
/// so they are derivatives with respect to the box model's variables.</para>
/// <para>The approximation: the box model's temperature is Conservative Temperature under TEOS-10
/// but is fed to EOS-80 as if it were in-situ temperature. At the surface, where in-situ and
/// potential temperature coincide, Θ − θ reaches 0.28 K for S_A ≥ 30 g/kg and 1.75 K in warm fresh
/// water (python3-gsw 3.6.16, S_A 0–40 g/kg, θ 0–35 °C), so this equation of state and the
/// TEOS-10 one differ by up to about 0.1 kg/m³ at oceanic salinities and 0.6 kg/m³ in warm fresh
/// water, although the two standards themselves agree to 0.006 kg/m³ once the temperature is
/// converted properly (<see cref="TemperatureConversions.PotentialFromConservative"/>, then
/// <see cref="Eos80.DensityFromT90{T}"/>). At depth the adiabatic difference between in-situ and
/// potential temperature (a few tenths of a kelvin at 4000 dbar) is also ignored.</para>
/// </remarks>
public sealed class Eos80EquationOfState : IEquationOfState
{
    private const double PracticalPerAbsolute = SalinityConversions.PracticalPerAbsolute;

    /// <inheritdoc />
    public string Name => "eos80";

    /// <inheritdoc />
    public T Density<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T> =>
        Eos80.Density(C<T>(PracticalPerAbsolute) * salinity, C<T>(Eos80.T68PerT90) * temperature, pressure);

    /// <inheritdoc />
    public T ThermalExpansion<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(Eos80.T68PerT90) * Eos80.ThermalExpansion(C<T>(PracticalPerAbsolute) * salinity, C<T>(Eos80.T68PerT90) * temperature, pressure);

    /// <inheritdoc />
    public T HalineContraction<T>(T salinity, T temperature, T pressure) where T : struct, IFloatingPointIeee754<T> =>
        C<T>(PracticalPerAbsolute) * Eos80.HalineContraction(C<T>(PracticalPerAbsolute) * salinity, C<T>(Eos80.T68PerT90) * temperature, pressure);

    private static T C<T>(double value) where T : struct, IFloatingPointIeee754<T> => T.CreateTruncating(value);
}
