using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Surface freshwater: evaporation minus precipitation, added freshwater (hosing) and the ice-volume
/// salinity offset:
/// <code>
/// F_b = (P − E)_b + H_b + C_b                          (m³/s into surface box b; H_N, H_S include the symmetric H_vent)
/// (P − E)_W = −[(P − E)_E + (P − E)_N + (P − E)_S]     (the warm pool closes the budget)
/// C_b = −Σ_{a ∈ other region} H_a · A_b / A_region(b)  (compensation in the other region)
/// salt_b += −S0·F_b                                    (virtual salt flux)
/// f_ice = D̄/(D̄ + η)                                    (effective/stored salinity; η sea level, D̄ mean ocean depth)
/// </code>
/// Freshwater is exchanged as a virtual salt flux with a fixed reference salinity S0 (Stommel 1961;
/// Huang 1993 discusses the approximation). The net precipitation is balanced by construction, so with no
/// hosing total salt is conserved exactly. Hosing H_b (constant options plus the schedules of
/// "Model:Forcing:Freshwater") is either compensated — the same volume removed from the other region
/// (freshwater added to a ventilation box is taken from the two tropical boxes, and the other way round),
/// in proportion to area, salt-conserving, the usual way to hose a closed box model — or not, in
/// which case the mean salinity becomes a state variable. Lower sea level (more land ice) concentrates the
/// ocean's salt in less water: by mass balance the mean salinity is S·D̄/(D̄ + η) (≈ +1.1 g/kg for
/// η = −120 m, common practice); the densities of the ventilation process use salinities scaled by f_ice.
/// Disabled: no freshwater fluxes and f_ice = 1.
/// </summary>
public sealed class SurfaceFreshwater : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "SurfaceFreshwater";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<SurfaceFreshwaterOptions>(
        ProcessName,
        "balanced net precipitation, hosing (constant + scheduled, optionally compensated) as virtual salt fluxes, and the ice-volume salinity factor",
        "F_b = (P−E)_b + H_b + C_b;  salt_b += −S0·F_b;  (P−E)_W closes the budget;  f_ice = D̄/(D̄ + η)",
        ["Stommel, H. (1961), Thermohaline convection with two stable regimes of flow, Tellus 13, 224–230",
         "Huang, R. X. (1993), Real freshwater flux as a natural boundary condition for the salinity balance and thermohaline circulation forced by evaporation and precipitation, J. Phys. Oceanogr. 23, 2428–2446"],
        order: 18,
        (o, c) => new SurfaceFreshwater(o, c));

    private readonly HosingCompensation _compensation;
    private readonly int _s0, _depth;
    private readonly int[] _netPrecipitation = new int[Boxes.SurfaceCount], _hosing = new int[Boxes.SurfaceCount],
        _area = new int[Boxes.SurfaceCount], _flux = new int[Boxes.SurfaceCount];
    private readonly int _factor, _hosingVentilation;

    private SurfaceFreshwater(SurfaceFreshwaterOptions o, ProcessBuildContext c)
    {
        _compensation = o.Compensation;
        _s0 = c.ModelParameter("Model:ReferenceSalinity_gkg");
        _depth = c.Parameter(nameof(o.MeanOceanDepth_m));
        for (int i = 0; i < Boxes.SurfaceCount; i++)
        {
            var b = (Box)i;
            _netPrecipitation[i] = b == Box.WarmPool ? -1 : c.Parameter("NetPrecipitation" + Boxes.ConfigName(b) + "_Sv");
            _hosing[i] = c.Parameter("Hosing" + Boxes.ConfigName(b) + "_Sv");
            _area[i] = c.ModelParameter($"Model:Boxes:{Boxes.ConfigName(b)}:Area_m2");
            _flux[i] = c.ProvideDiagnostic(TropicalDiagnostics.Freshwater(b), "Sv", $"net freshwater input into the {Boxes.Label(b)} (P − E, hosing, compensation)", 0.0, 1e-6);
        }
        _hosingVentilation = c.Parameter(nameof(o.HosingVentilationBoxes_Sv));
        _factor = c.ProvideDiagnostic(TropicalDiagnostics.IceVolumeSalinityFactor, "1", "effective/stored salinity from ice volume, D̄/(D̄ + sea level)", 1.0);
        if (c.Enabled && _compensation == HosingCompensation.None) c.DeclareSaltSource();
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T sv = ProcessContext<T>.C(1e6);
        T closing = T.Zero;
        for (int i = 1; i < Boxes.SurfaceCount; i++)
        {
            T pe = c.P(_netPrecipitation[i]) * sv;
            c.Diagnostics[_flux[i]] = pe;
            closing -= pe;
        }
        c.Diagnostics[_flux[0]] = closing;

        T tropicalArea = c.P(_area[(int)Box.WarmPool]) + c.P(_area[(int)Box.ColdTongue]);
        T extratropicalArea = c.P(_area[(int)Box.North]) + c.P(_area[(int)Box.South]);
        T intoTropics = T.Zero, intoExtratropics = T.Zero;
        for (int a = 0; a < Boxes.SurfaceCount; a++)
        {
            var box = (Box)a;
            T hosing = c.P(_hosing[a]) * sv + ProcessContext<T>.C(c.Forcing[ForcingChannel.Freshwater(box)]);
            if (Boxes.IsExtratropicalSurface(box)) hosing += c.P(_hosingVentilation) * sv;
            c.Diagnostics[_flux[a]] += hosing;
            if (Boxes.IsTropicalSurface(box)) intoTropics += hosing;
            else intoExtratropics += hosing;
        }
        if (_compensation == HosingCompensation.OtherRegion)
        {
            for (int b = 0; b < Boxes.SurfaceCount; b++)
            {
                var box = (Box)b;
                c.Diagnostics[_flux[b]] -= Boxes.IsTropicalSurface(box)
                    ? intoExtratropics * c.P(_area[b]) / tropicalArea
                    : intoTropics * c.P(_area[b]) / extratropicalArea;
            }
        }

        T s0 = c.P(_s0);
        for (int i = 0; i < Boxes.SurfaceCount; i++) c.AddSalt((Box)i, -s0 * c.Diagnostics[_flux[i]]);

        T depth = c.P(_depth);
        c.Diagnostics[_factor] = depth / (depth + ProcessContext<T>.C(c.Forcing[ForcingChannel.SeaLevel]));
    }
}

