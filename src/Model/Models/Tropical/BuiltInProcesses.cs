using Thermostrat.Model.Physics;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>The processes of the default tropical ocean–cloud model, in evaluation order.</summary>
internal static class BuiltInProcesses
{
    /// <summary>Descriptors of the built-in processes.</summary>
    public static IReadOnlyList<ProcessDescriptor> All { get; } =
    [
        BjerknesWindStress.Descriptor,
        LowCloud.Descriptor,
        SurfaceFreshwater.Descriptor,
        WarmWaterRecharge.Descriptor,
        ThermoclineDepth.Descriptor,
        EquatorialUpwelling.Descriptor,
        Ventilation.Descriptor,
        Shortwave.Descriptor,
        AirSeaExchange.Descriptor,
        AtmosphericHeatTransport.Descriptor,
        Mixing.Descriptor,
        DeepExchange.Descriptor,
    ];
}
