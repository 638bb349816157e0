using System.Numerics;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Models;

/// <summary>
/// Stommel's (1961) two-box thermohaline model in its usual nondimensional form, with temperature
/// relaxation, salinity forcing (with weak salinity relaxation) and exchange proportional to |q|:
/// <code>
///   dT/dt = η1 − T − |q| T
///   dS/dt = η2 − η3 S − |q| S,      q = T − S
/// </code>
/// T and S are the equator-to-pole temperature and salinity differences scaled so that the
/// density-driven flow is q = T − S (q &gt; 0: thermally driven, sinking at the pole; q &lt; 0: salinity
/// driven); time is in units of the temperature relaxation time.
/// </summary>
/// <remarks>
/// Steady states satisfy T = η1/(1 + |q|), S = η2/(η3 + |q|), hence
/// η2 = (η3 + |q|)(η1/(1 + |q|) − q): a closed-form relation used to check the numerics.
/// For η1 = 3, η3 = 0.3 the thermally driven and salinity-driven states coexist for
/// η1·η3 = 0.9 &lt; η2 &lt; η2,fold; the lower end is the corner q = 0 of |q|, the upper a smooth fold.
/// </remarks>
public sealed class StommelBoxModel : IParametricSystem, IDescribedModel
{
    private readonly double _eta1, _eta2, _eta3;

    /// <summary>Creates the model with the given parameter values (defaults η1 = 3, η2 = 1, η3 = 0.3).</summary>
    /// <param name="eta1">η1: scaled relaxation temperature difference.</param>
    /// <param name="eta2">η2: scaled salinity forcing (freshwater flux).</param>
    /// <param name="eta3">η3: ratio of the temperature to the salinity relaxation time.</param>
    /// <param name="flowLaw">|q| or its smooth approximation.</param>
    /// <param name="smoothingWidth">ε of the smoothed law (ignored for <see cref="StommelFlowLaw.Absolute"/>).</param>
    public StommelBoxModel(double eta1 = 3.0, double eta2 = 1.0, double eta3 = 0.3, StommelFlowLaw flowLaw = StommelFlowLaw.Absolute, double smoothingWidth = 0.01)
    {
        Check(eta1, nameof(eta1));
        Check(eta2, nameof(eta2));
        Check(eta3, nameof(eta3));
        if (eta3 < 0) throw new ArgumentOutOfRangeException(nameof(eta3), eta3, "η3 (a ratio of relaxation times) must not be negative.");
        if (flowLaw == StommelFlowLaw.Smoothed && !(smoothingWidth > 0 && double.IsFinite(smoothingWidth)))
            throw new ArgumentOutOfRangeException(nameof(smoothingWidth), smoothingWidth, "The smoothing width ε must be positive and finite.");
        _eta1 = eta1;
        _eta2 = eta2;
        _eta3 = eta3;
        FlowLaw = flowLaw;
        SmoothingWidth = smoothingWidth;
    }

    private static void Check(double v, string name)
    {
        if (!double.IsFinite(v)) throw new ArgumentOutOfRangeException(name, v, $"{name} must be finite.");
    }

    /// <summary>The flow law.</summary>
    public StommelFlowLaw FlowLaw { get; }

    /// <summary>ε of the smoothed flow law.</summary>
    public double SmoothingWidth { get; }

    /// <inheritdoc />
    public int Dimension => 2;

    /// <inheritdoc />
    public int ParameterCount => 3;

    private static readonly string[] Names = ["Eta1", "Eta2", "Eta3"];

    /// <inheritdoc />
    public string GetParameterName(int index) => Names[index];

    /// <inheritdoc />
    public void GetParameters(Span<double> destination)
    {
        destination[0] = _eta1;
        destination[1] = _eta2;
        destination[2] = _eta3;
    }

    /// <summary>The scaled flow q = T − S of a state.</summary>
    public static double Flow(ReadOnlySpan<double> state) => state[0] - state[1];

    /// <inheritdoc />
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> =>
        Rhs(y, dydt, T.CreateChecked(_eta1), T.CreateChecked(_eta2), T.CreateChecked(_eta3));

    /// <inheritdoc />
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> =>
        Rhs(y, dydt, p[0], p[1], p[2]);

    private void Rhs<T>(ReadOnlySpan<T> y, Span<T> dydt, T eta1, T eta2, T eta3) where T : struct, IFloatingPointIeee754<T>
    {
        T temperature = y[0], salinity = y[1];
        T q = temperature - salinity;
        T exchange = FlowLaw == StommelFlowLaw.Absolute
            ? T.Abs(q)
            : T.Sqrt(q * q + T.CreateChecked(SmoothingWidth * SmoothingWidth));
        dydt[0] = eta1 - temperature - exchange * temperature;
        dydt[1] = eta2 - eta3 * salinity - exchange * salinity;
    }

    /// <inheritdoc />
    public ModelDescription Description => new()
    {
        Name = FlowLaw == StommelFlowLaw.Absolute ? "stommel" : "stommel-smooth",
        Title = FlowLaw == StommelFlowLaw.Absolute
            ? "Stommel (1961) two-box thermohaline model, nondimensional, |q| exchange"
            : $"Stommel (1961) two-box thermohaline model, nondimensional, smoothed exchange √(q² + ε²), ε = {SmoothingWidth:G4}",
        TimeUnit = "temperature relaxation time (nondimensional)",
        StateVariables =
        [
            new("T", "1", "equator-minus-pole temperature difference, scaled (α·λ·ΔT)"),
            new("S", "1", "equator-minus-pole salinity difference, scaled (β·λ·ΔS)"),
        ],
        Parameters =
        [
            new("Eta1", "1", _eta1, "η1: relaxation temperature difference, scaled"),
            new("Eta2", "1", _eta2, "η2: salinity forcing (freshwater flux), scaled"),
            new("Eta3", "1", _eta3, "η3: temperature relaxation time / salinity relaxation time"),
        ],
        Equations =
        [
            "dT/dt = η1 − T − E(q)·T",
            "dS/dt = η2 − η3·S − E(q)·S",
            "q = T − S   (q > 0: thermally driven; q < 0: salinity driven)",
            FlowLaw == StommelFlowLaw.Absolute ? "E(q) = |q|" : $"E(q) = √(q² + ε²), ε = {SmoothingWidth:G4}",
            "steady states: η2 = (η3 + E(q))·(η1/(1 + E(q)) − q)",
        ],
        References =
        [
            "Stommel, H. (1961): Thermohaline convection with two stable regimes of flow. Tellus 13, 224–230.",
            "Nondimensional form with η1, η2, η3 as in Kaper, H. and Engler, H. (2013): Mathematics and Climate, SIAM, ch. 6 (from memory), and Dijkstra, H. A. (2005): Nonlinear Physical Oceanography, 2nd ed., Springer (from memory).",
        ],
        Notes =
        [
            "Defaults η1 = 3, η3 = 0.3 are the commonly used textbook values (from memory); η2 = 1 lies in the bistable range.",
            "With |q| the lower end of the bistable range, η2 = η1·η3, is a corner of the flow law (q = 0), not a smooth fold.",
        ],
    };
}
