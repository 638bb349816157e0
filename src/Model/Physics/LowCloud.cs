using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Low stratiform cloud over cold water, rising with lower-tropospheric stability:
/// <code>
/// LTS_b = (T_W + Γ_g) − T_b                       (K; free troposphere set by the warm pool, WTG)
/// c_b = Clamp(a_g + s_g·LTS_b, c_min,g, c_max,g)   (low-cloud fraction)
/// r_b = α_c,g·c_b                                  (fraction of shortwave reflected by low cloud)
/// </code>
/// for each surface box b, with group g = tropical (warm pool, cold tongue) or extratropical (ventilation
/// boxes). Under the weak-temperature-gradient approximation the free-tropospheric temperature is tied to
/// the convecting warm pool (Sobel, Nilsson and Polvani 2001), so the stability over a box is a fixed offset
/// Γ above the warm-pool SST minus the local SST. The tropical slope and intercept are the Klein and
/// Hartmann (1993) fit (5.7 % per K of θ700 − θ_surface); the extratropical defaults use the Wood and
/// Bretherton (2006) slope and intercept (4.5 % per K, 0.17), with Γ_x chosen so the stability stands in for
/// their estimated inversion strength. Colder water → more cloud → less sunlight → colder water: a positive
/// feedback. The clamp is smooth (width set by SmoothingWidth).
/// Disabled: no low cloud (c = r = 0).
/// </summary>
public sealed class LowCloud : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "LowCloud";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<LowCloudOptions>(
        ProcessName,
        "low stratiform cloud fraction rising with lower-tropospheric stability (free troposphere tied to the warm pool), and its shortwave reflectance",
        "LTS_b = T_W + Γ_g − T_b;  c_b = clamp(a_g + s_g·LTS_b, c_min, c_max);  r_b = α_c,g·c_b",
        ["Klein, S. A., and D. L. Hartmann (1993), The seasonal cycle of low stratiform clouds, J. Climate 6, 1587–1606",
         "Wood, R., and C. S. Bretherton (2006), On the relationship between stratiform low cloud cover and lower-tropospheric stability, J. Climate 19, 6425–6432",
         "Sobel, A. H., J. Nilsson and L. M. Polvani (2001), The weak temperature gradient approximation and balanced tropical moisture waves, J. Atmos. Sci. 58, 3650–3665"],
        order: 15,
        (o, c) => new LowCloud(o, c));

    private readonly int _width;
    private readonly int[] _offset = new int[Boxes.SurfaceCount], _slope = new int[Boxes.SurfaceCount], _intercept = new int[Boxes.SurfaceCount],
        _albedo = new int[Boxes.SurfaceCount], _min = new int[Boxes.SurfaceCount], _max = new int[Boxes.SurfaceCount];
    private readonly int[] _fraction = new int[Boxes.SurfaceCount], _reflectance = new int[Boxes.SurfaceCount], _stability = new int[Boxes.SurfaceCount];

    private LowCloud(LowCloudOptions o, ProcessBuildContext c)
    {
        _width = c.Parameter(nameof(o.SmoothingWidth));
        foreach (var b in Boxes.Surface)
        {
            int i = (int)b;
            string g = Boxes.IsTropicalSurface(b) ? nameof(o.Tropical) : nameof(o.Extratropical);
            _offset[i] = c.Parameter(g + ":" + nameof(CloudRegimeOptions.FreeTroposphereOffset_K));
            _slope[i] = c.Parameter(g + ":" + nameof(CloudRegimeOptions.Slope_perK));
            _intercept[i] = c.Parameter(g + ":" + nameof(CloudRegimeOptions.Intercept));
            _albedo[i] = c.Parameter(g + ":" + nameof(CloudRegimeOptions.CloudAlbedo));
            _min[i] = c.Parameter(g + ":" + nameof(CloudRegimeOptions.MinFraction));
            _max[i] = c.Parameter(g + ":" + nameof(CloudRegimeOptions.MaxFraction));
            string label = Boxes.Label(b);
            _fraction[i] = c.ProvideDiagnostic(TropicalDiagnostics.LowCloudFraction(b), "1", $"low-cloud fraction over the {label}", 0.0);
            _reflectance[i] = c.ProvideDiagnostic(TropicalDiagnostics.CloudReflectance(b), "1", $"fraction of shortwave reflected by low cloud over the {label} (α_c·c)", 0.0);
            _stability[i] = c.ProvideDiagnostic(TropicalDiagnostics.Stability(b), "K", $"lower-tropospheric stability estimate over the {label}", 0.0);
        }
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T warmPool = c.TemperatureOf(Box.WarmPool), width = c.P(_width);
        for (int i = 0; i < Boxes.SurfaceCount; i++)
        {
            T stability = warmPool + c.P(_offset[i]) - c.Temperature[i];
            T fraction = SmoothFunctions.Clamp(c.P(_intercept[i]) + c.P(_slope[i]) * stability, c.P(_min[i]), c.P(_max[i]), width);
            c.Diagnostics[_stability[i]] = stability;
            c.Diagnostics[_fraction[i]] = fraction;
            c.Diagnostics[_reflectance[i]] = c.P(_albedo[i]) * fraction;
        }
    }
}

