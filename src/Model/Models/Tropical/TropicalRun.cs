using System.Diagnostics;
using Thermostrat.Model.Configuration;
using Thermostrat.Model.Forcing;
using Thermostrat.Model.Numerics.Ode;
using Thermostrat.Model.Orbital;

namespace Thermostrat.Model.Models.Tropical;

/// <summary>Receives the rows of a run as they are produced (the run keeps none of them).</summary>
public interface IRowSink
{
    /// <summary>Called once before the first row with the columns of every row.</summary>
    void Begin(IReadOnlyList<ColumnInfo> columns);

    /// <summary>One row (values in the order of the columns). The span is valid only during the call.</summary>
    void Write(ReadOnlySpan<double> row);

    /// <summary>Called once after the last row of a run that completed.</summary>
    void End(RunSummary summary);
}

/// <summary>What a run did.</summary>
/// <param name="Rows">Rows written.</param>
/// <param name="FinalTime">Model time at the end (years since the start).</param>
/// <param name="FinalState">State at the end.</param>
/// <param name="AcceptedSteps">Integration steps accepted.</param>
/// <param name="RejectedSteps">Integration steps rejected.</param>
/// <param name="FunctionEvaluations">Right-hand-side evaluations.</param>
/// <param name="JacobianEvaluations">Jacobians formed (stiff method).</param>
/// <param name="FinalMethod">Method in use at the end.</param>
/// <param name="MethodSwitches">Automatic method switches, in words.</param>
/// <param name="WallSeconds">Wall-clock time of the integration.</param>
public sealed record RunSummary(long Rows, double FinalTime, IReadOnlyList<double> FinalState, long AcceptedSteps, long RejectedSteps,
    long FunctionEvaluations, long JacobianEvaluations, string FinalMethod, IReadOnlyList<string> MethodSwitches, double WallSeconds);

/// <summary>
/// Runs the tropical model and streams (time_yr, age_ka, state, diagnostics, forcing) rows to a sink:
/// the library side of the <c>run</c> command, usable without the command-line runner.
/// </summary>
public static class TropicalRun
{
    /// <summary>
    /// Builds a model for a run: the forcing is precomputed over the run's span.
    /// </summary>
    /// <param name="model">Model configuration ("Model").</param>
    /// <param name="run">Run configuration ("Run").</param>
    /// <param name="orbit">Orbit source.</param>
    /// <param name="solarConstant_Wm2">Solar constant (the "Insolation" section's value).</param>
    /// <param name="baseDirectory">Directory for relative forcing file paths.</param>
    /// <param name="catalog">Process catalog (built-in when null).</param>
    /// <exception cref="ConfigurationException">Any configuration problem.</exception>
    public static TropicalBoxModel CreateModel(TropicalModelOptions model, RunOptions run, IOrbitSource orbit, double solarConstant_Wm2 = Insolation.DefaultSolarConstantWm2,
        string baseDirectory = "", ProcessCatalog? catalog = null)
    {
        ArgumentNullException.ThrowIfNull(run);
        OptionsValidator.ThrowIfInvalid(run, "Run");
        var env = new ForcingEnvironment
        {
            Orbit = orbit,
            SolarConstant_Wm2 = solarConstant_Wm2,
            StartAgeKa = run.StartAgeKa,
            DurationYears = run.DurationYears,
            BaseDirectory = baseDirectory,
        };
        return TropicalBoxModel.Create(model, env, catalog);
    }

