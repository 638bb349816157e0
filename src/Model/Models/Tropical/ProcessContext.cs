using System.Numerics;
using System.Runtime.CompilerServices;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// Everything a process sees at one instant: the box temperatures and salinities, the box geometry,
/// the parameters, the forcing, the diagnostics written so far, and the accumulators its fluxes go
/// into. Units: temperatures °C, salinities g/kg, volumes m³, areas m², heat in W, salt in
/// (g/kg)·m³/s, rates of process-owned state variables in their unit per year.
/// </summary>
/// <remarks>
/// Heat and salt move between boxes only through the Transfer methods and <see cref="Exchange"/>
/// (each takes from one box exactly what it gives to another), and enter or leave the ocean only through
/// <see cref="AddSurfaceHeatFlux"/> and <see cref="AddSalt"/>: the model's conservation properties follow
/// from that.
/// </remarks>
public ref struct ProcessContext<T> where T : struct, IFloatingPointIeee754<T>
{
    /// <summary>Model time in years since the start of the run (time_yr).</summary>
    public double Time;

    /// <summary>The same instant in years relative to 1950 CE (negative = past).</summary>
    public double YearsSince1950;

    /// <summary>Temperature of each box (°C), indexed by <see cref="Box"/>.</summary>
    public ReadOnlySpan<T> Temperature;

    /// <summary>Salinity of each box (g/kg), indexed by <see cref="Box"/>; the deep box's is diagnosed from total salt.</summary>
    public ReadOnlySpan<T> Salinity;

    /// <summary>Volume of each box (m³).</summary>
    public ReadOnlySpan<T> Volume;

    /// <summary>Horizontal area of each box (m²).</summary>
    public ReadOnlySpan<T> Area;

    /// <summary>The raw state vector (for state variables a process owns).</summary>
    public ReadOnlySpan<T> State;

    /// <summary>All parameters, indexed as the build context handed out.</summary>
    public ReadOnlySpan<T> Parameters;

    /// <summary>Forcing values at this instant, indexed by <see cref="Forcing.ForcingChannel"/>.</summary>
    public ReadOnlySpan<double> Forcing;

    /// <summary>Diagnostic slots (read those of earlier processes, write your own).</summary>
    public Span<T> Diagnostics;

    /// <summary>Heat flux into each box (W).</summary>
    public Span<T> Heat;

    /// <summary>Salt flux into each box ((g/kg)·m³/s).</summary>
    public Span<T> Salt;

    /// <summary>Rates of the raw state vector (per year); write only the entries of state variables you own.</summary>
    public Span<T> Rates;

    /// <summary>Volumetric heat capacity ρ0·c_p (J m⁻³ K⁻¹).</summary>
    public T RhoCp;

    /// <summary>Index of the first net-surface-heat-flux diagnostic (one per surface box, in box order).</summary>
    internal int NetSurfaceFluxSlot;

    /// <summary>Temperature of <paramref name="b"/> (°C).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public readonly T TemperatureOf(Box b) => Temperature[(int)b];

    /// <summary>Salinity of <paramref name="b"/> (g/kg).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public readonly T SalinityOf(Box b) => Salinity[(int)b];

    /// <summary>Parameter <paramref name="index"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public readonly T P(int index) => Parameters[index];

    /// <summary>A surface heat flux into box <paramref name="b"/> (W/m², positive downward into the ocean), added to the box's heat budget and to its net-surface-flux diagnostic.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public readonly void AddSurfaceHeatFlux(Box b, T flux_Wm2)
    {
        int i = (int)b;
        Heat[i] += flux_Wm2 * Area[i];
        Diagnostics[NetSurfaceFluxSlot + i] += flux_Wm2;
    }

    /// <summary>A salt flux into box <paramref name="b"/> ((g/kg)·m³/s), e.g. the virtual salt flux −S0·F of a freshwater input F (m³/s).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public readonly void AddSalt(Box b, T flux) => Salt[(int)b] += flux;

    /// <summary>
    /// A volume flux <paramref name="q_m3s"/> (m³/s, ≥ 0) from box <paramref name="from"/> to box <paramref name="to"/>
    /// carrying water of temperature <paramref name="temperature"/> (°C) and salinity <paramref name="salinity"/> (g/kg):
    /// what leaves one box enters the other.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public readonly void Transfer(Box from, Box to, T q_m3s, T temperature, T salinity)
    {
        T h = RhoCp * q_m3s * temperature;
        T s = q_m3s * salinity;
        Heat[(int)from] -= h;
        Heat[(int)to] += h;
        Salt[(int)from] -= s;
        Salt[(int)to] += s;
    }

    /// <summary>A volume flux from <paramref name="from"/> to <paramref name="to"/> carrying the source box's own temperature and salinity.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public readonly void Transfer(Box from, Box to, T q_m3s) =>
        Transfer(from, to, q_m3s, Temperature[(int)from], Salinity[(int)from]);

    /// <summary>Two-way exchange (mixing) of <paramref name="k_m3s"/> (m³/s) between two boxes: equal and opposite volume fluxes.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public readonly void Exchange(Box a, Box b, T k_m3s)
    {
        int i = (int)a, j = (int)b;
        T h = RhoCp * k_m3s * (Temperature[j] - Temperature[i]);
        T s = k_m3s * (Salinity[j] - Salinity[i]);
        Heat[i] += h;
        Heat[j] -= h;
        Salt[i] += s;
        Salt[j] -= s;
    }

    /// <summary>A double constant as <typeparamref name="T"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static T C(double x) => T.CreateTruncating(x);
}
