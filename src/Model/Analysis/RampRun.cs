using System.Collections.Immutable;
using System.Runtime.InteropServices;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>Settings of a quasi-static ramp run: the parameter moves linearly in time from a start to an end value.</summary>
public sealed record RampOptions
{
    /// <summary>Parameter value at the start of the ramp.</summary>
    public required double StartValue { get; init; }

    /// <summary>Parameter value at the end of the ramp.</summary>
    public required double EndValue { get; init; }

    /// <summary>Ramp rate |dp/dt| in parameter units per time unit of the model (the sign follows End − Start).</summary>
    public required double Rate { get; init; }

    /// <summary>Time between stored samples; default: the ramp duration / 1000.</summary>
    public double? SampleInterval { get; init; }

    /// <summary>
    /// Integrator called once per sample interval; when null the whole ramp is one solve of the library's
    /// <see cref="Numerics.Ode.OdeSolver"/> with <see cref="Solver"/> settings and output at the sample times.
    /// </summary>
    public TransientIntegrator? Integrator { get; init; }

    /// <summary>Solver settings used when <see cref="Integrator"/> is null (their output schedule and events are replaced); default automatic method, relative tolerance 1e-8, absolute 1e-10.</summary>
    public Numerics.Ode.SolverOptions? Solver { get; init; }

    /// <summary>Model time at the start of the ramp.</summary>
    public double StartTime { get; init; }

    /// <summary>Optional: stop the ramp at the first sample where this holds (for example after a collapse, or before a state runs away).</summary>
    public StatePredicate? StopWhen { get; init; }

    /// <summary>Polish the initial state to the equilibrium at the start value (Newton) before ramping, so the run starts on the branch.</summary>
    public bool StartOnEquilibrium { get; init; } = true;

    internal void Validate(string parameterName)
    {
        if (!double.IsFinite(StartValue) || !double.IsFinite(EndValue) || StartValue == EndValue)
            throw new ArgumentException($"The ramp of '{parameterName}' needs finite, different start and end values; got {StartValue:G6} → {EndValue:G6}.", nameof(StartValue));
        if (!(Rate > 0) || !double.IsFinite(Rate))
            throw new ArgumentOutOfRangeException(nameof(Rate), Rate, $"The ramp rate of '{parameterName}' must be a positive finite number (parameter units per time unit).");
        if (SampleInterval is double dt && (!(dt > 0) || !double.IsFinite(dt)))
            throw new ArgumentOutOfRangeException(nameof(SampleInterval), dt, "The sample interval must be a positive finite time.");
        if (!double.IsFinite(StartTime)) throw new ArgumentOutOfRangeException(nameof(StartTime), StartTime, "The start time must be finite.");
    }
}

/// <summary>The trajectory of a ramp run, sampled at regular times.</summary>
public sealed record RampTrajectory
{
    /// <summary>Name of the ramped parameter.</summary>
    public required string ParameterName { get; init; }

    /// <summary>Index of the ramped parameter.</summary>
    public required int ParameterIndex { get; init; }

    /// <summary>Signed ramp rate dp/dt (parameter units per time unit).</summary>
    public required double Rate { get; init; }

    /// <summary>Sample times (model time unit).</summary>
    public required ImmutableArray<double> Times { get; init; }

    /// <summary>Parameter value at each sample.</summary>
    public required ImmutableArray<double> ParameterValues { get; init; }

    /// <summary>State at each sample.</summary>
    public required IReadOnlyList<ImmutableArray<double>> States { get; init; }

    /// <summary>True if the run stopped before the end value (a stop condition, or the integrator failed).</summary>
    public bool EndedEarly { get; init; }

    /// <summary>Why it stopped early (empty otherwise).</summary>
    public string Message { get; init; } = "";
}

/// <summary>How a ramp run compares with the quasi-static branch.</summary>
public sealed record RampComparison
{
    /// <summary>Per sample: scaled distance from the nearest stable equilibrium of the branch at the same parameter value, or from the fold state once past the fold; NaN if neither applies.</summary>
    public required ImmutableArray<double> Distance { get; init; }

    /// <summary>The fold (or non-smooth turning point) of the branch the ramp runs past; null if it passes none.</summary>
    public SpecialPoint? Fold { get; init; }

    /// <summary>Parameter value where the distance first exceeds the tolerance (interpolated between samples); null if the run never leaves the branch.</summary>
    public double? DepartureParameter { get; init; }

