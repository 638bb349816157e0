using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Equatorial thermocline depth from the heat content of the thermocline box, tilted by the wind:
/// <code>
/// h̄ = z_top + H_U · Clamp((T_U − T_c)/(T_h − T_c), 0, 1)     (heat-content depth, m)
/// Δh = τ·L / (ρ0·g′·H_ref)                                 (east–west tilt, m)
/// h_E = h̄ + w − Δh/2,   h_W = h̄ + w + Δh/2
/// </code>
/// The thermocline box (top z_top, thickness H_U) is read as a two-layer column: warm water of temperature
/// T_h above the thermocline and water of T_c below, so its mean temperature T_U fixes the depth h̄ of the
/// interface (the warm-water volume is A_U·(h̄ − z_top)). The depth therefore follows from the heat budget of
/// the thermocline box, not from a rule: it deepens when the box gains heat. The tilt balances the zonal
/// wind stress against the zonal pressure gradient of a reduced-gravity layer of depth H_ref
/// (g′ ∂h/∂x = τ/(ρ0 H); Gill 1982 §11; the instantaneous-tilt form of Jin 1997). w is the wind-driven
/// recharge anomaly of the recharge process (0 when it is disabled). The clamp is smooth (width 0.02).
/// Disabled: h̄ = h_E = h_W = z_top + H_U/2 and no tilt.
/// </summary>
public sealed class ThermoclineDepth : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "ThermoclineDepth";

    private const double ClampWidth = 0.02;

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<ThermoclineDepthOptions>(
        ProcessName,
        "equatorial thermocline depth from the thermocline box's heat content (two-layer reading), tilted east–west by the wind stress",
        "h̄ = z_top + H_U·clamp((T_U − T_c)/(T_h − T_c), 0, 1);  Δh = τL/(ρ0 g′ H_ref);  h_E = h̄ + w − Δh/2;  h_W = h̄ + w + Δh/2",
        ["Gill, A. E. (1982), Atmosphere–Ocean Dynamics, Academic Press, §11",
         "Jin, F.-F. (1997), An equatorial ocean recharge paradigm for ENSO. Part I, J. Atmos. Sci. 54, 811–829",
         "Boccaletti, G., R. C. Pacanowski, S. G. H. Philander and A. V. Fedorov (2004), The thermal structure of the upper ocean, J. Phys. Oceanogr. 34, 888–902"],
        order: 30,
        (o, c) => new ThermoclineDepth(o, c));

    private readonly int _ztop, _warm, _cold, _fetch, _gPrime, _href, _rho0, _thickU;
    private readonly int _tau, _w, _hHeat, _hMean, _hE, _hW, _tilt;

    private ThermoclineDepth(ThermoclineDepthOptions o, ProcessBuildContext c)
    {
        _ztop = c.Parameter(nameof(o.TopDepth_m));
        _warm = c.Parameter(nameof(o.WarmLayerTemperature_degC));
        _cold = c.Parameter(nameof(o.SubThermoclineTemperature_degC));
        _fetch = c.Parameter(nameof(o.ZonalFetch_m));
        _gPrime = c.Parameter(nameof(o.ReducedGravity_ms2));
        _href = c.Parameter(nameof(o.LayerDepth_m));
        _rho0 = c.ModelParameter("Model:ReferenceDensity_kgm3");
        _thickU = c.ModelParameter("Model:Boxes:Thermocline:Thickness_m");
        _tau = c.Diagnostic(TropicalDiagnostics.WindStress);
        _w = c.Diagnostic(TropicalDiagnostics.WarmWaterAnomaly);
        double middle = o.TopDepth_m + 0.5 * c.Model.Boxes.Thermocline.Thickness_m;
        _hHeat = c.ProvideDiagnostic(TropicalDiagnostics.ThermoclineHeatContentDepth, "m", "thermocline depth read from the thermocline box's heat content", middle);
        _hMean = c.ProvideDiagnostic(TropicalDiagnostics.ThermoclineMean, "m", "zonal-mean equatorial thermocline depth h̄ + w", middle);
        _hE = c.ProvideDiagnostic(TropicalDiagnostics.ThermoclineEast, "m", "thermocline depth under the cold tongue h_E", middle);
        _hW = c.ProvideDiagnostic(TropicalDiagnostics.ThermoclineWest, "m", "thermocline depth under the warm pool h_W", middle);
        _tilt = c.ProvideDiagnostic(TropicalDiagnostics.ThermoclineTilt, "m", "east–west thermocline tilt h_W − h_E", 0.0);
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T warmLayer = c.P(_warm), subThermocline = c.P(_cold);
        T warmFraction = (c.TemperatureOf(Box.Thermocline) - subThermocline) / (warmLayer - subThermocline);
        T heatContentDepth = c.P(_ztop) + c.P(_thickU) * SmoothFunctions.Clamp(warmFraction, T.Zero, T.One, ProcessContext<T>.C(ClampWidth));
        T meanDepth = heatContentDepth + c.Diagnostics[_w];
        T tilt = c.Diagnostics[_tau] * c.P(_fetch) / (c.P(_rho0) * c.P(_gPrime) * c.P(_href));
        T half = ProcessContext<T>.C(0.5);
        c.Diagnostics[_hHeat] = heatContentDepth;
        c.Diagnostics[_hMean] = meanDepth;
        c.Diagnostics[_tilt] = tilt;
        c.Diagnostics[_hE] = meanDepth - half * tilt;
        c.Diagnostics[_hW] = meanDepth + half * tilt;
    }
}