    /// <summary>
    /// Integrates <paramref name="model"/> from its initial state (or <paramref name="initialState"/>) over the run and
    /// writes one row per output interval (the first at time 0) to <paramref name="sink"/>. With
    /// <see cref="RunOptions.SamplesPerOutput"/> n &gt; 1 each later row is the mean of n samples over the interval that
    /// ends at its time (a final partial interval is not written).
    /// </summary>
    /// <param name="model">A model built for this run's span (see <see cref="CreateModel"/>).</param>
    /// <param name="run">Duration, output spacing, method and tolerances.</param>
    /// <param name="sink">Receives the rows.</param>
    /// <param name="progress">Receives the completed fraction (0 … 1) with output rows (at most about a thousand times, always at the end), or null.</param>
    /// <param name="cancellationToken">Stops the run (OperationCanceledException) between output rows.</param>
    /// <param name="initialState">Start state instead of the configured one, or null.</param>
    /// <exception cref="ConfigurationException">The run does not fit the model's precomputed forcing span, or bad options.</exception>
    /// <exception cref="OdeSolverException">The integration failed (non-finite state, step-size underflow, ...); the exception carries the diagnosis.</exception>
    public static RunSummary Execute(TropicalBoxModel model, RunOptions run, IRowSink sink, IProgress<double>? progress = null,
        CancellationToken cancellationToken = default, IReadOnlyList<double>? initialState = null)
    {
        ArgumentNullException.ThrowIfNull(model);
        ArgumentNullException.ThrowIfNull(run);
        ArgumentNullException.ThrowIfNull(sink);
        OptionsValidator.ThrowIfInvalid(run, "Run");
        var env = model.Forcing.Environment;
        if (Math.Abs(run.StartAgeKa - env.StartAgeKa) > 1e-9 || run.DurationYears > env.DurationYears * (1 + 1e-12))
            throw new ConfigurationException(
                $"Run:StartAgeKa = {run.StartAgeKa} and Run:DurationYears = {run.DurationYears} do not fit the model, whose forcing was built for {env.StartAgeKa} ka and {env.DurationYears} years; build the model for this run (TropicalRun.CreateModel)");
        double[] y0 = initialState?.ToArray() ?? model.InitialState();
        if (y0.Length != model.Dimension)
            throw new ArgumentException($"initialState has {y0.Length} values; the model has {model.Dimension} state variables ({string.Join(", ", model.StateVariables.Select(s => s.Name))}).", nameof(initialState));
        for (int i = 0; i < y0.Length; i++)
            if (!double.IsFinite(y0[i]))
                throw new ArgumentException($"initialState[{i}] ({model.StateVariables[i].Name}) = {y0[i]} is not finite.", nameof(initialState));

        var rows = new RowWriter(model, sink, run.SamplesPerOutput, run.DurationYears, progress, cancellationToken);
        sink.Begin(model.Columns);
        var clock = Stopwatch.StartNew();
        var result = OdeSolver.Solve(model, 0.0, y0, run.DurationYears, run.ToSolverOptions(), rows);
        clock.Stop();
        var s = result.Statistics;
        var summary = new RunSummary(rows.Rows, result.FinalTime, result.FinalState, s.AcceptedSteps, s.RejectedSteps, s.FunctionEvaluations,
            s.JacobianEvaluations, result.FinalMethod.ToString(), result.MethodSwitches.Select(m => $"{m.From} → {m.To} at {m.Time} yr: {m.Reason}").ToArray(),
            clock.Elapsed.TotalSeconds);
        sink.End(summary);
        return summary;
    }

    /// <summary>Turns solver output (every output interval / samples) into rows, averaging samples when asked.</summary>
    private sealed class RowWriter(TropicalBoxModel model, IRowSink sink, int samples, double duration, IProgress<double>? progress, CancellationToken ct) : IOutputSink
    {
        private readonly double[] _row = new double[model.Columns.Count];
        private readonly double[] _sum = new double[model.Columns.Count];
        private int _count;
        private bool _first = true;
        private double _reported = double.NegativeInfinity;

        public long Rows { get; private set; }

        public void Write(double t, ReadOnlySpan<double> y)
        {
            ct.ThrowIfCancellationRequested();
            model.FillRow(t, y, _row);
            if (samples == 1 || _first)
            {
                // The first row (t = 0) is always the initial state itself.
                _first = false;
                Emit(_row, t);
                return;
            }
            for (int i = 0; i < _row.Length; i++) _sum[i] += _row[i];
            if (++_count < samples) return;
            for (int i = 0; i < _row.Length; i++) _sum[i] /= samples;
            _sum[0] = t;
            _sum[1] = model.StartAgeKa - t / 1000.0;
            Emit(_sum, t);
            Array.Clear(_sum);
            _count = 0;
        }

        private void Emit(double[] row, double t)
        {
            sink.Write(row);
            Rows++;
            if (progress is null) return;
            double fraction = duration > 0 ? Math.Clamp(t / duration, 0.0, 1.0) : 1.0;
            // At most about a thousand reports per run.
            if (fraction - _reported < 1e-3 && fraction < 1.0) return;
            _reported = fraction;
            progress.Report(fraction);
        }
    }
}
