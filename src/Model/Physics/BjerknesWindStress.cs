using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Bjerknes coupling: the equatorial easterly wind stress grows with the east–west SST difference,
/// <code>τ = τ0 + μ·(T_W − T_E)</code>
/// τ in N/m² (easterly positive), T_W and T_E the warm-pool and cold-tongue temperatures (°C),
/// τ0 a background stress and μ the coupling coefficient (N m⁻² K⁻¹). A colder cold tongue strengthens
/// the easterlies, which strengthen upwelling and the thermocline tilt and so cool the cold tongue further
/// (Bjerknes 1969); the linear stress law is that of the recharge-oscillator model (Jin 1997).
/// Disabled: τ = τ0 (no coupling).
/// </summary>
public sealed class BjerknesWindStress : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "BjerknesWind";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<BjerknesWindOptions>(
        ProcessName,
        "equatorial easterly wind stress from a background plus the east–west SST difference (Bjerknes feedback)",
        "τ = τ0 + μ·(T_W − T_E)",
        ["Bjerknes, J. (1969), Atmospheric teleconnections from the equatorial Pacific, Mon. Wea. Rev. 97, 163–172",
         "Jin, F.-F. (1997), An equatorial ocean recharge paradigm for ENSO. Part I: Conceptual model, J. Atmos. Sci. 54, 811–829"],
        order: 10,
        (o, c) => new BjerknesWindStress(o, c));

    private readonly int _tau0, _mu, _tau;

    private BjerknesWindStress(BjerknesWindOptions o, ProcessBuildContext c)
    {
        _tau0 = c.Parameter(nameof(o.Background_Nm2));
        _mu = c.Parameter(nameof(o.Coupling_NmK));
        _tau = c.ProvideDiagnostic(TropicalDiagnostics.WindStress, "N m-2", "equatorial easterly wind stress τ", fallback: o.Background_Nm2);
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T zonalSstDifference = c.TemperatureOf(Box.WarmPool) - c.TemperatureOf(Box.ColdTongue);
        c.Diagnostics[_tau] = c.P(_tau0) + c.P(_mu) * zonalSstDifference;
    }
}

/// <summary>Options of <see cref="BjerknesWindStress"/> ("Model:Processes:BjerknesWind").</summary>
public sealed class BjerknesWindOptions : ProcessOptions
{
    /// <summary>Background easterly stress τ0 (the stress with no zonal SST difference).</summary>
    [Parameter("N m-2", "background easterly wind stress τ0", Source = "tuned: weak stress (≈10 % of present) when the zonal SST difference vanishes", Min = 0, Max = 0.5)]
    public double Background_Nm2 { get; set; } = 0.005;

    /// <summary>Coupling coefficient μ.</summary>
    [Parameter("N m-2 K-1", "wind stress per kelvin of warm-pool minus cold-tongue SST (μ)", Source = "tuned: τ ≈ 0.05 N m-2 at the present-like zonal SST difference of ≈ 4.7 K", Min = 0, Max = 0.1)]
    public double Coupling_NmK { get; set; } = 0.0092;
}
