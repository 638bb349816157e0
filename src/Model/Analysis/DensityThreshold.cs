using System.Globalization;
using Thermostrat.Model.Seawater;

namespace Thermostrat.Model.Analysis;

/// <summary>
/// The density-threshold calculator: how much the first of two water masses must freshen (or
/// warm) for its density to equal the second's.
/// </summary>
/// <remarks>
/// <para>The salinity change solves ρ(S1 + ΔS, T1, p1) = ρ2 and the temperature change
/// ρ(S1, T1 + ΔT, p1) = ρ2, each by Newton's method with the equation of state's analytic
/// derivatives (∂ρ/∂S = ρβ, ∂ρ/∂T = −ρα), safeguarded by bisection inside a bracket. The search is
/// confined to the accepted range (S 0–42 g/kg, T −2–40 °C). The range is first cut where the
/// derivative changes sign (by bisection on the derivative, after sampling it every 0.5 unit), so
/// that each piece is monotonic and holds at most one root; a piece whose ends do not bracket the
/// target has none. Of several roots the one closest to the starting value is reported; with none,
/// the reason states the density range that is reachable.</para>
/// <para>Freshwater equivalent (convention): mixing h_f metres of fresh water into a layer of
/// thickness H and salinity S gives S' = S·H/(H + h_f), so h_f = H (S/S' − 1) with S' = S + ΔS.</para>
/// <para>The density ratio R = αΔT/(βΔS) uses α and β at the mid-point of the two water masses
/// (common practice, as for the Turner angle).</para>
/// </remarks>
public static class DensityThreshold
{
    /// <summary>Spacing of the derivative samples that locate turning points, in g/kg or K.</summary>
    private const double SampleSpacing = 0.5;

    /// <summary>Bisection steps that locate a turning point (bracket shrinks by 2⁻⁶⁰).</summary>
    private const int TurningPointBisections = 60;

    /// <summary>Solves the threshold problem for two water masses under one equation of state.</summary>
    /// <param name="eos">The equation of state.</param>
    /// <param name="first">The water mass whose salinity or temperature is changed.</param>
    /// <param name="second">The water mass whose density is the target.</param>
    /// <param name="layerThickness_m">Thickness H of the first's layer, m (positive), for the freshwater equivalent.</param>
    /// <param name="options">Settings; defaults as in <see cref="DensityThresholdOptions"/>.</param>
    /// <exception cref="ArgumentOutOfRangeException">The thickness is not a positive finite number, or an option is invalid.</exception>
    public static DensityThresholdResult Solve(IEquationOfState eos, WaterMass first, WaterMass second,
        double layerThickness_m, DensityThresholdOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(eos);
        ArgumentNullException.ThrowIfNull(first);
        ArgumentNullException.ThrowIfNull(second);
        CheckThickness(layerThickness_m);
        options ??= new DensityThresholdOptions();
        options.Validate();

        double p1 = options.ReferencePressure_dbar ?? first.Pressure_dbar;
        double p2 = options.ReferencePressure_dbar ?? second.Pressure_dbar;
        double s1 = first.Salinity, t1 = first.Temperature;
        double rho1 = eos.Density(s1, t1, p1);
        double rho2 = eos.Density(second.Salinity, second.Temperature, p2);

        double sMid = 0.5 * (s1 + second.Salinity), tMid = 0.5 * (t1 + second.Temperature), pMid = 0.5 * (p1 + p2);
        double alpha = eos.ThermalExpansion(sMid, tMid, pMid);
        double beta = eos.HalineContraction(sMid, tMid, pMid);
        double ratio = alpha * (t1 - second.Temperature) / (beta * (s1 - second.Salinity));

        var salinityRoot = SolveNearest(
            s => eos.Density(s, t1, p1) - rho2,
            s => eos.Density(s, t1, p1) * eos.HalineContraction(s, t1, p1),
            s1, SeawaterRange.MinSalinity, SeawaterRange.MaxSalinity, options);
        ThresholdChange salinityChange = salinityRoot.Found
            ? Converged(salinityRoot, s1, "salinity", options)
            : ThresholdChange.None(Describe("salinity", "g/kg", SeawaterRange.MinSalinity, SeawaterRange.MaxSalinity,
                $"at its own temperature {Fmt(t1)} °C", salinityRoot, rho2));

        var temperatureRoot = SolveNearest(
            t => eos.Density(s1, t, p1) - rho2,
            t => -eos.Density(s1, t, p1) * eos.ThermalExpansion(s1, t, p1),
            t1, SeawaterRange.MinTemperature, SeawaterRange.MaxTemperature, options);
        ThresholdChange temperatureChange = temperatureRoot.Found
            ? Converged(temperatureRoot, t1, "temperature", options)
            : ThresholdChange.None(Describe("temperature", "°C", SeawaterRange.MinTemperature, SeawaterRange.MaxTemperature,
                $"at its own salinity {Fmt(s1)} g/kg", temperatureRoot, rho2));

        return new DensityThresholdResult
        {
            EquationOfState = eos.Name,
            First = first,
            Second = second,
            LayerThickness_m = layerThickness_m,
            PressureFirst_dbar = p1,
            PressureSecond_dbar = p2,
            DensityFirst_kgm3 = rho1,
            DensitySecond_kgm3 = rho2,
            DensityDifference_kgm3 = rho1 - rho2,
            ThermalExpansion_perK = alpha,
            HalineContraction_perGkg = beta,
            DensityRatio = ratio,
            SalinityChange_gkg = salinityChange,
            FreshwaterInput_m = Freshwater(s1, salinityChange, layerThickness_m),
            TemperatureChange_K = temperatureChange,
        };
    }

