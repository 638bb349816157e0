using System.Numerics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Models.Tropical;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Wind-driven recharge and discharge of the equatorial warm-water volume (Jin 1997 recharge oscillator):
/// <code>
/// w_eq = s·(τ − τ_R)                                      (equilibrium anomaly, m)
/// dw/dt = (w_eq − w)/t_R      when Prognostic              (recharge oscillator)
/// w = w_eq                    otherwise                    (instant adjustment)
/// </code>
/// w is the part of the equatorial thermocline depth set by the meridional Sverdrup transport rather
/// than by the heat content of the thermocline box: stronger easterlies pile warm water into the
/// equatorial band (recharge), weaker ones drain it (discharge), as in Jin's dh_W/dt = −r h_W − ατ.
/// It moves the interface at constant heat content (the off-equatorial ocean takes the difference), so it
/// changes the upwelled temperature but not the heat budget. With the instant form the thermocline adjusts
/// at once and the equilibria are those of the prognostic form; with Prognostic the adjustment lags by t_R
/// and the Bjerknes feedback can grow into interannual oscillations.
/// Disabled: w = 0.
/// </summary>
public sealed class WarmWaterRecharge : IProcess
{
    /// <summary>Configuration key.</summary>
    public const string ProcessName = "WarmWaterRecharge";

    /// <summary>Name of the state variable added when the recharge is prognostic.</summary>
    public const string StateName = "warm_water_depth_anomaly_state_m";

    /// <summary>Catalog entry.</summary>
    public static ProcessDescriptor Descriptor { get; } = ProcessDescriptor.Create<WarmWaterRechargeOptions>(
        ProcessName,
        "wind-driven recharge/discharge of the equatorial warm-water volume; prognostic form gives the recharge oscillator",
        "w_eq = s·(τ − τ_R);  dw/dt = (w_eq − w)/t_R (prognostic) or w = w_eq (instant)",
        ["Jin, F.-F. (1997), An equatorial ocean recharge paradigm for ENSO. Part I: Conceptual model, J. Atmos. Sci. 54, 811–829",
         "Meinen, C. S., and M. J. McPhaden (2000), Observations of warm water volume changes in the equatorial Pacific and their relationship to El Niño and La Niña, J. Climate 13, 3551–3559"],
        order: 20,
        (o, c) => new WarmWaterRecharge(o, c));

    private readonly bool _prognostic;
    private readonly int _sensitivity, _tauRef, _time, _tau, _w, _state = -1;

    private WarmWaterRecharge(WarmWaterRechargeOptions o, ProcessBuildContext c)
    {
        _prognostic = o.Prognostic;
        _sensitivity = c.Parameter(nameof(o.Sensitivity_mPerNm2));
        _tauRef = c.Parameter(nameof(o.ReferenceStress_Nm2));
        _time = c.Parameter(nameof(o.AdjustmentTime_yr));
        _tau = c.Diagnostic(TropicalDiagnostics.WindStress);
        _w = c.ProvideDiagnostic(TropicalDiagnostics.WarmWaterAnomaly, "m", "wind-driven recharge anomaly w of the equatorial thermocline depth", 0.0);
        if (c.Enabled && _prognostic)
            _state = c.AddStateVariable(StateName, "m", "recharge anomaly w of the equatorial thermocline depth (prognostic, recharge oscillator)", o.InitialAnomaly_m);
    }

    /// <inheritdoc/>
    public string Name => ProcessName;

    /// <inheritdoc/>
    public void Apply<T>(ref ProcessContext<T> c) where T : struct, IFloatingPointIeee754<T>
    {
        T equilibriumAnomaly = c.P(_sensitivity) * (c.Diagnostics[_tau] - c.P(_tauRef));
        if (_prognostic)
        {
            T w = c.State[_state];
            c.Diagnostics[_w] = w;
            c.Rates[_state] = (equilibriumAnomaly - w) / c.P(_time);
        }
        else
        {
            c.Diagnostics[_w] = equilibriumAnomaly;
        }
    }
}

/// <summary>Options of <see cref="WarmWaterRecharge"/> ("Model:Processes:WarmWaterRecharge").</summary>
public sealed class WarmWaterRechargeOptions : ProcessOptions
{
    /// <summary>Integrate the anomaly w (recharge oscillator) instead of adjusting it instantly.</summary>
    [Parameter("", "integrate the recharge anomaly (true: recharge oscillator, interannual variability; false: instant adjustment)")]
    public bool Prognostic { get; set; }

    /// <summary>Equilibrium anomaly per unit stress anomaly, s (the ratio α/r of Jin 1997).</summary>
    [Parameter("m N-1 m2", "equilibrium recharge anomaly per N/m² of stress anomaly (s)", Source = "tuned: ±10 m of thermocline depth for ±0.01 N m-2 (warm-water volume changes of order 10 %, Meinen and McPhaden 2000)", Min = 0, Max = 1e5)]
    public double Sensitivity_mPerNm2 { get; set; } = 1000.0;

    /// <summary>Stress τ_R at which the recharge anomaly vanishes.</summary>
    [Parameter("N m-2", "wind stress at which the recharge anomaly vanishes (τ_R)", Source = "tuned: the default equilibrium stress, so that w = 0 there", Min = 0, Max = 0.5)]
    public double ReferenceStress_Nm2 { get; set; } = 0.0482;

    /// <summary>Adjustment time t_R of the warm-water volume.</summary>
    [Parameter("yr", "adjustment (recharge) time t_R of the warm-water volume", Source = "tuned: self-sustained oscillation with a period of 2–7 years (common practice: ENSO periods); Jin 1997 uses about 8 months to 1 year", Min = 0.01, Max = 100)]
    public double AdjustmentTime_yr { get; set; } = 5.0;

    /// <summary>Initial anomaly when prognostic.</summary>
    [Parameter("m", "initial recharge anomaly (prognostic form)", Source = "common practice (start from rest)", Min = -500, Max = 500)]
    public double InitialAnomaly_m { get; set; }
}
