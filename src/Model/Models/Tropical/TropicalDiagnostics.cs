namespace Thermostrat.Model.Models.Tropical;

/// <summary>
/// Names of the diagnostics the built-in processes provide (also output column names). Internal values
/// are SI; transports are stored in m³/s and reported in Sv.
/// </summary>
public static class TropicalDiagnostics
{
    /// <summary>Equatorial easterly wind stress τ (N/m²).</summary>
    public const string WindStress = "wind_stress_nm2";
    /// <summary>Poleward Ekman transport out of the equatorial band, per hemisphere (m³/s; reported in Sv).</summary>
    public const string EkmanTransport = "ekman_transport_per_hemisphere_sv";
    /// <summary>Temperature of the water upwelled into the cold tongue (°C).</summary>
    public const string UpwelledTemperature = "upwelled_temperature_degc";
    /// <summary>Subduction from the northern ventilation box into the thermocline (m³/s; reported in Sv).</summary>
    public const string VentilationNorth = "ventilation_north_sv";
    /// <summary>Subduction from the southern ventilation box (m³/s; reported in Sv).</summary>
    public const string VentilationSouth = "ventilation_south_sv";
    /// <summary>Equatorial upwelling into the cold tongue, ψN + ψS (m³/s; reported in Sv).</summary>
    public const string Upwelling = "upwelling_sv";
    /// <summary>Zonal-mean equatorial thermocline depth (m).</summary>
    public const string ThermoclineMean = "thermocline_depth_mean_m";
    /// <summary>Thermocline depth under the cold tongue, h_E (m).</summary>
    public const string ThermoclineEast = "thermocline_depth_east_m";
    /// <summary>Thermocline depth under the warm pool, h_W (m).</summary>
    public const string ThermoclineWest = "thermocline_depth_west_m";
    /// <summary>East–west thermocline tilt h_W − h_E (m).</summary>
    public const string ThermoclineTilt = "thermocline_tilt_m";
    /// <summary>Thermocline depth from the thermocline box's heat content alone (m).</summary>
    public const string ThermoclineHeatContentDepth = "thermocline_depth_heat_content_m";
    /// <summary>Wind-driven recharge/discharge anomaly of the equatorial thermocline depth (m).</summary>
    public const string WarmWaterAnomaly = "warm_water_depth_anomaly_m";
    /// <summary>Ratio of effective to stored salinity from ice volume (sea level), 1 at present sea level.</summary>
    public const string IceVolumeSalinityFactor = "ice_volume_salinity_factor";
    /// <summary>CO2 radiative forcing 5.35 ln(C/C0) (W/m²).</summary>
    public const string Co2Forcing = "co2_radiative_forcing_wm2";

    /// <summary>Low-cloud fraction over a surface box.</summary>
    public static string LowCloudFraction(Box b) => $"low_cloud_fraction_{Boxes.ColumnName(b)}";
    /// <summary>Fraction of shortwave reflected by low cloud over a surface box, α_c·c.</summary>
    public static string CloudReflectance(Box b) => $"low_cloud_reflectance_{Boxes.ColumnName(b)}";
    /// <summary>Lower-tropospheric stability estimate over a surface box (K).</summary>
    public static string Stability(Box b) => $"lower_tropospheric_stability_{Boxes.ColumnName(b)}_k";
    /// <summary>Shortwave absorbed at the surface (W/m²).</summary>
    public static string Shortwave(Box b) => $"shortwave_absorbed_{Boxes.ColumnName(b)}_wm2";
    /// <summary>Longwave and turbulent heat loss at the surface (W/m², positive upward).</summary>
    public static string LongwaveTurbulent(Box b) => $"longwave_turbulent_loss_{Boxes.ColumnName(b)}_wm2";
    /// <summary>Heat exported poleward by the atmosphere from above a surface box (W/m², positive = ocean loses heat).</summary>
    public static string AtmosphericExport(Box b) => $"atmospheric_heat_export_{Boxes.ColumnName(b)}_wm2";
    /// <summary>Net surface heat flux into a surface box (W/m², positive downward).</summary>
    public static string NetSurfaceHeatFlux(Box b) => $"net_surface_heat_flux_{Boxes.ColumnName(b)}_wm2";
    /// <summary>Net freshwater input into a surface box (m³/s; reported in Sv): precipitation − evaporation, hosing and its compensation.</summary>
    public static string Freshwater(Box b) => $"freshwater_input_{Boxes.ColumnName(b)}_sv";
    /// <summary>Density contrast between a ventilation box and the warm pool at the reference pressure (kg/m³).</summary>
    public static string DensityContrast(Box b) => $"density_contrast_{Boxes.ColumnName(b)}_kgm3";
}
