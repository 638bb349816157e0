using System.Numerics;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Models;

/// <summary>
/// Stommel's (1961) two-box model in dimensional form: two well-mixed boxes of volume V (low and high
/// latitude), temperatures relaxed toward a prescribed difference ΔT* over τ_T, salinity forced by a
/// freshwater transport F (a virtual salt flux S0·F out of the high-latitude box) and relaxed over
/// τ_S, and exchange by a density-driven flow q = k (α ΔT − β ΔS):
/// <code>
///   dΔT/dt = (ΔT* − ΔT)/τ_T − 2|q| ΔT / V
///   dΔS/dt = 2 S0 F / V − ΔS/τ_S − 2|q| ΔS / V
/// </code>
/// ΔT = T_low − T_high (K), ΔS = S_low − S_high (g/kg); time in years, transports in Sv.
/// </summary>
/// <remarks>
/// With λ = 2 τ_T k / V this is exactly the nondimensional <see cref="StommelBoxModel"/> with
/// T = λαΔT, S = λβΔS, time in units of τ_T, η1 = λαΔT*, η2 = 2λβτ_T S0 F / V and η3 = τ_T/τ_S
/// (see <see cref="NondimensionalGroups"/>). The default values are invented for demonstration and
/// chosen so that η1 = 3 and η3 = 0.3, the classic nondimensional values: V = 10¹⁶ m³, τ_T = 10 yr,
/// τ_S = 33.3 yr, ΔT* = 10 K, α = 2·10⁻⁴ K⁻¹ and β = 7.6·10⁻⁴ (g/kg)⁻¹ (textbook linear-EOS
/// coefficients, e.g. Vallis, Atmospheric and Oceanic Fluid Dynamics; from memory), S0 = 35 g/kg.
/// The thermally driven state then carries about 20 Sv at F = 0 and collapses at its fold, F ≈ 0.48 Sv
/// (q ≈ 6 Sv); the salinity-driven state persists down to the corner q = 0 at F ≈ 0.36 Sv.
/// </remarks>
public sealed class StommelDimensionalModel : IParametricSystem, IDescribedModel
{
    /// <summary>Seconds per year (Julian year, 365.25 days).</summary>
    public const double SecondsPerYear = 365.25 * 86400;

    /// <summary>m³/s per Sverdrup.</summary>
    public const double CubicMetresPerSecondPerSv = 1e6;

    private static readonly ParameterInfo[] Defaults = BuildDefaults();

    private static ParameterInfo[] BuildDefaults()
    {
        const double volume = 1e16, tauT = 10, tauS = 10 / 0.3, dTStar = 10, alpha = 2e-4, beta = 7.6e-4, s0 = 35;
        // k such that η1 = λ α ΔT* = 3 with λ = 2 τ_T k / V.
        double k_m3s = 3 * volume / (2 * tauT * SecondsPerYear * alpha * dTStar);
        return
        [
            new("RelaxationTemperatureDifference_K", "K", dTStar, "ΔT*: temperature difference the boxes are relaxed toward"),
            new("TemperatureRelaxationTime_yr", "yr", tauT, "τ_T: temperature relaxation time"),
            new("SalinityRelaxationRate_per_yr", "1/yr", 1 / tauS, "1/τ_S: salinity relaxation rate (0 for pure flux forcing)"),
            new("FreshwaterTransport_Sv", "Sv", 0.2, "F: freshwater transport from the low- to the high-latitude box (as a virtual salt flux S0·F)"),
            new("FlowCoefficient_Sv", "Sv", k_m3s / CubicMetresPerSecondPerSv, "k: flow per unit of α ΔT − β ΔS"),
            new("BoxVolume_m3", "m³", volume, "V: volume of each box"),
            new("ThermalExpansion_per_K", "1/K", alpha, "α: thermal expansion coefficient"),
            new("HalineContraction_per_gkg", "kg/g", beta, "β: haline contraction coefficient"),
            new("ReferenceSalinity_gkg", "g/kg", s0, "S0: reference salinity of the virtual salt flux"),
        ];
    }

    private readonly double[] _p;

    /// <summary>Creates the model with the default (demonstration) parameter values, optionally overridden by name.</summary>
    /// <param name="overrides">Parameter values by name (names as in <see cref="GetParameterName"/>), or null.</param>
    /// <param name="flowLaw">|q| or its smooth approximation.</param>
    /// <param name="smoothingWidth_Sv">ε of the smoothed law, in Sv.</param>
    public StommelDimensionalModel(IReadOnlyDictionary<string, double>? overrides = null, StommelFlowLaw flowLaw = StommelFlowLaw.Absolute, double smoothingWidth_Sv = 0.1)
    {
        _p = Defaults.Select(d => d.DefaultValue).ToArray();
        if (overrides is not null)
        {
            foreach (var (name, value) in overrides)
            {
                int i = Array.FindIndex(Defaults, d => d.Name == name);
                if (i < 0)
                {
                    string? closest = Analysis.EditDistance.Closest(name, Defaults.Select(d => d.Name));
                    throw new ArgumentException($"Unknown parameter '{name}' of the dimensional Stommel model: did you mean '{closest}'? Valid names: {string.Join(", ", Defaults.Select(d => d.Name))}.", nameof(overrides));
                }
                if (!double.IsFinite(value)) throw new ArgumentOutOfRangeException(nameof(overrides), value, $"Parameter '{name}' must be finite.");
                _p[i] = value;
            }
        }
        if (flowLaw == StommelFlowLaw.Smoothed && !(smoothingWidth_Sv > 0 && double.IsFinite(smoothingWidth_Sv)))
            throw new ArgumentOutOfRangeException(nameof(smoothingWidth_Sv), smoothingWidth_Sv, "The smoothing width ε must be positive and finite (Sv).");
        FlowLaw = flowLaw;
        SmoothingWidth_Sv = smoothingWidth_Sv;
    }

