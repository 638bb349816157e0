using System.Collections.Immutable;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>Settings of <see cref="ThresholdBisection"/>.</summary>
public sealed record ThresholdOptions
{
    /// <summary>One end of the parameter interval searched.</summary>
    public required double Lower { get; init; }

    /// <summary>The other end (above <see cref="Lower"/>).</summary>
    public required double Upper { get; init; }

    /// <summary>Length of each transient run (model time unit).</summary>
    public required double Duration { get; init; }

    /// <summary>The quantity watched (for example a ventilation transport).</summary>
    public required StateDiagnostic Diagnostic { get; init; }

    /// <summary>
    /// A run has collapsed once the diagnostic falls below this level: a fraction of its value in the
    /// initial state when <see cref="RelativeLevel"/> (default 0.1, "below 10 % of its start"), else an absolute value.
    /// </summary>
    public double Level { get; init; } = 0.1;

    /// <summary>Whether <see cref="Level"/> is a fraction of the initial diagnostic (true) or an absolute value.</summary>
    public bool RelativeLevel { get; init; } = true;

    /// <summary>Stop bisecting when the bracket is this narrow (parameter units); default 1e-6 of the interval.</summary>
    public double? Tolerance { get; init; }

    /// <summary>Largest number of transient runs.</summary>
    public int MaxRuns { get; init; } = 80;

    /// <summary>How often the diagnostic is checked during a run (a run stops at collapse); default Duration/200.</summary>
    public double? CheckInterval { get; init; }

    /// <summary>Integrator; <see cref="TransientIntegrators.Default"/> when null.</summary>
    public TransientIntegrator? Integrator { get; init; }

    /// <summary>Model time at the start of each run.</summary>
    public double StartTime { get; init; }

    /// <summary>Special points (for example a branch's folds) to compare the threshold with; the nearest fold or non-smooth turning point is reported.</summary>
    public IEnumerable<SpecialPoint>? Folds { get; init; }

    internal void Validate(string parameterName)
    {
        if (!double.IsFinite(Lower) || !double.IsFinite(Upper) || !(Lower < Upper))
            throw new ArgumentException($"The search interval of '{parameterName}' is empty or inverted: Lower = {Lower:G6}, Upper = {Upper:G6}; Lower must be finite and below Upper.", nameof(Lower));
        if (!(Duration > 0) || !double.IsFinite(Duration))
            throw new ArgumentOutOfRangeException(nameof(Duration), Duration, "The run duration must be a positive finite time.");
        if (!double.IsFinite(Level) || (RelativeLevel && !(Level > 0)))
            throw new ArgumentOutOfRangeException(nameof(Level), Level, "The collapse level must be finite (and positive when relative to the initial value).");
        if (Tolerance is double tol && !(tol > 0))
            throw new ArgumentOutOfRangeException(nameof(Tolerance), tol, "The bracket tolerance must be positive.");
        if (MaxRuns < 2) throw new ArgumentOutOfRangeException(nameof(MaxRuns), MaxRuns, "At least two runs (the two ends) are needed.");
        if (CheckInterval is double dt && (!(dt > 0) || !double.IsFinite(dt)))
            throw new ArgumentOutOfRangeException(nameof(CheckInterval), dt, "The check interval must be a positive finite time.");
    }
}

/// <summary>One transient run of a threshold search.</summary>
/// <param name="Parameter">Parameter value of the run.</param>
/// <param name="Collapsed">Whether the diagnostic fell below the level.</param>
/// <param name="CollapseTime">Time (since the start) at which it did, or null.</param>
/// <param name="FinalDiagnostic">Diagnostic at the end of the run (or at collapse).</param>
public sealed record ThresholdRun(double Parameter, bool Collapsed, double? CollapseTime, double FinalDiagnostic);

/// <summary>The collapse threshold found by transient runs, with its bracket.</summary>
public sealed record ThresholdResult
{
    /// <summary>Name of the parameter searched.</summary>
    public required string ParameterName { get; init; }

    /// <summary>True when the two ends of the interval behaved differently, so a threshold lies between them.</summary>
    public required bool Bracketed { get; init; }

    /// <summary>The threshold estimate: the midpoint of the final bracket (NaN if not bracketed).</summary>
    public required double Threshold { get; init; }

    /// <summary>Final bracket end on the side that does not collapse.</summary>
    public required double NotCollapsedAt { get; init; }

    /// <summary>Final bracket end on the side that collapses.</summary>
    public required double CollapsedAt { get; init; }

    /// <summary>Width of the final bracket.</summary>
    public double BracketWidth => Math.Abs(CollapsedAt - NotCollapsedAt);

    /// <summary>The level the diagnostic had to fall below (absolute).</summary>
    public required double AbsoluteLevel { get; init; }

    /// <summary>Every run, in the order made.</summary>
    public required IReadOnlyList<ThresholdRun> Runs { get; init; }

    /// <summary>The fold or non-smooth turning point nearest the threshold, if any were given.</summary>
    public SpecialPoint? NearestFold { get; init; }

    /// <summary>Threshold minus the nearest fold's parameter; null without folds.</summary>
    public double? DifferenceFromFold { get; init; }

    /// <summary>One or two sentences with the numbers.</summary>
    public required string Summary { get; init; }
}

