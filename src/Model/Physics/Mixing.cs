using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Mixing (eddy and diffusive exchange) between adjacent boxes:
/// <code>heat_a += ρ0 c_p k_ab (T_b − T_a),  salt_a += k_ab (S_b − S_a),  and the opposite for b</code>
/// for the pairs warm pool–cold tongue (zonal), warm pool and cold tongue–ventilation boxes (meridional
/// gyre and eddy exchange), and warm pool and cold tongue–thermocline (vertical entrainment). Each pair
/// exchanges equal volumes both ways, so heat and salt are only redistributed (the exchange form of
/// Stommel 1961 box models).
/// Disabled: no mixing.
/// </summary>
public sealed class Mixing : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "Mixing";

    private static readonly (Box A, Box B, string Option)[] Pairs =
    [
        (Box.WarmPool, Box.ColdTongue, nameof(MixingOptions.WarmPoolColdTongue_Sv)),
        (Box.WarmPool, Box.North, nameof(MixingOptions.WarmPoolNorth_Sv)),
        (Box.WarmPool, Box.South, nameof(MixingOptions.WarmPoolSouth_Sv)),
        (Box.ColdTongue, Box.North, nameof(MixingOptions.ColdTongueNorth_Sv)),
        (Box.ColdTongue, Box.South, nameof(MixingOptions.ColdTongueSouth_Sv)),
        (Box.WarmPool, Box.Thermocline, nameof(MixingOptions.WarmPoolThermocline_Sv)),
        (Box.ColdTongue, Box.Thermocline, nameof(MixingOptions.ColdTongueThermocline_Sv)),
    ];

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<MixingOptions>(
        ProcessName,
        "two-way exchange of heat and salt between adjacent boxes (zonal, meridional, vertical)",
        "heat_a += ρ0 c_p k_ab (T_b − T_a), salt_a += k_ab (S_b − S_a), opposite for b",
        ["Stommel, H. (1961), Thermohaline convection with two stable regimes of flow, Tellus 13, 224–230"],
        order: 90,
        (o, c) => new Mixing(o, c));

    private readonly int[] _k = new int[Pairs.Length];

    private Mixing(MixingOptions o, ProcessBuildContext c)
    {
        for (int i = 0; i < Pairs.Length; i++) _k[i] = c.Parameter(Pairs[i].Option);
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T sv = ProcessContext<T>.C(1e6);
        for (int i = 0; i < Pairs.Length; i++) c.Exchange(Pairs[i].A, Pairs[i].B, c.P(_k[i]) * sv);
    }
}

/// <summary>Options of <see cref="Mixing"/> ("Model:Processes:Mixing"), exchange rates in Sv (10⁶ m³/s).</summary>
public sealed class MixingOptions : ProcessOptions
{
    /// <summary>Zonal exchange warm pool–cold tongue.</summary>
    [Parameter("Sv", "exchange between warm pool and cold tongue", Source = "tuned: with the overturning, a 4–5 K zonal SST difference (common practice: equatorial eddy exchange of a few Sv)", Min = 0, Max = 1000)]
    public double WarmPoolColdTongue_Sv { get; set; } = 3.0;

    /// <summary>Meridional exchange warm pool–north.</summary>
    [Parameter("Sv", "exchange between warm pool and northern ventilation box", Source = "common practice (gyre/eddy exchange of a few Sv); sets the width of the salt-advection hysteresis", Min = 0, Max = 1000)]
    public double WarmPoolNorth_Sv { get; set; } = 1.5;

    /// <summary>Meridional exchange warm pool–south.</summary>
    [Parameter("Sv", "exchange between warm pool and southern ventilation box", Source = "common practice (gyre/eddy exchange of a few Sv); sets the width of the salt-advection hysteresis", Min = 0, Max = 1000)]
    public double WarmPoolSouth_Sv { get; set; } = 1.5;

    /// <summary>Meridional exchange cold tongue–north.</summary>
    [Parameter("Sv", "exchange between cold tongue and northern ventilation box", Source = "common practice (gyre/eddy exchange of a few Sv)", Min = 0, Max = 1000)]
    public double ColdTongueNorth_Sv { get; set; } = 1.5;

    /// <summary>Meridional exchange cold tongue–south.</summary>
    [Parameter("Sv", "exchange between cold tongue and southern ventilation box", Source = "common practice (gyre/eddy exchange of a few Sv)", Min = 0, Max = 1000)]
    public double ColdTongueSouth_Sv { get; set; } = 1.5;

    /// <summary>Vertical exchange warm pool–thermocline.</summary>
    [Parameter("Sv", "vertical exchange between warm pool and thermocline box", Source = "common practice (weak entrainment under the deep warm-pool mixed layer)", Min = 0, Max = 1000)]
    public double WarmPoolThermocline_Sv { get; set; }

    /// <summary>Vertical exchange cold tongue–thermocline.</summary>
    [Parameter("Sv", "vertical exchange between cold tongue and thermocline box", Source = "common practice (entrainment/vertical mixing at the base of the cold-tongue layer, small against the upwelling)", Min = 0, Max = 1000)]
    public double ColdTongueThermocline_Sv { get; set; } = 0.5;
}