    /// <summary>Time of departure; null if none.</summary>
    public double? DepartureTime { get; init; }

    /// <summary>How far past the fold, in the direction of the ramp, the run departs (parameter units); negative if it leaves before the fold; null if either is missing.</summary>
    public double? Overshoot { get; init; }

    /// <summary>One sentence with the numbers.</summary>
    public required string Summary { get; init; }
}

/// <summary>
/// Quasi-static ramp runs: a transient run in which one parameter changes linearly in time, for
/// comparison with the continued branch of equilibria. At a finite rate the state lags the branch and
/// overshoots a fold before it jumps (for the saddle-node the delay scales as rate^(2/3); Haberman,
/// SIAM J. Appl. Math. 37, 69, 1979).
/// </summary>
public static class RampRun
{
    private static readonly Numerics.Ode.SolverOptions DefaultSolver = new()
    {
        Method = Numerics.Ode.OdeMethod.Auto,
        RelativeTolerance = 1e-8,
        AbsoluteTolerance = 1e-10,
    };

    /// <summary>Collects output rows; stops recording after the first row where the stop condition holds.</summary>
    private sealed class SampleSink(Action<double, ReadOnlySpan<double>> add, StatePredicate? stopWhen) : Numerics.Ode.IOutputSink
    {
        public bool Stopped { get; private set; }

        public void Write(double t, ReadOnlySpan<double> y)
        {
            if (Stopped) return;
            add(t, y);
            if (stopWhen is not null && stopWhen(y)) Stopped = true;
        }
    }

    /// <summary>Runs the ramp of parameter <paramref name="parameterName"/>.</summary>
    public static RampTrajectory Run(IParametricSystem system, string parameterName, ReadOnlySpan<double> initialState, ReadOnlySpan<double> parameters, RampOptions options)
    {
        ArgumentNullException.ThrowIfNull(system);
        return Run(system, ParameterLookup.IndexOf(system, parameterName, nameof(parameterName)), initialState, parameters, options);
    }