/// <summary>Options of <see cref="ThermoclineDepth"/> ("Model:Processes:ThermoclineDepth").</summary>
public sealed class ThermoclineDepthOptions : ProcessOptions
{
    /// <summary>Depth z_top of the top of the thermocline box (the base of the surface boxes).</summary>
    [Parameter("m", "depth of the top of the thermocline box (z_top)", Source = "idealized basin of our own (equals the equatorial surface-box thickness)", Min = 0, Max = 1000)]
    public double TopDepth_m { get; set; } = 75.0;

    /// <summary>Temperature T_h of the warm water above the thermocline.</summary>
    [Parameter("degC", "temperature of the warm layer above the thermocline (T_h)", Source = "common practice (tropical Pacific upper layer 26–29 °C; the 20 °C isotherm marks the thermocline)", Min = -2, Max = 40)]
    public double WarmLayerTemperature_degC { get; set; } = 28.0;

    /// <summary>Temperature T_c of the water below the thermocline.</summary>
    [Parameter("degC", "temperature of the water below the thermocline (T_c)", Source = "common practice (≈ 12 °C at 300 m in the tropical Pacific; T_h and T_c centre the tanh profile on 20 °C)", Min = -2, Max = 40)]
    public double SubThermoclineTemperature_degC { get; set; } = 12.0;

    /// <summary>Zonal fetch L of the wind stress for the tilt.</summary>
    [Parameter("m", "zonal fetch of the wind stress setting the tilt", Source = "idealized basin of our own (≈ 135° of longitude at the equator)", Min = 0, MinExclusive = true, Max = 4e7)]
    public double ZonalFetch_m { get; set; } = 1.5e7;

    /// <summary>Reduced gravity g′ = g Δρ/ρ0 across the thermocline.</summary>
    [Parameter("m s-2", "reduced gravity across the thermocline (g′)", Source = "tuned: tilt ≈ 150 m at τ ≈ 0.05 N m-2 (common practice: g′ ≈ 0.02–0.05 m s-2)", Min = 0, MinExclusive = true, Max = 1)]
    public double ReducedGravity_ms2 { get; set; } = 0.03;

    /// <summary>Reference upper-layer depth H_ref in the momentum balance.</summary>
    [Parameter("m", "reference upper-layer depth in the zonal momentum balance (H_ref)", Source = "common practice (mean equatorial thermocline depth ≈ 150 m)", Min = 1, Max = 2000)]
    public double LayerDepth_m { get; set; } = 150.0;
}
