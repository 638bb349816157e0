using System.Globalization;

namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// Integrates y' = f(t, y) from t0 to tEnd (forward in time) with the method, tolerances, output schedule and events
/// of a <see cref="SolverOptions"/>, streaming the solution to an <see cref="IOutputSink"/>.
/// </summary>
/// <remarks>
/// <para>One loop serves every method: each method is a tableau (<c>ExplicitTableau</c>, <c>RosenbrockTableau</c>) run by a
/// shared stepper, while the loop owns step-size control (<c>StepSizeController</c>), the stiffness test, output from dense
/// output, event location and failure diagnosis.</para>
/// <para>Step-size control: a step is accepted when the weighted RMS norm of its error estimate is ≤ 1 (see <see cref="SolverOptions"/>).
/// Explicit methods use a PI controller (Gustafsson 1991, ACM TOMS 17, 533; β = 0.2/k as DOPRI5's 0.04), RODAS4 Gustafsson's
/// predictive controller (Hairer and Wanner II, Sect. IV.8), both with safety 0.9 and step ratios limited to [0.2, 10] (explicit) or
/// [0.2, 6] (RODAS4). The first step follows Hairer, Nørsett and Wanner I, Sect. II.4. Stiffness (explicit DOPRI5 and Auto): the
/// ratio ‖f(y₇) − f(y₆)‖/‖y₇ − y₆‖ of the two stages at c = 1 estimates |λ|; |hλ| &gt; 3.25 on 15 steps without 6 in a row below
/// it reports stiffness (Hairer and Wanner II, Sect. IV.2, as in their DOPRI5 code, which also makes the estimate only on every
/// NSTIFF-th step until stiffness is suspected: here every 10th), and Auto then continues with RODAS4.</para>
/// <para>Events: sign changes of g(t, y) between step ends are located on the step's dense output by the Illinois method
/// (Dowell and Jarratt 1971, BIT 11, 168) to <see cref="SolverOptions.EventTimeTolerance"/>.</para>
/// <para>Time-dependent forcing enters through t, which <see cref="IOdeSystem.Evaluate{T}"/> receives as a <see cref="double"/>;
/// RODAS4 estimates ∂f/∂t by a forward difference unless <see cref="SolverOptions.IsAutonomous"/> is set.</para>
/// <para>Memory: the solve allocates its work arrays once; steps allocate nothing (outputs go to the sink, which receives a span),
/// so memory does not grow with run length. Recorded events allocate their state copy.</para>
/// <para>Speed: the system's generic <see cref="IOdeSystem.Evaluate{T}"/> is bound once per solve to closed delegates for
/// <see cref="double"/> and <see cref="Dual"/>, avoiding a generic-virtual dispatch on every evaluation.</para>
/// <para>Failures throw <see cref="OdeSolverException"/> with the diagnosis (non-finite state with the component, time and last
/// good state; step-size underflow; too many steps; singular iteration matrix).</para>
/// </remarks>
public static class OdeSolver
{
    /// <summary>Solves the initial-value problem y(t0) = y0 on [t0, tEnd].</summary>
    /// <param name="system">The right-hand side.</param>
    /// <param name="t0">Initial time.</param>
    /// <param name="y0">Initial state (length <see cref="IOdeSystem.Dimension"/>, finite).</param>
    /// <param name="tEnd">Final time, &gt; t0.</param>
    /// <param name="options">Method, tolerances, steps and output schedule.</param>
    /// <param name="sink">Receives the output rows, or null for none.</param>
    /// <param name="events">Event functions to watch, or null.</param>
    /// <exception cref="ArgumentException">Bad arguments or options (the message names them).</exception>
    /// <exception cref="OdeSolverException">The integration failed; the exception carries the diagnosis.</exception>
    public static SolveResult Solve(IOdeSystem system, double t0, ReadOnlySpan<double> y0, double tEnd, SolverOptions options,
        IOutputSink? sink = null, IReadOnlyList<OdeEvent>? events = null)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(options);
        return new Integration(system, system.Dimension, RightHandSide.Bind<double>(system), () => RightHandSide.Bind<Dual>(system),
            t0, y0, tEnd, options, sink, events).Run();
    }

    /// <summary>
    /// As <see cref="Solve(IOdeSystem, double, ReadOnlySpan{double}, double, SolverOptions, IOutputSink?, IReadOnlyList{OdeEvent}?)"/>,
    /// with the parameters of <paramref name="system"/> set to <paramref name="parameters"/> (length <see cref="IParametricSystem.ParameterCount"/>)
    /// instead of its current values.
    /// </summary>
    public static SolveResult Solve(IParametricSystem system, ReadOnlySpan<double> parameters, double t0, ReadOnlySpan<double> y0, double tEnd,
        SolverOptions options, IOutputSink? sink = null, IReadOnlyList<OdeEvent>? events = null)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(options);
        if (parameters.Length != system.ParameterCount)
            throw new ArgumentException($"'parameters' has length {parameters.Length}; the system has {system.ParameterCount} parameters.", nameof(parameters));
        for (int i = 0; i < parameters.Length; i++)
            if (!double.IsFinite(parameters[i]))
                throw new ArgumentException($"Parameter [{i}] ('{system.GetParameterName(i)}') = {parameters[i]} is not finite.", nameof(parameters));
        double[] p = parameters.ToArray();
        return new Integration(system, system.Dimension, RightHandSide.Bind<double>(system, p), () => RightHandSide.Bind<Dual>(system, p),
            t0, y0, tEnd, options, sink, events).Run();
    }

    /// <summary>One solve: the shared stepping loop.</summary>
    private sealed class Integration
    {
        /// <summary>After a non-finite trial, retry with a quarter of the step: the trial left the region where f is defined.</summary>
        private const double NonFiniteShrink = 0.25;

        /// <summary>After a singular iteration matrix, halve the step (as the RODAS code does), at most this many times in a row.</summary>
        private const int MaxSingularRetries = 5;

        /// <summary>Stiffness is reported after this many consecutive-ish steps with |hλ| beyond the stability boundary (DOPRI5 code: 15).</summary>
        private const int StiffStepsToReport = 15;

        /// <summary>
        /// While stiffness is not suspected, the estimate is made on every this many accepted steps; once one estimate lies beyond
        /// the stability boundary, on every step until the count is reset (the DOPRI5 code's NSTIFF, whose default is 1000; 10
        /// here, so that Auto switches within a few dozen steps of the onset while the estimate costs little).
        /// </summary>
        private const int StiffnessTestInterval = 10;

        /// <summary>This many steps inside the stability region reset the stiffness count (DOPRI5 code: 6).</summary>
        private const int NonStiffStepsToReset = 6;

        /// <summary>The smallest step is this many ulp of t: below it t + h cannot be told from t.</summary>
        private const double MinStepUlps = 16;

        /// <summary>Stretch the step by up to 1 % rather than leave a sliver before tEnd (DOPRI5 code).</summary>
        private const double LastStepStretch = 1.01;

        /// <summary>Illinois iterations before falling back to bisection for an event.</summary>
        private const int IllinoisIterations = 60;

        private readonly IOdeSystem _system;
        private readonly int _n;
        private readonly RhsFunction<double> _f;
        private readonly Func<RhsFunction<Dual>> _bindDual;
        private readonly double _t0, _tEnd;
        private readonly SolverOptions _options;
        private readonly IOutputSink? _sink;
        private readonly IReadOnlyList<OdeEvent> _events;
        private readonly WorkCounters _counters = new();
        private readonly double[] _atol;
        private readonly double _rtol;

        private double[] _y, _yNew;
        private readonly double[] _yOut, _gOld, _gNew;
        private readonly (double Time, int Index, bool Rising)[] _crossings;
        private List<EventOccurrence>? _occurrences;
        private List<MethodSwitch>? _switches;
        private Stepper _stepper;
        private StepSizeController _controller;
        private double? _stiffAt;
        private int _stiffCount, _nonStiffCount;
        private long _outputIndex;
        private readonly long _uniformCount;

        public Integration(IOdeSystem system, int n, RhsFunction<double> f, Func<RhsFunction<Dual>> bindDual, double t0, ReadOnlySpan<double> y0, double tEnd,
            SolverOptions options, IOutputSink? sink, IReadOnlyList<OdeEvent>? events)
        {
            if (n < 1) throw new ArgumentException($"The system has dimension {n}; at least 1 is needed.", nameof(system));
            if (!double.IsFinite(t0)) throw new ArgumentOutOfRangeException(nameof(t0), t0, "t0 must be finite.");
            if (!double.IsFinite(tEnd) || !(tEnd > t0))
                throw new ArgumentOutOfRangeException(nameof(tEnd), tEnd, $"tEnd must be finite and greater than t0 = {t0:R} (integration runs forward in time).");
            if (y0.Length != n) throw new ArgumentException($"'y0' has length {y0.Length}; the system has dimension {n}.", nameof(y0));
            int badY = VectorOps.FirstNonFinite(y0);
            if (badY >= 0) throw new ArgumentException($"Initial state component [{badY}] = {y0[badY]} is not finite.", nameof(y0));
            options.Validate(n, t0, tEnd);
            events ??= [];
            for (int e = 0; e < events.Count; e++)
            {
                if (events[e] is null) throw new ArgumentException($"Event [{e}] is null.", nameof(events));
                if (!Enum.IsDefined(events[e].Direction))
                    throw new ArgumentOutOfRangeException(nameof(events), events[e].Direction, $"Event '{events[e].Name}' has an unknown direction; allowed: Either, Rising, Falling.");
            }

            _system = system;
            _n = n;
            _f = f;
            _bindDual = bindDual;
            _t0 = t0;
            _tEnd = tEnd;
            _options = options;
            _sink = sink;
            _events = events;
            _rtol = options.RelativeTolerance;
            _atol = new double[n];
            for (int i = 0; i < n; i++) _atol[i] = options.AbsoluteTolerances?[i] ?? options.AbsoluteTolerance;
            _y = y0.ToArray();
            _yNew = new double[n];
            _yOut = new double[n];
            _gOld = new double[events.Count];
            _gNew = new double[events.Count];
            _crossings = new (double, int, bool)[events.Count];
            _stepper = CreateStepper(options.Method == OdeMethod.Auto ? OdeMethod.DormandPrince54 : options.Method);
            _controller = new StepSizeController(_stepper.ErrorOrder, _stepper is RosenbrockStepper);
            if (options.Output.Mode == OutputMode.Uniform)
                _uniformCount = (long)Math.Floor((tEnd - t0) / options.Output.Interval * (1 + 1e-12)) + 1;
        }

        private Stepper CreateStepper(OdeMethod method) => method switch
        {
            OdeMethod.DormandPrince54 => new ExplicitRungeKuttaStepper(ExplicitTableau.DormandPrince54, _n, _f, _counters),
            OdeMethod.BogackiShampine32 => new ExplicitRungeKuttaStepper(ExplicitTableau.BogackiShampine32, _n, _f, _counters),
            OdeMethod.RungeKutta4 => new ExplicitRungeKuttaStepper(ExplicitTableau.RungeKutta4, _n, _f, _counters),
            OdeMethod.Rodas4 => new RosenbrockStepper(RosenbrockTableau.Rodas4, _n, _f,
                _options.Jacobian == JacobianSource.Automatic ? _bindDual() : null, _options.IsAutonomous, _counters),
            OdeMethod.EulerMaruyama => new EulerMaruyamaStepper(_n, _f, _options.Noise!, _options.Seed, _counters),
            _ => throw new ArgumentOutOfRangeException(nameof(method), method, "No stepper for this method."),
        };

        public SolveResult Run()
        {
            double t = _t0;
            bool adaptive = _options.FixedStep is null;
            double hFixed = _options.FixedStep ?? double.NaN;
            long stepIndex = 0;

            int bad = _stepper.Start(t, _y);
            if (bad >= 0)
                throw Failure(OdeFailureKind.NonFiniteState, $"f(t0, y0) is not finite in component [{bad}] at t0 = {Fmt(t)}: the initial state lies outside the model's domain.", t, 0.0, bad, t);

            for (int e = 0; e < _events.Count; e++) _gOld[e] = EvaluateEvent(e, t, _y);
            WriteInitialOutput(t);

            double h = adaptive ? Math.Min(_options.InitialStep ?? InitialStepSize(t), _options.MaxStep) : hFixed;
            double lastH = 0.0;
            int singularRun = 0;
            int lastBadIndex = -1;
            double lastBadTime = double.NaN;
            long attempts = 0;

            while (t < _tEnd)
            {
                if (attempts >= _options.MaxSteps)
                {
                    string hint = _stiffAt is { } ts ? $" The problem became stiff at t = {Fmt(ts)}: use Method Rodas4 or Auto." : "";
                    throw Failure(OdeFailureKind.TooManySteps,
                        $"MaxSteps = {_options.MaxSteps} step attempts were used before reaching tEnd = {Fmt(_tEnd)}; stopped at t = {Fmt(t)} with h = {Fmt(h)}.{hint}",
                        t, h, -1, t);
                }

                double hTry;
                bool last = false;
                if (!adaptive)
                {
                    double next = _t0 + (stepIndex + 1) * hFixed;
                    if (next >= _tEnd - 1e-9 * hFixed) { next = _tEnd; last = true; }
                    hTry = next - t;
                }
                else
                {
                    hTry = Math.Min(h, _options.MaxStep);
                    if (t + LastStepStretch * hTry >= _tEnd) { hTry = _tEnd - t; last = true; }
                    double hMin = MinStepUlps * (double.BitIncrement(Math.Abs(t)) - Math.Abs(t));
                    if (hTry < hMin)
                    {
                        if (lastBadIndex >= 0)
                            throw Failure(OdeFailureKind.NonFiniteState,
                                $"Component [{lastBadIndex}] became non-finite (NaN or ∞) near t = {Fmt(lastBadTime)} in every trial step, down to h = {Fmt(hTry)} from t = {Fmt(t)}: the solution leaves the model's domain there.",
                                lastBadTime, hTry, lastBadIndex, t);
                        throw Failure(OdeFailureKind.StepSizeUnderflow,
                            $"The step size fell to h = {Fmt(hTry)} at t = {Fmt(t)}, below the resolution of t ({Fmt(hMin)}): the solution may have a singularity or a discontinuity there, or the tolerance (rtol = {Fmt(_rtol)}) is unattainable.",
                            t, hTry, -1, t);
                    }
                }

                var outcome = _stepper.Attempt(t, hTry, _y, _yNew, adaptive, _atol, _rtol, out double errSq, out int badIndex);
                attempts++;
                if (outcome == TrialOutcome.Singular)
                {
                    _counters.Rejected++;
                    if (!adaptive || ++singularRun > MaxSingularRetries)
                        throw Failure(OdeFailureKind.SingularMatrix,
                            $"The iteration matrix I/(hγ) − J is singular at t = {Fmt(t)} with h = {Fmt(hTry)}{(adaptive ? $" after {MaxSingularRetries} step halvings" : "")}.",
                            t, hTry, -1, t);
                    h = hTry * 0.5;
                    continue;
                }
                if (outcome == TrialOutcome.NonFinite)
                {
                    _counters.Rejected++;
                    if (!adaptive)
                        throw Failure(OdeFailureKind.NonFiniteState,
                            $"Component [{badIndex}] became non-finite (NaN or ∞) in the fixed step from t = {Fmt(t)} to {Fmt(t + hTry)}.",
                            t + hTry, hTry, badIndex, t);
                    lastBadIndex = badIndex;
                    lastBadTime = t + hTry;
                    _controller.Rejected(hTry, double.PositiveInfinity);
                    h = hTry * NonFiniteShrink;
                    continue;
                }
                if (adaptive && !(errSq <= 1.0))
                {
                    _counters.Rejected++;
                    h = _controller.Rejected(hTry, errSq);
                    continue;
                }

                // Accepted.
                singularRun = 0;
                lastBadIndex = -1;
                _counters.Accepted++;
                double tNew = last ? _tEnd : t + hTry;
                double hNext = adaptive ? _controller.Accepted(hTry, errSq) : hFixed;

                // Events on this step, in time order; a terminal one ends the solve.
                double stopTime = tNew;
                int terminal = -1;
                if (_events.Count > 0)
                {
                    int found = 0;
                    for (int e = 0; e < _events.Count; e++)
                    {
                        _gNew[e] = EvaluateEvent(e, tNew, _yNew);
                        if (Crossed(_events[e].Direction, _gOld[e], _gNew[e], out bool rising))
                            _crossings[found++] = (Locate(e, rising, t, tNew, hTry, _gOld[e], _gNew[e]), e, rising);
                    }
                    if (found > 1) Array.Sort(_crossings, 0, found, CrossingOrder.Instance);
                    for (int c = 0; c < found; c++)
                    {
                        var (te, e, rising) = _crossings[c];
                        double[] state = new double[_n];
                        StateAt(te, t, tNew, hTry, state);
                        (_occurrences ??= []).Add(new EventOccurrence(e, _events[e].Name, te, rising, state));
                        if (_events[e].Terminal) { terminal = e; stopTime = te; break; }
                    }
                }

                WriteOutputs(t, stopTime, tNew, hTry, terminal >= 0);

                if (terminal >= 0)
                {
                    double[] final = _occurrences![^1].State.ToArray();
                    if (_options.Output.Mode is OutputMode.EveryStep or OutputMode.FinalOnly) _sink?.Write(stopTime, final);
                    return Result(SolveStatus.TerminatedByEvent, stopTime, final, hTry);
                }

                bool switchNow = false;
                if (adaptive && (_stiffCount > 0 || _counters.Accepted % StiffnessTestInterval == 0)
                    && !double.IsNaN(_stepper.StabilityBoundary) && (_stiffAt is null || _options.Method == OdeMethod.Auto))
                    switchNow = StiffnessTest(_stepper.StiffnessEstimate(hTry, _yNew), tNew);

                _stepper.Accept(tNew, _yNew);
                (_y, _yNew) = (_yNew, _y);
                t = tNew;
                for (int e = 0; e < _events.Count; e++) _gOld[e] = _gNew[e];
                lastH = hTry;
                h = hNext;
                stepIndex++;

                if (switchNow && _options.Method == OdeMethod.Auto && t < _tEnd)
                {
                    var from = _stepper.Method;
                    double boundary = _stepper.StabilityBoundary;
                    _stepper = CreateStepper(OdeMethod.Rodas4);
                    bad = _stepper.Start(t, _y);
                    if (bad >= 0)
                        throw Failure(OdeFailureKind.NonFiniteState, $"f is not finite in component [{bad}] at t = {Fmt(t)}.", t, 0.0, bad, t);
                    _controller = new StepSizeController(_stepper.ErrorOrder, predictive: true);
                    (_switches ??= []).Add(new MethodSwitch(t, from, OdeMethod.Rodas4,
                        $"stiff: |hλ| exceeded the explicit method's stability boundary {boundary:G3} on {StiffStepsToReport} recent steps"));
                }
            }

            if (_options.Output.Mode == OutputMode.FinalOnly) _sink?.Write(t, _y);
            return Result(SolveStatus.Completed, t, _y.ToArray(), lastH);
        }

        private SolveResult Result(SolveStatus status, double t, double[] state, double lastH) =>
            new(status, t, state, _options.Method, _stepper.Method, _counters.Snapshot(),
                (IReadOnlyList<EventOccurrence>?)_occurrences ?? [], _stiffAt, (IReadOnlyList<MethodSwitch>?)_switches ?? [], lastH);

        /// <summary>The Hairer–Wanner test as in the DOPRI5 code; true when stiffness is newly detected.</summary>
        private bool StiffnessTest(double hLambda, double tNew)
        {
            if (hLambda > _stepper.StabilityBoundary)
            {
                _nonStiffCount = 0;
                if (++_stiffCount >= StiffStepsToReport)
                {
                    _stiffAt ??= tNew;
                    _stiffCount = 0;
                    return true;
                }
            }
            else if (++_nonStiffCount >= NonStiffStepsToReset)
            {
                _stiffCount = 0;
            }
            return false;
        }

        /// <summary>
        /// Starting step of Hairer, Nørsett and Wanner I, Sect. II.4 ("starting step size"): from ‖y0‖, ‖f0‖ and a
        /// difference estimate of ‖f′‖, with norms weighted by atol + rtol|y0|.
        /// </summary>
        private double InitialStepSize(double t)
        {
            int n = _n;
            ReadOnlySpan<double> f0 = _stepper.CurrentDerivative;
            double d0 = 0, d1 = 0;
            for (int i = 0; i < n; i++)
            {
                double sc = _atol[i] + _rtol * Math.Abs(_y[i]);
                d0 += (_y[i] / sc) * (_y[i] / sc);
                d1 += (f0[i] / sc) * (f0[i] / sc);
            }
            d0 = Math.Sqrt(d0 / n);
            d1 = Math.Sqrt(d1 / n);
            double h0 = d0 < 1e-5 || d1 < 1e-5 ? 1e-6 : 0.01 * d0 / d1;
            h0 = Math.Min(h0, _tEnd - t);
            Span<double> y1 = _yOut;
            for (int i = 0; i < n; i++) y1[i] = _y[i] + h0 * f0[i];
            Span<double> f1 = _yNew;
            _f(t + h0, y1, f1);
            _counters.FunctionEvaluations++;
            double d2 = 0;
            for (int i = 0; i < n; i++)
            {
                double sc = _atol[i] + _rtol * Math.Abs(_y[i]);
                double q = (f1[i] - f0[i]) / sc;
                d2 += q * q;
            }
            d2 = Math.Sqrt(d2 / n) / h0;
            double dMax = Math.Max(d1, d2);
            double h1 = !double.IsFinite(dMax) ? h0 * 1e-3
                : dMax <= 1e-15 ? Math.Max(1e-6, h0 * 1e-3)
                : Math.Pow(0.01 / dMax, 1.0 / (_stepper.Order + 1));
            return Math.Min(100 * h0, h1);
        }

        private double EvaluateEvent(int e, double t, ReadOnlySpan<double> y)
        {
            _counters.EventEvaluations++;
            return _events[e].Function(t, y);
        }

        private static bool Crossed(EventDirection direction, double gOld, double gNew, out bool rising)
        {
            rising = gOld < 0 && gNew >= 0;
            bool falling = gOld > 0 && gNew <= 0;
            return direction switch
            {
                EventDirection.Rising => rising,
                EventDirection.Falling => falling,
                _ => rising || falling,
            };
        }

        /// <summary>The state at time <paramref name="time"/> within the accepted step [t, tNew], from dense output.</summary>
        private void StateAt(double time, double t, double tNew, double h, Span<double> destination)
        {
            if (time == tNew) _yNew.CopyTo(destination);
            else if (time == t) _y.CopyTo(destination);
            else _stepper.Interpolate((time - t) / h, h, _y, _yNew, destination);
        }

        /// <summary>
        /// Locates the sign change of event <paramref name="e"/> in (t, tNew] by the Illinois method on the dense output
        /// (Dowell and Jarratt 1971), keeping a bracket; returns the bracket end on the far side of the crossing, so that
        /// g there already has its new sign.
        /// </summary>
        private double Locate(int e, bool rising, double t, double tNew, double h, double gOld, double gNew)
        {
            double s = rising ? 1.0 : -1.0;
            double a = t, fa = s * gOld;   // fa < 0
            double b = tNew, fb = s * gNew; // fb ≥ 0
            if (fb == 0.0) return b;
            double tol = Math.Max(_options.EventTimeTolerance, 4 * (double.BitIncrement(Math.Abs(tNew)) - Math.Abs(tNew)));
            int side = 0;
            for (int iter = 0; b - a > tol; iter++)
            {
                double c = iter < IllinoisIterations ? b - fb * (b - a) / (fb - fa) : 0.5 * (a + b);
                if (!(c > a && c < b)) c = 0.5 * (a + b);
                StateAt(c, t, tNew, h, _yOut);
                double fc = s * EvaluateEvent(e, c, _yOut);
                if (double.IsNaN(fc)) { fc = 0.0; }
                if (fc >= 0.0)
                {
                    if (fc == 0.0) return c;
                    b = c; fb = fc;
                    if (side == 1) fa *= 0.5;
                    side = 1;
                }
                else
                {
                    a = c; fa = fc;
                    if (side == -1) fb *= 0.5;
                    side = -1;
                }
            }
            return b;
        }

        private void WriteInitialOutput(double t)
        {
            if (_sink is null) return;
            switch (_options.Output.Mode)
            {
                case OutputMode.EveryStep:
                    _sink.Write(t, _y);
                    break;
                case OutputMode.Uniform:
                    _sink.Write(t, _y);
                    _outputIndex = 1;
                    break;
                case OutputMode.List:
                    var times = _options.Output.ListedTimes;
                    while (_outputIndex < times.Length && times[_outputIndex] <= t) _sink.Write(times[_outputIndex++], _y);
                    break;
            }
        }

        /// <summary>Writes the scheduled outputs in (t, stop] of the accepted step [t, tNew].</summary>
        private void WriteOutputs(double t, double stop, double tNew, double h, bool terminated)
        {
            if (_sink is null) return;
            switch (_options.Output.Mode)
            {
                case OutputMode.EveryStep:
                    if (!terminated) _sink.Write(tNew, _yNew);
                    break;
                case OutputMode.Uniform:
                    while (_outputIndex < _uniformCount)
                    {
                        double to = Math.Min(_t0 + _outputIndex * _options.Output.Interval, _tEnd);
                        if (_outputIndex == _uniformCount - 1 && _tEnd - to <= 1e-12 * Math.Max(Math.Abs(_tEnd), 1.0)) to = _tEnd;
                        if (to > stop) break;
                        WriteAt(to, t, tNew, h);
                        _outputIndex++;
                    }
                    break;
                case OutputMode.List:
                    var times = _options.Output.ListedTimes;
                    while (_outputIndex < times.Length && times[_outputIndex] <= stop)
                        WriteAt(times[_outputIndex++], t, tNew, h);
                    break;
            }
        }

        private void WriteAt(double time, double t, double tNew, double h)
        {
            if (time == tNew) { _sink!.Write(time, _yNew); return; }
            _stepper.Interpolate((time - t) / h, h, _y, _yNew, _yOut);
            _sink!.Write(time, _yOut);
        }

        private OdeSolverException Failure(OdeFailureKind kind, string message, double time, double h, int variable, double lastGoodTime)
        {
            var state = _y.ToArray();
            return new OdeSolverException(kind, $"{message} Last good state at t = {Fmt(lastGoodTime)}: {FormatState(state)}.",
                time, h, variable, lastGoodTime, state, _counters.Snapshot());
        }

        private static string FormatState(double[] y)
        {
            const int shown = 8;
            var parts = y.Take(shown).Select((v, i) => $"[{i}] {v.ToString("G6", CultureInfo.InvariantCulture)}");
            return "(" + string.Join(", ", parts) + (y.Length > shown ? $", … {y.Length - shown} more" : "") + ")";
        }

        private static string Fmt(double x) => x.ToString("G6", CultureInfo.InvariantCulture);

        public override string ToString() => $"{_system.GetType().Name} on [{_t0}, {_tEnd}]";
    }

    private sealed class CrossingOrder : IComparer<(double Time, int Index, bool Rising)>
    {
        public static readonly CrossingOrder Instance = new();
        public int Compare((double Time, int Index, bool Rising) x, (double Time, int Index, bool Rising) y) =>
            x.Time != y.Time ? x.Time.CompareTo(y.Time) : x.Index.CompareTo(y.Index);
    }
}