/// <summary>How added freshwater (hosing) is balanced.</summary>
public enum HosingCompensation
{
    /// <summary>Not at all: the ocean freshens and its mean salinity becomes a state variable (no steady state while hosing).</summary>
    None,
    /// <summary>
    /// The same volume is removed from the other region in proportion to area: freshwater added to the ventilation boxes is
    /// taken from the warm pool and cold tongue, and freshwater added to those from the ventilation boxes (salt-conserving).
    /// </summary>
    OtherRegion,
}

/// <summary>Options of <see cref="SurfaceFreshwater"/> ("Model:Processes:SurfaceFreshwater"), fluxes in Sv (10⁶ m³/s), positive into the ocean.</summary>
public sealed class SurfaceFreshwaterOptions : ProcessOptions
{
    /// <summary>P − E over the cold tongue (the warm pool takes minus the sum of the others).</summary>
    [Parameter("Sv", "net precipitation (P − E) over the cold tongue", Source = "common practice (the dry cold tongue has P ≈ E)", Min = -10, Max = 10)]
    public double NetPrecipitationColdTongue_Sv { get; set; }

    /// <summary>P − E over the northern ventilation box.</summary>
    [Parameter("Sv", "net precipitation (P − E) over the northern ventilation box", Source = "common practice (subtropical evaporation excess ≈ 1 m/yr over ≈ 10¹³ m², ≈ −0.3 Sv)", Min = -10, Max = 10)]
    public double NetPrecipitationNorth_Sv { get; set; } = -0.3;

    /// <summary>P − E over the southern ventilation box.</summary>
    [Parameter("Sv", "net precipitation (P − E) over the southern ventilation box", Source = "common practice (subtropical evaporation excess ≈ 1 m/yr over ≈ 10¹³ m², ≈ −0.3 Sv)", Min = -10, Max = 10)]
    public double NetPrecipitationSouth_Sv { get; set; } = -0.3;

    /// <summary>Constant hosing into the warm pool (added to its schedule).</summary>
    [Parameter("Sv", "constant added freshwater into the warm pool", Source = "common practice (no hosing by default)", Min = -10, Max = 10)]
    public double HosingWarmPool_Sv { get; set; }

    /// <summary>Constant hosing into the cold tongue.</summary>
    [Parameter("Sv", "constant added freshwater into the cold tongue", Source = "common practice (no hosing by default)", Min = -10, Max = 10)]
    public double HosingColdTongue_Sv { get; set; }

    /// <summary>Constant hosing into the northern ventilation box.</summary>
    [Parameter("Sv", "constant added freshwater into the northern ventilation box", Source = "common practice (no hosing by default)", Min = -10, Max = 10)]
    public double HosingNorth_Sv { get; set; }

    /// <summary>Constant hosing into the southern ventilation box.</summary>
    [Parameter("Sv", "constant added freshwater into the southern ventilation box", Source = "common practice (no hosing by default)", Min = -10, Max = 10)]
    public double HosingSouth_Sv { get; set; }

    /// <summary>Constant hosing into each of the two ventilation boxes (a symmetric freshening; adds to HosingNorth_Sv and HosingSouth_Sv).</summary>
    [Parameter("Sv", "constant added freshwater into each ventilation box (north and south alike)", Source = "common practice (no hosing by default)", Min = -10, Max = 10)]
    public double HosingVentilationBoxes_Sv { get; set; }

    /// <summary>How hosing is balanced.</summary>
    [Parameter("", "balance of added freshwater: None | OtherRegion")]
    public HosingCompensation Compensation { get; set; } = HosingCompensation.OtherRegion;

    /// <summary>D̄: global mean ocean depth for the ice-volume salinity factor.</summary>
    [Parameter("m", "global mean ocean depth for the sea-level salinity offset (D̄)", Source = "common practice (≈ 3.7 km; 35 g/kg × 120 m / 3700 m ≈ 1.1 g/kg at the glacial maximum)", Min = 100, Max = 11000)]
    public double MeanOceanDepth_m { get; set; } = 3700.0;
}