    /// <summary>The same problem under several equations of state, side by side, in the order given.</summary>
    /// <exception cref="ArgumentOutOfRangeException">As <see cref="Solve"/>.</exception>
    public static IReadOnlyList<DensityThresholdResult> SolveAll(IEnumerable<IEquationOfState> equationsOfState,
        WaterMass first, WaterMass second, double layerThickness_m, DensityThresholdOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(equationsOfState);
        CheckThickness(layerThickness_m);
        return equationsOfState.Select(eos => Solve(eos, first, second, layerThickness_m, options)).ToList();
    }

    /// <summary>The same problem under every equation of state of <see cref="EquationsOfState.Names"/>, side by side.</summary>
    /// <param name="first">The water mass whose salinity or temperature is changed.</param>
    /// <param name="second">The water mass whose density is the target.</param>
    /// <param name="layerThickness_m">Thickness of the first's layer, m (positive).</param>
    /// <param name="options">Settings.</param>
    /// <param name="linear">Coefficients of the linear equation of state; its defaults when <c>null</c>.</param>
    public static IReadOnlyList<DensityThresholdResult> SolveAll(WaterMass first, WaterMass second,
        double layerThickness_m, DensityThresholdOptions? options = null, LinearEosParameters? linear = null) =>
        SolveAll(EquationsOfState.Names.Select(n => EquationsOfState.Create(n, linear)), first, second, layerThickness_m, options);

    /// <summary>h_f = H (S/S' − 1), S' = S + ΔS; see the class remarks.</summary>
    internal static ThresholdChange Freshwater(double salinity, ThresholdChange salinityChange, double thickness_m)
    {
        if (!salinityChange.Found)
            return ThresholdChange.None("no salinity change equalises the densities (see the salinity change).");
        double newSalinity = salinity + salinityChange.Value;
        if (salinityChange.Value == 0.0)
            return ThresholdChange.Solved(0.0, 0);
        if (newSalinity <= 0.0)
            return ThresholdChange.None("the salinity would have to fall to 0 g/kg, which no finite amount of fresh water achieves.");
        if (salinity == 0.0)
            return ThresholdChange.None("the layer is fresh (0 g/kg): removing fresh water cannot make it saltier.");
        return ThresholdChange.Solved(thickness_m * (salinity / newSalinity - 1.0), 0);
    }

    private static ThresholdChange Converged(RootSearch root, double start, string quantity, DensityThresholdOptions options) =>
        root.Converged
            ? ThresholdChange.Solved(root.Value - start, root.Iterations)
            : ThresholdChange.None(string.Create(CultureInfo.InvariantCulture,
                $"the {quantity} iteration did not reach the density tolerance {options.DensityTolerance_kgm3} kg/m³ within MaxIterations = {options.MaxIterations}."));

    private static void CheckThickness(double layerThickness_m)
    {
        if (!(layerThickness_m > 0) || !double.IsFinite(layerThickness_m))
        {
            throw new ArgumentOutOfRangeException(nameof(layerThickness_m), layerThickness_m, string.Create(CultureInfo.InvariantCulture,
                $"layerThickness_m = {layerThickness_m} m is not allowed: the layer thickness must be a finite number of metres greater than 0."));
        }
    }