/// <summary>
/// Finds a collapse threshold by transient runs: bisection on a parameter for the value at which a
/// chosen diagnostic, starting from a fixed initial state, falls below a chosen level within a chosen
/// time. Reported with its bracket, and compared with the nearest fold when folds are given (with a
/// finite run length the transient threshold lies beyond the fold: near it the run lingers).
/// </summary>
public static class ThresholdBisection
{
    /// <summary>Searches parameter <paramref name="parameterName"/>.</summary>
    public static ThresholdResult Find(IParametricSystem system, string parameterName, ReadOnlySpan<double> initialState, ReadOnlySpan<double> parameters, ThresholdOptions options)
    {
        ArgumentNullException.ThrowIfNull(system);
        return Find(system, ParameterLookup.IndexOf(system, parameterName, nameof(parameterName)), initialState, parameters, options);
    }

    /// <summary>Searches parameter <paramref name="parameterIndex"/> between <see cref="ThresholdOptions.Lower"/> and <see cref="ThresholdOptions.Upper"/>.</summary>
    public static ThresholdResult Find(IParametricSystem system, int parameterIndex, ReadOnlySpan<double> initialState, ReadOnlySpan<double> parameters, ThresholdOptions options)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(options);
        string name = ParameterLookup.CheckRunArguments(system, parameterIndex, initialState, parameters);
        options.Validate(name);
        int n = system.Dimension;
        var x0 = initialState.ToArray();
        double start = options.Diagnostic(x0);
        if (!double.IsFinite(start)) throw new ArgumentException($"The diagnostic of the initial state is {start}; it must be finite.", nameof(initialState));
        double level = options.RelativeLevel ? options.Level * start : options.Level;
        if (start < level)
            throw new ArgumentException($"The diagnostic starts at {start:G6}, already below the collapse level {level:G6}: nothing can collapse.", nameof(options));
        double tolerance = options.Tolerance ?? 1e-6 * (options.Upper - options.Lower);
        double check = options.CheckInterval ?? options.Duration / 200;
        var integrate = options.Integrator ?? TransientIntegrators.Default;
        var p = parameters.ToArray();
        var runs = new List<ThresholdRun>();
        var state = new double[n];

        ThresholdRun RunAt(double value)
        {
            p[parameterIndex] = value;
            var view = new ParameterOverrideSystem(system, p);
            x0.CopyTo(state, 0);
            double t = options.StartTime, end = options.StartTime + options.Duration;
            double diagnostic = start;
            while (t < end)
            {
                double next = Math.Min(end, t + check);
                integrate(view, t, next, state);
                t = next;
                diagnostic = options.Diagnostic(state);
                if (diagnostic < level) return new ThresholdRun(value, true, t - options.StartTime, diagnostic);
            }
            return new ThresholdRun(value, false, null, diagnostic);
        }

        var lower = RunAt(options.Lower);
        var upper = RunAt(options.Upper);
        runs.Add(lower);
        runs.Add(upper);
        var folds = options.Folds?.Where(f => f.Kind is SpecialPointKind.Fold or SpecialPointKind.NonSmoothTurn).ToList() ?? [];
        if (lower.Collapsed == upper.Collapsed)
        {
            string how = lower.Collapsed ? "collapses" : "does not collapse";
            return new ThresholdResult
            {
                ParameterName = name, Bracketed = false, Threshold = double.NaN,
                NotCollapsedAt = double.NaN, CollapsedAt = double.NaN, AbsoluteLevel = level, Runs = runs,
                Summary = $"No threshold of '{name}' in [{options.Lower:G6}, {options.Upper:G6}]: the run {how} at both ends (level {level:G4}, duration {options.Duration:G4}). Widen the interval or lengthen the runs.",
            };
        }
        double good = lower.Collapsed ? options.Upper : options.Lower;
        double bad = lower.Collapsed ? options.Lower : options.Upper;
        while (Math.Abs(bad - good) > tolerance && runs.Count < options.MaxRuns)
        {
            double mid = 0.5 * (good + bad);
            var r = RunAt(mid);
            runs.Add(r);
            if (r.Collapsed) bad = mid; else good = mid;
        }
        double threshold = 0.5 * (good + bad);
        var nearest = folds.OrderBy(f => Math.Abs(f.Parameter - threshold)).FirstOrDefault();
        double? difference = nearest is null ? null : threshold - nearest.Parameter;
        string summary = $"Threshold of '{name}' at {threshold:G10} (bracket [{Math.Min(good, bad):G10}, {Math.Max(good, bad):G10}], {runs.Count} runs of {options.Duration:G4}): the diagnostic falls below {level:G4}"
            + (Math.Abs(bad - good) > tolerance ? $"; stopped at the run limit {options.MaxRuns} before the bracket reached {tolerance:G3}." : ".")
            + (nearest is null ? "" : $" The nearest {nearest.Kind} is at {nearest.Parameter:G10}, {difference:G4} away.");
        return new ThresholdResult
        {
            ParameterName = name, Bracketed = true, Threshold = threshold, NotCollapsedAt = good, CollapsedAt = bad,
            AbsoluteLevel = level, Runs = runs, NearestFold = nearest, DifferenceFromFold = difference, Summary = summary,
        };
    }
}
