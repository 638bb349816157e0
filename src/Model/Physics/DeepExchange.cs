using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Exchange between the equatorial thermocline and the slow deep reservoir:
/// <code>heat_U += ρ0 c_p k_D (T_D − T_U),  salt_U += k_D (S_D − S_U),  and the opposite for D</code>
/// The deep box (volume V_D) relaxes toward the thermocline on the time scale V_D/k_D (millennia with the
/// defaults) and gives the upper ocean a slow memory, as the abyssal reservoir of multi-box ocean models
/// does (e.g. the deep box of Gnanadesikan 1999's pycnocline model).
/// Disabled: the deep reservoir is isolated.
/// </summary>
public sealed class DeepExchange : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "DeepExchange";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<DeepExchangeOptions>(
        ProcessName,
        "slow two-way exchange between the thermocline box and the deep reservoir",
        "heat_U += ρ0 c_p k_D (T_D − T_U), salt_U += k_D (S_D − S_U), opposite for D",
        ["Gnanadesikan, A. (1999), A simple predictive model for the structure of the oceanic pycnocline, Science 283, 2077–2079"],
        order: 95,
        (o, c) => new DeepExchange(o, c));

    private readonly int _k;

    private DeepExchange(DeepExchangeOptions o, ProcessBuildContext c) => _k = c.Parameter(nameof(o.ThermoclineDeep_Sv));

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T> =>
        c.Exchange(Box.Thermocline, Box.Deep, c.P(_k) * ProcessContext<T>.C(1e6));
}

/// <summary>Options of <see cref="DeepExchange"/> ("Model:Processes:DeepExchange").</summary>
public sealed class DeepExchangeOptions : ProcessOptions
{
    /// <summary>k_D: exchange between thermocline and deep reservoir.</summary>
    [Parameter("Sv", "exchange between thermocline box and deep reservoir (k_D)", Source = "common practice (deep-reservoir adjustment time V_D/k_D of a few thousand years)", Min = 0, Max = 1000)]
    public double ThermoclineDeep_Sv { get; set; } = 5.0;
}