    private static string Describe(string quantity, string unit, double lo, double hi, string condition, RootSearch search, double target) =>
        string.Create(CultureInfo.InvariantCulture,
            $"no {quantity} in {lo} to {hi} {unit} makes the first water mass ({condition}) as dense as the second ({Fmt(target)} kg/m³): " +
            $"over that range its density only spans {Fmt(search.MinValue + target)} to {Fmt(search.MaxValue + target)} kg/m³.");

    private static string Fmt(double value) => value.ToString("0.######", CultureInfo.InvariantCulture);

    /// <summary>Outcome of a root search: the root nearest the start, or the range of f seen.</summary>
    internal readonly record struct RootSearch(bool Found, double Value, int Iterations, double MinValue, double MaxValue, bool Converged = true);

    /// <summary>
    /// The root of f in [lo, hi] nearest x0. f' is given analytically; the interval is cut into
    /// pieces on which f' keeps its sign, and each piece that brackets a root is solved by
    /// safeguarded Newton.
    /// </summary>
    internal static RootSearch SolveNearest(Func<double, double> f, Func<double, double> df, double x0, double lo, double hi,
        DensityThresholdOptions options)
    {
        double f0 = f(x0);
        if (Math.Abs(f0) <= options.DensityTolerance_kgm3)
            return new RootSearch(true, x0, 0, f0, f0);

        // Turning points of f: sign changes of f' on a grid, refined by bisection.
        var cuts = new List<double> { lo };
        int samples = (int)Math.Ceiling((hi - lo) / SampleSpacing);
        double xPrev = lo, dPrev = df(lo);
        for (int n = 1; n <= samples; n++)
        {
            double x = n == samples ? hi : lo + n * SampleSpacing;
            double d = df(x);
            if (d == 0.0 && n < samples)
                cuts.Add(x); // a turning point exactly on the grid
            else if (Math.Sign(d) * Math.Sign(dPrev) < 0)
                cuts.Add(TurningPoint(df, xPrev, x, dPrev));
            xPrev = x;
            dPrev = d;
        }
        cuts.Add(hi);

        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        bool found = false, bestConverged = true;
        double best = double.NaN;
        int bestIterations = 0;
        for (int piece = 0; piece + 1 < cuts.Count; piece++)
        {
            double a = cuts[piece], b = cuts[piece + 1];
            double fa = f(a), fb = f(b);
            min = Math.Min(min, Math.Min(fa, fb));
            max = Math.Max(max, Math.Max(fa, fb));
            if (Math.Sign(fa) * Math.Sign(fb) > 0) continue; // monotonic piece without a root
            (double root, int iterations, bool converged) = SafeguardedNewton(f, df, a, b, fa, Math.Clamp(x0, a, b), options);
            if (!found || Math.Abs(root - x0) < Math.Abs(best - x0))
            {
                found = true;
                best = root;
                bestIterations = iterations;
                bestConverged = converged;
            }
        }
        return new RootSearch(found, best, bestIterations, min, max, bestConverged);
    }

    private static double TurningPoint(Func<double, double> df, double a, double b, double da)
    {
        for (int n = 0; n < TurningPointBisections; n++)
        {
            double m = 0.5 * (a + b);
            double dm = df(m);
            if (Math.Sign(dm) == Math.Sign(da)) { a = m; da = dm; } else b = m;
        }
        return 0.5 * (a + b);
    }

    /// <summary>Newton's method kept inside the bracket [a, b] (f(a), f(b) of opposite sign or zero), bisecting when a step leaves it.</summary>
    private static (double Root, int Iterations, bool Converged) SafeguardedNewton(Func<double, double> f, Func<double, double> df,
        double a, double b, double fa, double x, DensityThresholdOptions options)
    {
        if (fa == 0) return (a, 0, true);
        double tol = options.DensityTolerance_kgm3;
        for (int iteration = 1; iteration <= options.MaxIterations; iteration++)
        {
            double fx = f(x);
            if (Math.Abs(fx) <= tol) return (x, iteration, true);
            // Keep the bracket: the end with f of the sign of fa moves to x, or the other end does.
            if (Math.Sign(fx) == Math.Sign(fa)) { a = x; fa = fx; } else b = x;
            double d = df(x);
            double next = d != 0 ? x - fx / d : double.NaN;
            if (!(next > Math.Min(a, b) && next < Math.Max(a, b))) next = 0.5 * (a + b);
            if (Math.Abs(b - a) <= 4 * double.Epsilon + 1e-15 * Math.Abs(x)) return (next, iteration, true); // bracket at rounding level
            x = next;
        }
        return (x, options.MaxIterations, false);
    }
}
