using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Shortwave radiation absorbed at the surface of each surface box:
/// <code>SW_b = Q_b · t_a · (1 − α_s) · (1 − α_c·c_b)</code>
/// Q_b the top-of-atmosphere insolation of the box's latitude band (W/m²; annual or daily mean from the
/// orbital module, Berger 1978), t_a the fraction that the atmosphere (gases, aerosol and clouds other than
/// the low cloud) lets through, α_s the ocean surface albedo and α_c·c_b the fraction reflected by the low
/// cloud (the low-cloud process). A single-layer form of the shortwave budget (e.g. Hartmann 2016, ch. 4).
/// Disabled: no shortwave heating.
/// </summary>
public sealed class Shortwave : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "Shortwave";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<ShortwaveOptions>(
        ProcessName,
        "shortwave absorbed at the surface: band insolation × atmospheric transmissivity × (1 − surface albedo) × (1 − low-cloud reflectance)",
        "SW_b = Q_b·t_a·(1 − α_s)·(1 − α_c·c_b)",
        ["Berger, A. (1978), Long-term variations of daily insolation and Quaternary climatic changes, J. Atmos. Sci. 35, 2362–2367",
         "Hartmann, D. L. (2016), Global Physical Climatology, 2nd ed., Elsevier, ch. 4"],
        order: 60,
        (o, c) => new Shortwave(o, c));

    private readonly int _transmissivity, _surfaceAlbedo;
    private readonly int[] _reflectance = new int[Boxes.SurfaceCount], _absorbed = new int[Boxes.SurfaceCount];

    private Shortwave(ShortwaveOptions o, ProcessBuildContext c)
    {
        _transmissivity = c.Parameter(nameof(o.AtmosphericTransmissivity));
        _surfaceAlbedo = c.Parameter(nameof(o.SurfaceAlbedo));
        foreach (var b in Boxes.Surface)
        {
            _reflectance[(int)b] = c.Diagnostic(TropicalDiagnostics.CloudReflectance(b));
            _absorbed[(int)b] = c.ProvideDiagnostic(TropicalDiagnostics.Shortwave(b), "W m-2", $"shortwave absorbed at the surface of the {Boxes.Label(b)}", 0.0);
        }
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T clearOfLowCloud = c.P(_transmissivity) * (T.One - c.P(_surfaceAlbedo));
        for (int i = 0; i < Boxes.SurfaceCount; i++)
        {
            var b = (Box)i;
            T absorbed = ProcessContext<T>.C(c.Forcing[ForcingChannel.Insolation(b)]) * clearOfLowCloud * (T.One - c.Diagnostics[_reflectance[i]]);
            c.Diagnostics[_absorbed[i]] = absorbed;
            c.AddSurfaceHeatFlux(b, absorbed);
        }
    }
}

/// <summary>Options of <see cref="Shortwave"/> ("Model:Processes:Shortwave").</summary>
public sealed class ShortwaveOptions : ProcessOptions
{
    /// <summary>Fraction t_a of the top-of-atmosphere insolation reaching the surface when there is no low cloud.</summary>
    [Parameter("1", "fraction of insolation transmitted to the surface by the atmosphere without low cloud (t_a)", Source = "common practice (clear-sky surface insolation ≈ 75 % of TOA; Hartmann 2016 ch. 4); with high cloud ≈ 0.7", Min = 0, Max = 1)]
    public double AtmosphericTransmissivity { get; set; } = 0.72;

    /// <summary>Ocean surface albedo α_s.</summary>
    [Parameter("1", "ocean surface albedo (α_s)", Source = "common practice (ocean albedo ≈ 0.06)", Min = 0, Max = 1)]
    public double SurfaceAlbedo { get; set; } = 0.06;
}
