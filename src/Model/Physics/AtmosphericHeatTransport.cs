using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Poleward heat transport by the atmosphere, as diffusive (tropics → extratropics) and relaxation
/// (extratropics → high latitudes) terms:
/// <code>
/// H_b = D_t·(T_b − T_X)        for the warm pool and the cold tongue,  T_X = (A_N T_N + A_S T_S)/(A_N + A_S)
/// H_b = D_x·(T_b − T_hl)       for the ventilation boxes                       (W/m², positive = ocean loses heat)
/// </code>
/// The tropical boxes lose heat in proportion to their excess over the extratropical SST, as in a
/// two-zone diffusive energy balance (Budyko 1969; Sellers 1969; North 1975); the ventilation boxes lose
/// heat to higher latitudes at a rate relaxing them toward a high-latitude temperature T_hl. D_x is the
/// lever for the extratropical heat loss: a weaker loss warms the ventilation boxes, which warms the
/// subducted water and, through the thermocline's heat budget, deepens the thermocline.
/// Disabled: no atmospheric transport.
/// </summary>
public sealed class AtmosphericHeatTransport : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "AtmosphericTransport";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<AtmosphericTransportOptions>(
        ProcessName,
        "atmospheric heat export: diffusive from the tropical boxes to the extratropics, relaxation from the ventilation boxes to high latitudes",
        "H_W,E = D_t·(T − T_X), T_X the area-mean ventilation-box SST;  H_N,S = D_x·(T − T_hl)",
        ["Budyko, M. I. (1969), The effect of solar radiation variations on the climate of the Earth, Tellus 21, 611–619",
         "Sellers, W. D. (1969), A global climatic model based on the energy balance of the Earth–atmosphere system, J. Appl. Meteor. 8, 392–400",
         "North, G. R. (1975), Theory of energy-balance climate models, J. Atmos. Sci. 32, 2033–2043"],
        order: 80,
        (o, c) => new AtmosphericHeatTransport(o, c));

    private readonly int _dt, _dx, _thl, _areaN, _areaS;
    private readonly int[] _export = new int[Boxes.SurfaceCount];

    private AtmosphericHeatTransport(AtmosphericTransportOptions o, ProcessBuildContext c)
    {
        _dt = c.Parameter(nameof(o.TropicalExchange_WmK));
        _dx = c.Parameter(nameof(o.ExtratropicalLoss_WmK));
        _thl = c.Parameter(nameof(o.HighLatitudeTemperature_degC));
        _areaN = c.ModelParameter("Model:Boxes:North:Area_m2");
        _areaS = c.ModelParameter("Model:Boxes:South:Area_m2");
        foreach (var b in Boxes.Surface)
            _export[(int)b] = c.ProvideDiagnostic(TropicalDiagnostics.AtmosphericExport(b), "W m-2", $"heat exported poleward by the atmosphere from above the {Boxes.Label(b)}", 0.0);
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T aN = c.P(_areaN), aS = c.P(_areaS);
        T extratropical = (aN * c.TemperatureOf(Box.North) + aS * c.TemperatureOf(Box.South)) / (aN + aS);
        for (int i = 0; i < Boxes.SurfaceCount; i++)
        {
            var b = (Box)i;
            T export = Boxes.IsTropicalSurface(b)
                ? c.P(_dt) * (c.Temperature[i] - extratropical)
                : c.P(_dx) * (c.Temperature[i] - c.P(_thl));
            c.Diagnostics[_export[i]] = export;
            c.AddSurfaceHeatFlux(b, -export);
        }
    }
}

/// <summary>Options of <see cref="AtmosphericHeatTransport"/> ("Model:Processes:AtmosphericTransport").</summary>
public sealed class AtmosphericTransportOptions : ProcessOptions
{
    /// <summary>D_t: tropical export per kelvin of tropical-minus-extratropical SST.</summary>
    [Parameter("W m-2 K-1", "export from the tropical boxes per kelvin above the ventilation-box SST (D_t)", Source = "common practice (two-zone energy-balance exchange coefficients of order 1 W m-2 K-1; North 1975)", Min = 0, Max = 50)]
    public double TropicalExchange_WmK { get; set; } = 1.0;

    /// <summary>D_x: extratropical loss per kelvin above the high-latitude temperature.</summary>
    [Parameter("W m-2 K-1", "heat loss of the ventilation boxes per kelvin above the high-latitude temperature (D_x)", Source = "tuned: with the extratropical air–sea loss, ventilation-box SST 18 °C; range 0–4 documented in the tests", Min = 0, Max = 50)]
    public double ExtratropicalLoss_WmK { get; set; } = 2.0;

    /// <summary>T_hl: temperature of the high latitudes toward which the ventilation boxes lose heat.</summary>
    [Parameter("degC", "high-latitude temperature toward which the ventilation boxes relax (T_hl)", Source = "common practice (annual-mean surface air temperature poleward of 60° ≈ 0 °C)", Min = -60, Max = 30)]
    public double HighLatitudeTemperature_degC { get; set; } = 0.0;
}
