using System.Numerics;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Models;

/// <summary>Units of the recharge oscillator's state and time.</summary>
public enum RechargeOscillatorUnits
{
    /// <summary>Jin's nondimensional variables: T in units of 7.5 K, h in units of 150 m, time in units of 2 months.</summary>
    Nondimensional,
    /// <summary>T_E in K, h_W in m, time in years (the same equations rescaled).</summary>
    Dimensional,
}

/// <summary>
/// Jin's (1997) recharge oscillator for the El Niño–Southern Oscillation: the eastern Pacific SST
/// anomaly T and the western Pacific thermocline depth anomaly h,
/// <code>
///   dT/dt = R T + γ h − e_n (h + b T)³,      R = γ b − c,  b = b0 μ
///   dh/dt = −r h − α b T
/// </code>
/// The wind stress τ = bT deepens the eastern thermocline (h_E = h + bT, the tilt balance) and
/// drains the western warm water (−αbT, the recharge/discharge). Linearised about T = h = 0 the
/// Jacobian is [[R, γ], [−αb, −r]]: the origin loses stability in a Hopf bifurcation where the
/// trace R − r vanishes while the determinant αbγ − rR is positive, with period 2π/√det at onset.
/// </summary>
public sealed class RechargeOscillator : IParametricSystem, IDescribedModel
{
    /// <summary>Temperature unit of the nondimensional form (K).</summary>
    public const double TemperatureScale_K = 7.5;

    /// <summary>Thermocline-depth unit of the nondimensional form (m).</summary>
    public const double DepthScale_m = 150;

    /// <summary>Time unit of the nondimensional form (years): 2 months.</summary>
    public const double TimeScale_yr = 2.0 / 12.0;

    private static readonly ParameterInfo[] AllParameters =
    [
        new("mu", "1", 2.0 / 3.0, "μ: relative coupling coefficient (b = b0·μ); critical value 2/3 for the default parameters"),
        new("b0", "1", 2.5, "b0: high-end coupling coefficient (wind stress per unit eastern SST)"),
        new("gamma", "1", 0.75, "γ: feedback of the thermocline depth on eastern SST (thermocline feedback)"),
        new("c", "1", 1.0, "c: damping rate of eastern SST (relaxation to the mean)"),
        new("r", "1", 0.25, "r: damping rate of the thermocline depth (ocean adjustment)"),
        new("alpha", "1", 0.125, "α: recharge (discharge) of western heat content per unit wind stress"),
        new("en", "1", 3.0, "e_n: strength of the cubic nonlinearity"),
    ];

    private readonly double[] _p;

    /// <summary>Creates the model.</summary>
    /// <param name="nonlinear">Include the cubic term −e_n (h + bT)³ (the parameter "en"); false gives the linear model without it.</param>
    /// <param name="units">Nondimensional (Jin's) or dimensional (K, m, years) state and time.</param>
    /// <param name="mu">Initial coupling coefficient μ.</param>
    public RechargeOscillator(bool nonlinear = true, RechargeOscillatorUnits units = RechargeOscillatorUnits.Nondimensional, double mu = 2.0 / 3.0)
    {
        if (!double.IsFinite(mu)) throw new ArgumentOutOfRangeException(nameof(mu), mu, "The coupling μ must be finite.");
        Nonlinear = nonlinear;
        Units = units;
        _p = AllParameters.Take(ParameterCount).Select(p => p.DefaultValue).ToArray();
        _p[0] = mu;
    }

    /// <summary>Whether the cubic term is included.</summary>
    public bool Nonlinear { get; }

    /// <summary>Units of state and time.</summary>
    public RechargeOscillatorUnits Units { get; }

    /// <inheritdoc />
    public int Dimension => 2;

    /// <inheritdoc />
    public int ParameterCount => Nonlinear ? 7 : 6;

    /// <inheritdoc />
    public string GetParameterName(int index) =>
        index >= 0 && index < ParameterCount ? AllParameters[index].Name
        : throw new ArgumentOutOfRangeException(nameof(index), index, $"The model has {ParameterCount} parameters.");

    /// <inheritdoc />
    public void GetParameters(Span<double> destination) => _p.CopyTo(destination);

