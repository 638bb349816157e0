using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Longwave and turbulent (latent and sensible) heat loss at the surface, linearized about a reference
/// temperature, with the CO2 radiative forcing as a downward term:
/// <code>
/// F_b = A_g + B_g·(T_b − T_ref,g) − ΔF_CO2,   ΔF_CO2 = k·ln(C/C0)     (W/m², positive = ocean loses heat)
/// </code>
/// A linearized surface heat flux of the Haney (1971) kind: A the loss at T_ref and B the net feedback of
/// outgoing longwave, evaporation and sensible heat per kelvin; separate constants for the tropical and the
/// extratropical (ventilation) boxes. ΔF_CO2 is the simplified expression of Myhre et al. (1998)
/// (k = 5.35 W/m²), applied at the surface as a stand-in for the extra downward longwave.
/// Disabled: no longwave or turbulent exchange.
/// </summary>
public sealed class AirSeaExchange : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "AirSeaExchange";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<AirSeaExchangeOptions>(
        ProcessName,
        "linearized longwave + turbulent surface heat loss, with the CO2 forcing 5.35 ln(C/C0)",
        "F_b = A_g + B_g·(T_b − T_ref,g) − k·ln(C/C0)",
        ["Haney, R. L. (1971), Surface thermal boundary condition for ocean circulation models, J. Phys. Oceanogr. 1, 241–248",
         "Myhre, G., E. J. Highwood, K. P. Shine and F. Stordal (1998), New estimates of radiative forcing due to well mixed greenhouse gases, Geophys. Res. Lett. 25, 2715–2718"],
        order: 70,
        (o, c) => new AirSeaExchange(o, c));

    private readonly int _k, _c0, _co2Forcing;
    private readonly int[] _a = new int[Boxes.SurfaceCount], _b = new int[Boxes.SurfaceCount], _tref = new int[Boxes.SurfaceCount],
        _loss = new int[Boxes.SurfaceCount];

    private AirSeaExchange(AirSeaExchangeOptions o, ProcessBuildContext c)
    {
        _k = c.Parameter(nameof(o.Co2Coefficient_Wm2));
        _c0 = c.Parameter(nameof(o.Co2Reference_ppm));
        _co2Forcing = c.ProvideDiagnostic(TropicalDiagnostics.Co2Forcing, "W m-2", "CO2 radiative forcing k·ln(C/C0)", 0.0);
        foreach (var b in Boxes.Surface)
        {
            int i = (int)b;
            string g = Boxes.IsTropicalSurface(b) ? nameof(o.Tropical) : nameof(o.Extratropical);
            _a[i] = c.Parameter(g + ":" + nameof(SurfaceExchangeOptions.Loss_Wm2));
            _b[i] = c.Parameter(g + ":" + nameof(SurfaceExchangeOptions.Feedback_WmK));
            _tref[i] = c.Parameter(g + ":" + nameof(SurfaceExchangeOptions.ReferenceTemperature_degC));
            _loss[i] = c.ProvideDiagnostic(TropicalDiagnostics.LongwaveTurbulent(b), "W m-2", $"longwave + turbulent heat loss of the {Boxes.Label(b)} (net of CO2 forcing)", 0.0);
        }
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T co2Forcing = c.P(_k) * T.Log(ProcessContext<T>.C(c.Forcing[ForcingChannel.Co2]) / c.P(_c0));
        c.Diagnostics[_co2Forcing] = co2Forcing;
        for (int i = 0; i < Boxes.SurfaceCount; i++)
        {
            T loss = c.P(_a[i]) + c.P(_b[i]) * (c.Temperature[i] - c.P(_tref[i])) - co2Forcing;
            c.Diagnostics[_loss[i]] = loss;
            c.AddSurfaceHeatFlux((Box)i, -loss);
        }
    }
}

/// <summary>Options of <see cref="AirSeaExchange"/> ("Model:Processes:AirSeaExchange").</summary>
public sealed class AirSeaExchangeOptions : ProcessOptions
{
    /// <summary>Equatorial boxes.</summary>
    public SurfaceExchangeOptions Tropical { get; set; } = new()
    {
        Loss_Wm2 = 140.0, Feedback_WmK = 20.0, ReferenceTemperature_degC = 28.0,
        LossSource = "tuned: warm-pool SST 29.5 °C in the default equilibrium (observed warm-pool net LW + LH + SH ≈ 150–190 W m-2)",
    };

    /// <summary>Ventilation boxes.</summary>
    public SurfaceExchangeOptions Extratropical { get; set; } = new()
    {
        Loss_Wm2 = 152.4, Feedback_WmK = 15.0, ReferenceTemperature_degC = 18.0,
        LossSource = "tuned: ventilation-box SST 18 °C in the default equilibrium (subducted thermocline water 16–20 °C, common practice)",
    };

    /// <summary>k in ΔF = k·ln(C/C0).</summary>
    [Parameter("W m-2", "CO2 forcing coefficient k in k·ln(C/C0)", Source = "Myhre et al. (1998), Geophys. Res. Lett. 25, 2715 (from memory)", Min = 0, Max = 20)]
    public double Co2Coefficient_Wm2 { get; set; } = 5.35;

    /// <summary>Reference concentration C0.</summary>
    [Parameter("ppm", "reference CO2 concentration C0 (no forcing)", Source = "common practice (pre-industrial 280 ppm)", Min = 0, MinExclusive = true, Max = 10000)]
    public double Co2Reference_ppm { get; set; } = 280.0;
}

/// <summary>One group's linearized surface loss ("…:Tropical" or "…:Extratropical").</summary>
public sealed class SurfaceExchangeOptions : IParameterSources
{
    /// <summary>A: loss at the reference temperature.</summary>
    [Parameter("W m-2", "longwave + turbulent loss at the reference temperature (A)", Source = "tuned (see the group's defaults)", Min = -500, Max = 1000)]
    public double Loss_Wm2 { get; set; }

    /// <summary>B: change of the loss per kelvin.</summary>
    [Parameter("W m-2 K-1", "change of the loss per kelvin of SST (B)", Source = "common practice (air–sea feedback 10–30 W m-2 K-1; Haney 1971)", Min = 0, Max = 200)]
    public double Feedback_WmK { get; set; }

    /// <summary>T_ref: linearization temperature.</summary>
    [Parameter("degC", "temperature about which the loss is linearized (T_ref)", Source = "common practice (near the group's SST)", Min = -2, Max = 40)]
    public double ReferenceTemperature_degC { get; set; }

    internal string LossSource { get; init; } = "";

    /// <inheritdoc/>
    public string? SourceOf(string propertyName) => propertyName == nameof(Loss_Wm2) && LossSource.Length > 0 ? LossSource : null;
}