    /// <summary>The flow law.</summary>
    public StommelFlowLaw FlowLaw { get; }

    /// <summary>ε of the smoothed flow law, in Sv.</summary>
    public double SmoothingWidth_Sv { get; }

    /// <inheritdoc />
    public int Dimension => 2;

    /// <inheritdoc />
    public int ParameterCount => Defaults.Length;

    /// <inheritdoc />
    public string GetParameterName(int index) => Defaults[index].Name;

    /// <inheritdoc />
    public void GetParameters(Span<double> destination) => _p.CopyTo(destination);

    /// <summary>The overturning flow q = k (α ΔT − β ΔS) in Sv for a state (ΔT in K, ΔS in g/kg) and parameters.</summary>
    public static double Flow_Sv(ReadOnlySpan<double> state, ReadOnlySpan<double> parameters) =>
        parameters[4] * (parameters[6] * state[0] - parameters[7] * state[1]);

    /// <summary>The overturning flow in Sv with the model's current parameters.</summary>
    public double Flow_Sv(ReadOnlySpan<double> state) => Flow_Sv(state, _p);

    /// <summary>
    /// The nondimensional groups (η1, η2, η3) and the scale λ = 2 τ_T k / V of the equivalent
    /// <see cref="StommelBoxModel"/> (T = λαΔT, S = λβΔS, time in units of τ_T).
    /// </summary>
    public static (double Eta1, double Eta2, double Eta3, double Lambda) NondimensionalGroups(ReadOnlySpan<double> p)
    {
        double dTStar = p[0], tauT_s = p[1] * SecondsPerYear, rate = p[2], f = p[3] * CubicMetresPerSecondPerSv,
            k = p[4] * CubicMetresPerSecondPerSv, v = p[5], alpha = p[6], beta = p[7], s0 = p[8];
        double lambda = 2 * tauT_s * k / v;
        return (lambda * alpha * dTStar, 2 * lambda * beta * tauT_s * s0 * f / v, p[1] * rate, lambda);
    }

    /// <inheritdoc />
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        var p = _p;
        Rhs(y, dydt, T.CreateChecked(p[0]), T.CreateChecked(p[1]), T.CreateChecked(p[2]), T.CreateChecked(p[3]), T.CreateChecked(p[4]),
            T.CreateChecked(p[5]), T.CreateChecked(p[6]), T.CreateChecked(p[7]), T.CreateChecked(p[8]));
    }

    /// <inheritdoc />
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> =>
        Rhs(y, dydt, p[0], p[1], p[2], p[3], p[4], p[5], p[6], p[7], p[8]);

    private void Rhs<T>(ReadOnlySpan<T> y, Span<T> dydt, T dTStar, T tauT, T salinityRate, T freshwater_Sv, T k_Sv, T volume, T alpha, T beta, T s0)
        where T : struct, IFloatingPointIeee754<T>
    {
        T secondsPerYear = T.CreateChecked(SecondsPerYear), sv = T.CreateChecked(CubicMetresPerSecondPerSv), two = T.CreateChecked(2.0);
        T dT = y[0], dS = y[1];
        T q_Sv = k_Sv * (alpha * dT - beta * dS);
        T exchange_Sv = FlowLaw == StommelFlowLaw.Absolute
            ? T.Abs(q_Sv)
            : T.Sqrt(q_Sv * q_Sv + T.CreateChecked(SmoothingWidth_Sv * SmoothingWidth_Sv));
        // 2|q|/V in 1/yr.
        T mixing = two * exchange_Sv * sv * secondsPerYear / volume;
        T saltForcing = two * s0 * freshwater_Sv * sv * secondsPerYear / volume;
        dydt[0] = (dTStar - dT) / tauT - mixing * dT;
        dydt[1] = saltForcing - salinityRate * dS - mixing * dS;
    }

    /// <inheritdoc />
    public ModelDescription Description => new()
    {
        Name = FlowLaw == StommelFlowLaw.Absolute ? "stommel-dimensional" : "stommel-dimensional-smooth",
        Title = "Stommel (1961) two-box thermohaline model, dimensional (K, g/kg, Sv, years)",
        TimeUnit = "yr",
        StateVariables =
        [
            new("dT", "K", "low-latitude minus high-latitude temperature"),
            new("dS", "g/kg", "low-latitude minus high-latitude salinity"),
        ],
        Parameters = Defaults.Select((d, i) => d with { DefaultValue = _p[i] }).ToArray(),
        Equations =
        [
            "dΔT/dt = (ΔT* − ΔT)/τ_T − 2·E(q)·ΔT/V",
            "dΔS/dt = 2·S0·F/V − ΔS/τ_S − 2·E(q)·ΔS/V",
            "q = k·(α·ΔT − β·ΔS)   [Sv; q > 0 thermally driven]",
            FlowLaw == StommelFlowLaw.Absolute ? "E(q) = |q|" : $"E(q) = √(q² + ε²), ε = {SmoothingWidth_Sv:G4} Sv",
            "equivalent nondimensional groups: λ = 2τ_T·k/V, η1 = λ·α·ΔT*, η2 = 2λ·β·τ_T·S0·F/V, η3 = τ_T/τ_S",
        ],
        References =
        [
            "Stommel, H. (1961): Thermohaline convection with two stable regimes of flow. Tellus 13, 224–230.",
            "Linear equation-of-state coefficients: Vallis, G. K. (2017): Atmospheric and Oceanic Fluid Dynamics, 2nd ed., Cambridge (from memory).",
        ],
        Notes =
        [
            "Default values are invented for demonstration, chosen so that η1 = 3 and η3 = 0.3.",
        ],
    };
}