    /// <summary>Runs the ramp of parameter <paramref name="parameterIndex"/> from <paramref name="initialState"/> (other parameters from <paramref name="parameters"/>).</summary>
    /// <exception cref="SteadyStateNotFoundException">With <see cref="RampOptions.StartOnEquilibrium"/>, no equilibrium near the initial state at the start value.</exception>
    public static RampTrajectory Run(IParametricSystem system, int parameterIndex, ReadOnlySpan<double> initialState, ReadOnlySpan<double> parameters, RampOptions options)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(options);
        string name = ParameterLookup.CheckRunArguments(system, parameterIndex, initialState, parameters);
        options.Validate(name);
        int n = system.Dimension;
        var p = parameters.ToArray();
        p[parameterIndex] = options.StartValue;
        var state = initialState.ToArray();
        if (options.StartOnEquilibrium)
        {
            var start = SteadyState.Solve(system, state, p);
            if (!start.Converged) throw new SteadyStateNotFoundException($"Cannot start the ramp of '{name}' on an equilibrium: {start.Diagnosis}", start);
            start.State.CopyTo(state);
        }
        double signedRate = Math.Sign(options.EndValue - options.StartValue) * options.Rate;
        double duration = Math.Abs(options.EndValue - options.StartValue) / options.Rate;
        double dt = options.SampleInterval ?? duration / 1000;
        var view = new ParameterOverrideSystem(system, p, parameterIndex, options.StartValue, signedRate, options.StartTime);
        int samples = (int)Math.Ceiling(duration / dt - 1e-9);
        var times = new List<double>(samples + 1);
        var values = new List<double>(samples + 1);
        var states = new List<ImmutableArray<double>>(samples + 1);
        double endTime = options.StartTime + duration;
        string message = "";
        void Add(double time, ReadOnlySpan<double> y)
        {
            times.Add(time);
            values.Add(time >= endTime ? options.EndValue : view.RampValue(time));
            states.Add([.. y]);
        }
        if (options.Integrator is TransientIntegrator integrate)
        {
            double t = options.StartTime;
            Add(t, state);
            for (int k = 1; k <= samples; k++)
            {
                double next = k == samples ? endTime : options.StartTime + k * dt;
                try
                {
                    integrate(view, t, next, state);
                }
                catch (Numerics.Ode.OdeSolverException e)
                {
                    message = $"The integration failed between t = {t:G8} and {next:G8} ({name} ≈ {view.RampValue(t):G8}): {e.Message}";
                    break;
                }
                t = next;
                Add(t, state);
                if (options.StopWhen is not null && options.StopWhen(state))
                {
                    if (k < samples) message = $"Stopped by the stop condition at t = {t:G8} ({name} = {values[^1]:G8}).";
                    break;
                }
            }
        }
        else
        {
            // One solve with output at the sample times; the stop condition is a terminal event.
            var solver = (options.Solver ?? DefaultSolver) with { Output = Numerics.Ode.OutputTimes.Uniform(dt) };
            var sink = new SampleSink(Add, options.StopWhen);
            var stopWhen = options.StopWhen;
            Numerics.Ode.OdeEvent[]? events = stopWhen is null ? null :
            [
                new Numerics.Ode.OdeEvent { Name = "stop condition", Function = (_, y) => stopWhen(y) ? 1 : -1, Direction = Numerics.Ode.EventDirection.Rising, Terminal = true },
            ];
            try
            {
                var result = Numerics.Ode.OdeSolver.Solve(view, options.StartTime, state, endTime, solver, sink, events);
                if (result.Status == Numerics.Ode.SolveStatus.TerminatedByEvent)
                {
                    if (!sink.Stopped) { var final = result.FinalState.ToArray(); Add(result.FinalTime, final); }
                    message = $"Stopped by the stop condition at t = {times[^1]:G8} ({name} = {values[^1]:G8}).";
                }
                else if (times[^1] < endTime && !sink.Stopped)
                {
                    Add(endTime, result.FinalState.ToArray());
                }
            }
            catch (Numerics.Ode.OdeSolverException e)
            {
                message = $"The integration failed near t = {e.Time:G8} ({name} ≈ {view.RampValue(e.Time):G8}): {e.Message}";
            }
        }
        return new RampTrajectory
        {
            ParameterName = name,
            ParameterIndex = parameterIndex,
            Rate = signedRate,
            Times = [.. times],
            ParameterValues = [.. values],
            States = states,
            EndedEarly = message.Length > 0,
            Message = message,
        };
    }

    /// <summary>
    /// Compares a ramp run with the continued branch. The run starts on a stable piece of the branch
    /// (the one nearest its initial state); per sample, the distance (max over components of
    /// |Δx_i|/scale_i) is measured from that piece at the same parameter value, and once the ramp is
    /// beyond the end of the piece (a fold, a non-smooth turning point or a Hopf point), from the state at
    /// that end, the "ghost" the run lingers near. The departure is where the distance first exceeds
    /// <paramref name="departureTolerance"/> (interpolated between samples).
    /// </summary>
    /// <param name="ramp">The ramp run.</param>
    /// <param name="branch">The branch of equilibria in the same parameter (with stability computed).</param>
    /// <param name="departureTolerance">Distance (scaled) that counts as having left the branch; it must exceed the lag of the run behind the branch.</param>
    /// <param name="stateScale">Per-variable scales of the distance, or null for 1.</param>
    public static RampComparison Compare(RampTrajectory ramp, Branch branch, double departureTolerance, IReadOnlyList<double>? stateScale = null)
    {
        ArgumentNullException.ThrowIfNull(ramp);
        ArgumentNullException.ThrowIfNull(branch);
        if (branch.ParameterIndex != ramp.ParameterIndex)
            throw new ArgumentException($"The branch is in '{branch.ParameterName}' but the ramp varies '{ramp.ParameterName}'.", nameof(branch));
        if (!(departureTolerance > 0)) throw new ArgumentOutOfRangeException(nameof(departureTolerance), departureTolerance, "The departure tolerance must be positive.");
        int n = ramp.States[0].Length;
        if (stateScale is not null && stateScale.Count != n) throw new ArgumentException($"stateScale has {stateScale.Count} entries; the state has {n}.", nameof(stateScale));
        double direction = Math.Sign(ramp.Rate);
        var pts = branch.Points;
        var interpolated = new double[n];
        double Dist(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
        {
            double m = 0;
            for (int i = 0; i < n; i++) m = Math.Max(m, Math.Abs(a[i] - b[i]) / (stateScale?[i] ?? 1));
            return m;
        }
        bool Interpolate(int i, double p)
        {
            var a = pts[i]; var b = pts[i + 1];
            double lo = Math.Min(a.Parameter, b.Parameter), hi = Math.Max(a.Parameter, b.Parameter);
            if (p < lo || p > hi || hi == lo) return false;
            double alpha = (p - a.Parameter) / (b.Parameter - a.Parameter);
            for (int j = 0; j < n; j++) interpolated[j] = a.State[j] + alpha * (b.State[j] - a.State[j]);
            return true;
        }
        static bool IsEnd(ContinuationPoint c) => c.Type is BranchPointType.Fold or BranchPointType.NonSmoothTurn or BranchPointType.Hopf;

        // The stable segment nearest the initial state, grown to its stable piece (plus the special points bounding it).
        double p0 = ramp.ParameterValues[0];
        int seed = -1;
        double seedDistance = double.PositiveInfinity;
        for (int i = 0; i + 1 < pts.Count; i++)
        {
            if (pts[i].Stability != StabilityType.Stable || pts[i + 1].Stability != StabilityType.Stable || !Interpolate(i, p0)) continue;
            double d = Dist(ramp.States[0].AsSpan(), interpolated);
            if (d < seedDistance) { seedDistance = d; seed = i; }
        }
        int first = seed, last = seed + 1;
        if (seed >= 0)
        {
            while (first > 0 && pts[first - 1].Stability == StabilityType.Stable) first--;
            while (last + 1 < pts.Count && pts[last + 1].Stability == StabilityType.Stable) last++;
            if (first > 0 && IsEnd(pts[first - 1])) first--;
            if (last + 1 < pts.Count && IsEnd(pts[last + 1])) last++;
        }
        // The end of the piece the ramp runs toward.
        ContinuationPoint? end = null;
        if (seed >= 0)
        {
            var e1 = pts[first]; var e2 = pts[last];
            end = direction * (e1.Parameter - e2.Parameter) > 0 ? e1 : e2;
        }
        var distance = new double[ramp.Times.Length];
        int departure = -1;
        for (int k = 0; k < distance.Length; k++)
        {
            double p = ramp.ParameterValues[k];
            var x = ramp.States[k].AsSpan();
            double best = double.PositiveInfinity;
            if (seed >= 0)
            {
                for (int i = first; i < last; i++)
                    if (Interpolate(i, p)) best = Math.Min(best, Dist(x, interpolated));
                if (double.IsPositiveInfinity(best) && end is not null && direction * (p - end.Parameter) >= 0)
                    best = Dist(x, end.State.AsSpan());
            }
            distance[k] = double.IsPositiveInfinity(best) ? double.NaN : best;
            if (departure < 0 && distance[k] > departureTolerance) departure = k;
        }
        double? departureParameter = null, departureTime = null;
        if (departure >= 0)
        {
            double frac = 1;
            if (departure > 0 && double.IsFinite(distance[departure - 1]))
                frac = (departureTolerance - distance[departure - 1]) / (distance[departure] - distance[departure - 1]);
            int k0 = Math.Max(departure - 1, 0);
            departureParameter = ramp.ParameterValues[k0] + frac * (ramp.ParameterValues[departure] - ramp.ParameterValues[k0]);
            departureTime = ramp.Times[k0] + frac * (ramp.Times[departure] - ramp.Times[k0]);
        }
        SpecialPoint? fold = end is not null && IsEnd(end) && end.SpecialPointIndex >= 0 ? branch.SpecialPoints[end.SpecialPointIndex] : null;
        double? overshoot = fold is not null && departureParameter is double dp ? direction * (dp - fold.Parameter) : null;
        string summary = seed < 0
            ? $"The ramp of '{ramp.ParameterName}' does not start on a stable part of the branch; nothing to compare."
            : departureParameter is null
                ? $"The ramp of '{ramp.ParameterName}' at {Math.Abs(ramp.Rate):G4} per time unit stays within {departureTolerance:G3} of the branch."
                : fold is null
                    ? $"The ramp of '{ramp.ParameterName}' at {Math.Abs(ramp.Rate):G4} per time unit leaves the branch at {ramp.ParameterName} = {departureParameter:G8}."
                    : $"The ramp of '{ramp.ParameterName}' at {Math.Abs(ramp.Rate):G4} per time unit leaves the branch at {ramp.ParameterName} = {departureParameter:G8}, {overshoot:G4} beyond the {fold.Kind} at {fold.Parameter:G8}.";
        return new RampComparison
        {
            Distance = ImmutableCollectionsMarshal.AsImmutableArray(distance),
            Fold = fold,
            DepartureParameter = departureParameter,
            DepartureTime = departureTime,
            Overshoot = overshoot,
            Summary = summary,
        };
    }
}
