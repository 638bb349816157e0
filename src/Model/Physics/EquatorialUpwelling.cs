using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Equatorial Ekman divergence and the temperature of the upwelled water:
/// <code>
/// M = L·τ⁺ / (ρ0·f),  f = 2Ω sin φ_E,  τ⁺ = Ramp(τ)          (poleward Ekman transport per hemisphere, m³/s)
/// T_up = T_c + (T_h − T_c)/2 · [1 + tanh((h_E − z_up)/h*)]     (°C)
/// </code>
/// The easterlies drive a poleward Ekman transport M out of each side of the equatorial band (Ekman 1905;
/// Gill 1982 §9.2); it sets the strength of the shallow overturning cells, of which the ventilation process
/// subducts the part dense enough to pass beneath the equatorial surface water. Water upwelled into the cold
/// tongue is drawn from depth z_up: warm when the thermocline h_E lies below it, cold when above, with the
/// tanh profile of the Zebiak–Cane subsurface-temperature parameterization (Zebiak and Cane 1987) in the form
/// of Jin (1997). T_h and T_c are the warm-layer and sub-thermocline temperatures of the thermocline process.
/// τ⁺ is a smooth ramp of τ (width 0.001 N/m²): westerly stress does not run the cells backwards.
/// Disabled: M = 0 (no overturning) and T_up = T_c.
/// </summary>
public sealed class EquatorialUpwelling : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "EquatorialUpwelling";

    /// <summary>Earth's rotation rate Ω (rad/s), sidereal (IERS Conventions 2010).</summary>
    public const double EarthRotation_rad_s = 7.292115e-5;

    /// <summary>Width of the smooth ramp that keeps the Ekman transport non-negative (N/m²).</summary>
    private const double StressRampWidth_Nm2 = 1e-3;

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<EquatorialUpwellingOptions>(
        ProcessName,
        "Ekman divergence out of the equatorial band, and the upwelled temperature from the eastern thermocline depth (tanh profile)",
        "M = L·τ⁺/(ρ0·2Ω sin φ_E);  T_up = T_c + (T_h − T_c)/2·[1 + tanh((h_E − z_up)/h*)]",
        ["Ekman, V. W. (1905), On the influence of the earth's rotation on ocean-currents, Ark. Mat. Astron. Fys. 2(11), 1–52",
         "Gill, A. E. (1982), Atmosphere–Ocean Dynamics, Academic Press, §9.2",
         "Zebiak, S. E., and M. A. Cane (1987), A model El Niño–Southern Oscillation, Mon. Wea. Rev. 115, 2262–2278",
         "Jin, F.-F. (1997), An equatorial ocean recharge paradigm for ENSO. Part I, J. Atmos. Sci. 54, 811–829"],
        order: 40,
        (o, c) => new EquatorialUpwelling(o, c));

    private readonly int _lat, _extent, _zup, _sharpness, _rho0, _warm, _cold;
    private readonly int _tau, _hE, _ekman, _tup;

    private EquatorialUpwelling(EquatorialUpwellingOptions o, ProcessBuildContext c)
    {
        _lat = c.Parameter(nameof(o.EkmanLatitude_deg));
        _extent = c.Parameter(nameof(o.ZonalExtent_m));
        _zup = c.Parameter(nameof(o.SourceDepth_m));
        _sharpness = c.Parameter(nameof(o.ProfileSharpness_m));
        _rho0 = c.ModelParameter("Model:ReferenceDensity_kgm3");
        _warm = c.ModelParameter($"Model:Processes:{ThermoclineDepth.ProcessName}:WarmLayerTemperature_degC");
        _cold = c.ModelParameter($"Model:Processes:{ThermoclineDepth.ProcessName}:SubThermoclineTemperature_degC");
        _tau = c.Diagnostic(TropicalDiagnostics.WindStress);
        _hE = c.Diagnostic(TropicalDiagnostics.ThermoclineEast);
        var thermocline = c.Model.Processes.TryGetValue(ThermoclineDepth.ProcessName, out var t) ? t as ThermoclineDepthOptions : null;
        _ekman = c.ProvideDiagnostic(TropicalDiagnostics.EkmanTransport, "Sv", "poleward Ekman transport out of the equatorial band, per hemisphere", 0.0, 1e-6);
        _tup = c.ProvideDiagnostic(TropicalDiagnostics.UpwelledTemperature, "degC", "temperature of the water upwelled into the cold tongue",
            thermocline?.SubThermoclineTemperature_degC ?? 12.0);
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T two = ProcessContext<T>.C(2.0), half = ProcessContext<T>.C(0.5);
        T coriolis = two * ProcessContext<T>.C(EarthRotation_rad_s) * T.Sin(c.P(_lat) * ProcessContext<T>.C(Math.PI / 180.0));
        T easterly = SmoothFunctions.Ramp(c.Diagnostics[_tau], ProcessContext<T>.C(StressRampWidth_Nm2));
        c.Diagnostics[_ekman] = c.P(_extent) * easterly / (c.P(_rho0) * coriolis);

        T warmLayer = c.P(_warm), subThermocline = c.P(_cold);
        T depthBelowSource = (c.Diagnostics[_hE] - c.P(_zup)) / c.P(_sharpness);
        c.Diagnostics[_tup] = subThermocline + (warmLayer - subThermocline) * half * (T.One + T.Tanh(depthBelowSource));
    }
}

/// <summary>Options of <see cref="EquatorialUpwelling"/> ("Model:Processes:EquatorialUpwelling").</summary>
public sealed class EquatorialUpwellingOptions : ProcessOptions
{
    /// <summary>Latitude φ_E at which the poleward Ekman transport leaves the equatorial band.</summary>
    [Parameter("deg", "latitude at which the poleward Ekman transport is evaluated (edge of the upwelling band)", Source = "common practice (equatorial upwelling band ±5–10°)", Min = 1, Max = 30)]
    public double EkmanLatitude_deg { get; set; } = 8.0;

    /// <summary>Zonal extent L over which the easterlies drive the divergence.</summary>
    [Parameter("m", "zonal extent of the equatorial easterlies driving the divergence", Source = "idealized basin of our own (≈ 135° of longitude at the equator)", Min = 0, MinExclusive = true, Max = 4e7)]
    public double ZonalExtent_m { get; set; } = 1.5e7;

    /// <summary>Depth z_up from which the upwelled water is drawn.</summary>
    [Parameter("m", "depth from which the upwelled water is drawn (z_up)", Source = "common practice (base of the cold-tongue surface layer; Jin 1997 uses 75 m)", Min = 0, Max = 500)]
    public double SourceDepth_m { get; set; } = 75.0;

    /// <summary>Vertical scale h* of the tanh thermocline profile.</summary>
    [Parameter("m", "vertical scale h* of the tanh temperature profile across the thermocline", Source = "tuned: 20 °C isotherm 40–60 m below the 26 °C isotherm in the east (common practice); Jin 1997 uses 50 m", Min = 1, Max = 500)]
    public double ProfileSharpness_m { get; set; } = 40.0;
}