    /// <summary>
    /// The coupling μ at which the origin has a Hopf bifurcation (trace of the Jacobian zero):
    /// μ_c = (c + r)/(γ b0), valid when the determinant there is positive.
    /// </summary>
    public static double CriticalCoupling(double b0, double gamma, double c, double r) => (c + r) / (gamma * b0);

    /// <inheritdoc />
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        Rhs(y, dydt, T.CreateChecked(_p[0]), T.CreateChecked(_p[1]), T.CreateChecked(_p[2]), T.CreateChecked(_p[3]),
            T.CreateChecked(_p[4]), T.CreateChecked(_p[5]), Nonlinear ? T.CreateChecked(_p[6]) : T.Zero);
    }

    /// <inheritdoc />
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> =>
        Rhs(y, dydt, p[0], p[1], p[2], p[3], p[4], p[5], Nonlinear ? p[6] : T.Zero);

    private void Rhs<T>(ReadOnlySpan<T> y, Span<T> dydt, T mu, T b0, T gamma, T c, T r, T alpha, T en) where T : struct, IFloatingPointIeee754<T>
    {
        T temperature, depth;
        if (Units == RechargeOscillatorUnits.Dimensional)
        {
            temperature = y[0] / T.CreateChecked(TemperatureScale_K);
            depth = y[1] / T.CreateChecked(DepthScale_m);
        }
        else
        {
            temperature = y[0];
            depth = y[1];
        }
        T b = b0 * mu;
        T growth = gamma * b - c;
        T eastDepth = depth + b * temperature;
        T dT = growth * temperature + gamma * depth - en * eastDepth * eastDepth * eastDepth;
        T dh = -r * depth - alpha * b * temperature;
        if (Units == RechargeOscillatorUnits.Dimensional)
        {
            T perYear = T.CreateChecked(1 / TimeScale_yr);
            dT *= T.CreateChecked(TemperatureScale_K) * perYear;
            dh *= T.CreateChecked(DepthScale_m) * perYear;
        }
        dydt[0] = dT;
        dydt[1] = dh;
    }

    /// <inheritdoc />
    public ModelDescription Description => new()
    {
        Name = Nonlinear ? "recharge-oscillator" : "recharge-oscillator-linear",
        Title = Nonlinear ? "Jin (1997) recharge oscillator with its cubic nonlinearity" : "Jin (1997) recharge oscillator, linear",
        TimeUnit = Units == RechargeOscillatorUnits.Dimensional ? "yr" : "2 months (nondimensional)",
        StateVariables = Units == RechargeOscillatorUnits.Dimensional
            ? [new("T", "K", "eastern equatorial Pacific SST anomaly"), new("h", "m", "western equatorial Pacific thermocline depth anomaly")]
            : [new("T", "7.5 K", "eastern equatorial Pacific SST anomaly"), new("h", "150 m", "western equatorial Pacific thermocline depth anomaly")],
        Parameters = AllParameters.Take(ParameterCount).Select((d, i) => d with { DefaultValue = _p[i] }).ToArray(),
        Equations =
        [
            Nonlinear ? "dT/dt = R·T + γ·h − e_n·(h + b·T)³" : "dT/dt = R·T + γ·h",
            "dh/dt = −r·h − α·b·T",
            "b = b0·μ,  R = γ·b − c,  h_E = h + b·T (zonal tilt balance)",
            "Hopf at trace = R − r = 0 (μ_c = (c + r)/(γ·b0)) with det = α·b·γ − r·R > 0; period at onset 2π/√det",
        ],
        References =
        [
            "Jin, F.-F. (1997): An equatorial ocean recharge paradigm for ENSO. Part I: Conceptual model. J. Atmos. Sci. 54, 811–829.",
            "Jin, F.-F. (1997): An equatorial ocean recharge paradigm for ENSO. Part II: A stripped-down coupled model. J. Atmos. Sci. 54, 830–847.",
        ],
        Notes =
        [
            "Default parameters c = 1, r = 0.25, α = 0.125, b0 = 2.5, γ = 0.75, e_n = 3 and the scales 7.5 K, 150 m, 2 months are as usually quoted from Jin (1997a) (from memory).",
            "With them μ_c = 2/3 and the period at onset is 2π/√(3/32) ≈ 20.5 time units ≈ 3.4 years.",
        ],
    };
}