/// <summary>Options of <see cref="LowCloud"/> ("Model:Processes:LowCloud").</summary>
public sealed class LowCloudOptions : ProcessOptions
{
    /// <summary>Equatorial boxes (warm pool, cold tongue).</summary>
    public CloudRegimeOptions Tropical { get; set; } = new()
    {
        FreeTroposphereOffset_K = 12.95, Slope_perK = 0.057, Intercept = -0.5573, CloudAlbedo = 0.45, MinFraction = 0.0, MaxFraction = 0.9,
        OffsetSource = "tuned: cold-tongue low-cloud fraction 0.45 in the default equilibrium (θ700 − SST_warm pool ≈ 10–14 K, common practice)",
        SlopeSource = "Klein and Hartmann (1993), J. Climate 6, 1587: 5.7 % per K (from memory)",
        InterceptSource = "Klein and Hartmann (1993), J. Climate 6, 1587: −55.73 % (from memory)",
    };

    /// <summary>Ventilation (extratropical) boxes.</summary>
    public CloudRegimeOptions Extratropical { get; set; } = new()
    {
        FreeTroposphereOffset_K = -5.5, Slope_perK = 0.045, Intercept = 0.17, CloudAlbedo = 0.45, MinFraction = 0.0, MaxFraction = 0.9,
        OffsetSource = "tuned: ventilation-box low-cloud fraction ≈ 0.44 in the default equilibrium",
        SlopeSource = "Wood and Bretherton (2006), J. Climate 19, 6425: 4.5 % per K of EIS (from memory)",
        InterceptSource = "Wood and Bretherton (2006), J. Climate 19, 6425: 0.17 (from memory)",
    };

    /// <summary>Width of the smooth clamp (cloud-fraction units).</summary>
    [Parameter("1", "width of the smooth clamp of the cloud fraction", Source = "common practice (keeps the Jacobian smooth)", Min = 1e-4, Max = 0.2)]
    public double SmoothingWidth { get; set; } = 0.02;
}

/// <summary>One cloud regime's stability law and cloud albedo ("Model:Processes:LowCloud:Tropical" or ":Extratropical").</summary>
public sealed class CloudRegimeOptions : IParameterSources, ISelfValidating
{
    /// <summary>Γ: free-tropospheric (θ700-like) temperature minus the warm-pool SST.</summary>
    [Parameter("K", "free-tropospheric temperature minus warm-pool SST (Γ)", Source = "tuned (see the regime's defaults)", Min = -50, Max = 50)]
    public double FreeTroposphereOffset_K { get; set; }

    /// <summary>s: cloud fraction per kelvin of stability.</summary>
    [Parameter("K-1", "low-cloud fraction per kelvin of lower-tropospheric stability (s)", Source = "Klein and Hartmann (1993) / Wood and Bretherton (2006)", Min = 0, Max = 1)]
    public double Slope_perK { get; set; }

    /// <summary>a: cloud fraction at zero stability (extrapolated).</summary>
    [Parameter("1", "low-cloud fraction at zero stability, extrapolated (a)", Source = "Klein and Hartmann (1993) / Wood and Bretherton (2006)", Min = -5, Max = 1)]
    public double Intercept { get; set; }

    /// <summary>α_c: albedo of the low cloud (fraction of incident shortwave a full cover reflects).</summary>
    [Parameter("1", "albedo of the low cloud (α_c)", Source = "common practice (marine stratocumulus albedo 0.3–0.6)", Min = 0, Max = 1)]
    public double CloudAlbedo { get; set; }

    /// <summary>Lower bound of the cloud fraction.</summary>
    [Parameter("1", "lower bound of the low-cloud fraction", Source = "common practice", Min = 0, Max = 1)]
    public double MinFraction { get; set; }

    /// <summary>Upper bound of the cloud fraction.</summary>
    [Parameter("1", "upper bound of the low-cloud fraction", Source = "common practice (overcast decks rarely exceed 0.9 as a box mean)", Min = 0, Max = 1)]
    public double MaxFraction { get; set; }

    internal string OffsetSource { get; init; } = "";
    internal string SlopeSource { get; init; } = "";
    internal string InterceptSource { get; init; } = "";

    /// <inheritdoc/>
    public string? SourceOf(string propertyName) => propertyName switch
    {
        nameof(FreeTroposphereOffset_K) when OffsetSource.Length > 0 => OffsetSource,
        nameof(Slope_perK) when SlopeSource.Length > 0 => SlopeSource,
        nameof(Intercept) when InterceptSource.Length > 0 => InterceptSource,
        _ => null,
    };

    /// <inheritdoc/>
    public IEnumerable<string> Validate(string path)
    {
        if (MinFraction > MaxFraction)
            yield return $"{path}:MinFraction = {MinFraction} exceeds {path}:MaxFraction = {MaxFraction}; the lower bound must not exceed the upper";
    }
}
