using System.Collections.Immutable;
using System.Runtime.InteropServices;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>
/// Two-parameter continuation of fold curves (minimally augmented system, with detection of cusps
/// and Bogdanov–Takens points) and of Hopf curves (standard extended system), by the same
/// pseudo-arclength tracer as one-parameter branches. The region between the two fold curves that
/// meet at a cusp is the bistable region: see <see cref="BistableRegion"/>.
/// </summary>
public static class TwoParameterContinuation
{
    /// <summary>Traces the fold curve through a fold found on <paramref name="branch"/>, freeing <paramref name="secondParameterName"/> as well.</summary>
    public static Curve TraceFold(IParametricSystem system, Branch branch, SpecialPoint fold, string secondParameterName, CurveOptions options)
    {
        ArgumentNullException.ThrowIfNull(branch);
        ArgumentNullException.ThrowIfNull(fold);
        if (fold.Kind != SpecialPointKind.Fold)
            throw new ArgumentException($"A fold curve starts from a fold; got a {fold.Kind} point at {branch.ParameterName} = {fold.Parameter:G6}.", nameof(fold));
        int second = ParameterLookup.IndexOf(system, secondParameterName, nameof(secondParameterName));
        var p = branch.Parameters.ToArray();
        p[branch.ParameterIndex] = fold.Parameter;
        return TraceFold(system, fold.State.AsSpan(), p, branch.ParameterIndex, second, options);
    }

    /// <summary>
    /// Traces the curve of folds through the fold near (<paramref name="state"/>, <paramref name="parameters"/>)
    /// in the plane of parameters <paramref name="firstParameter"/> and <paramref name="secondParameter"/>.
    /// The start is first located exactly with the second parameter fixed.
    /// </summary>
    /// <exception cref="SteadyStateNotFoundException">No fold near the given start.</exception>
    public static Curve TraceFold(IParametricSystem system, ReadOnlySpan<double> state, ReadOnlySpan<double> parameters, int firstParameter, int secondParameter, CurveOptions options)
    {
        var (d, n) = Prepare(system, state, parameters, firstParameter, secondParameter, options);
        var u = new double[n + 2];
        state.CopyTo(u);
        u[n] = parameters[firstParameter];
        u[n + 1] = parameters[secondParameter];
        // Locate the fold exactly with the second parameter fixed.
        d.P[secondParameter] = u[n + 1];
        var jac = new double[n * n];
        var f = new double[n];
        d.P[firstParameter] = u[n];
        d.Jacobian(state, jac, f);
        var v = NullVectorGuess(jac, n);
        var square = new FoldSystem(d, [firstParameter], v);
        var head = u.AsSpan(0, n + 1);
        NewtonOutcome located = square.InitialiseBorders(head) ? ExtendedNewton.Solve(square, head, options.CorrectorTolerance, 30) : default;
        if (!located.Converged)
            throw new SteadyStateNotFoundException(
                $"No fold found near the given start ({system.GetParameterName(firstParameter)} = {parameters[firstParameter]:G6}): the fold system's residual is {located.Residual:G3} after {located.Iterations} iterations. Start from a fold located on a branch.",
                FailedResult(u, n, parameters, located));
        square.Evaluate(head, new double[n + 1], new double[(n + 1) * (n + 1)]);
        var curveSystem = new FoldSystem(d, [firstParameter, secondParameter], square.RightVector);
        curveSystem.InitialiseBorders(u);
        var tracer = new FoldCurveTracer(d, curveSystem, firstParameter, secondParameter, options);
        return tracer.TraceBoth(u, options.Direction, parameters.ToArray(), CurveKind.Fold);
    }

    /// <summary>Traces the Hopf curve through a Hopf point found on <paramref name="branch"/>, freeing <paramref name="secondParameterName"/> as well.</summary>
    public static Curve TraceHopf(IParametricSystem system, Branch branch, SpecialPoint hopf, string secondParameterName, CurveOptions options)
    {
        ArgumentNullException.ThrowIfNull(branch);
        ArgumentNullException.ThrowIfNull(hopf);
        if (hopf.Kind != SpecialPointKind.Hopf || hopf.Frequency is not double omega)
            throw new ArgumentException($"A Hopf curve starts from a Hopf point; got a {hopf.Kind} point at {branch.ParameterName} = {hopf.Parameter:G6}.", nameof(hopf));
        int second = ParameterLookup.IndexOf(system, secondParameterName, nameof(secondParameterName));
        var p = branch.Parameters.ToArray();
        p[branch.ParameterIndex] = hopf.Parameter;
        return TraceHopf(system, hopf.State.AsSpan(), omega, p, branch.ParameterIndex, second, options);
    }

    /// <summary>
    /// Traces the curve of Hopf points through the Hopf point near (<paramref name="state"/>,
    /// <paramref name="parameters"/>) with frequency near <paramref name="frequency"/>.
    /// </summary>
    /// <exception cref="SteadyStateNotFoundException">No Hopf point near the given start.</exception>
    public static Curve TraceHopf(IParametricSystem system, ReadOnlySpan<double> state, double frequency, ReadOnlySpan<double> parameters, int firstParameter, int secondParameter, CurveOptions options)
    {
        if (!(frequency > 0) || !double.IsFinite(frequency))
            throw new ArgumentOutOfRangeException(nameof(frequency), frequency, "The Hopf frequency ω must be positive and finite (radians per time unit).");
        var (d, n) = Prepare(system, state, parameters, firstParameter, secondParameter, options);
        d.P[firstParameter] = parameters[firstParameter];
        d.P[secondParameter] = parameters[secondParameter];
        var jac = new double[n * n];
        var f = new double[n];
        d.Jacobian(state, jac, f);
        var a = new double[n];
        var b = new double[n];
        var c = new double[n];
        // Square system (x, p1, ω, a, b) to locate the start with p2 fixed.
        var us = new double[3 * n + 2];
        state.CopyTo(us);
        us[n] = parameters[firstParameter];
        us[n + 1] = frequency;
        bool haveVector = EquilibriumTracer.ComplexEigenvector(jac, n, 0, frequency, a, b);
        NewtonOutcome located = default;
        if (haveVector)
        {
            HopfSystem.Normalise(a, b, us.AsSpan(n + 2, n), us.AsSpan(2 * n + 2, n), c);
            located = ExtendedNewton.Solve(new HopfSystem(d, [firstParameter], c), us, options.CorrectorTolerance, 30);
        }
        if (!located.Converged || !(us[n + 1] > 0))
            throw new SteadyStateNotFoundException(
                $"No Hopf point found near the given start ({system.GetParameterName(firstParameter)} = {parameters[firstParameter]:G6}, ω = {frequency:G6}): residual {located.Residual:G3} after {located.Iterations} iterations. Start from a Hopf point located on a branch.",
                FailedResult(us, n, parameters, located));
        var u = new double[3 * n + 3];
        us.AsSpan(0, n + 1).CopyTo(u);
        u[n + 1] = parameters[secondParameter];
        us.AsSpan(n + 1, 2 * n + 1).CopyTo(u.AsSpan(n + 2));
        var curveSystem = new HopfSystem(d, [firstParameter, secondParameter], c);
        curveSystem.OnAccepted(u);
        var tracer = new HopfCurveTracer(d, curveSystem, firstParameter, secondParameter, options, u[n + 2]);
        return tracer.TraceBoth(u, options.Direction, parameters.ToArray(), CurveKind.Hopf);
    }

    private static SteadyStateResult FailedResult(double[] u, int n, ReadOnlySpan<double> parameters, NewtonOutcome o) => new()
    {
        Converged = false,
        State = ImmutableArray.Create(u.AsSpan(0, n).ToArray()),
        Parameters = ImmutableArray.Create(parameters.ToArray()),
        Residual = o.Residual,
        Iterations = o.Iterations,
        Failure = double.IsNaN(o.Residual) ? NewtonFailure.NonFinite : NewtonFailure.IterationLimit,
    };

    private static (SystemDerivatives, int) Prepare(IParametricSystem system, ReadOnlySpan<double> state, ReadOnlySpan<double> parameters, int first, int second, CurveOptions options)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(options);
        ParameterLookup.CheckIndex(system, first, "firstParameter");
        ParameterLookup.CheckIndex(system, second, "secondParameter");
        if (first == second)
            throw new ArgumentException($"The two continuation parameters must differ; both are '{system.GetParameterName(first)}'.", nameof(second));
        int n = system.Dimension;
        if (state.Length != n) throw new ArgumentException($"The state has {state.Length} entries; the system has {n} state variables.", nameof(state));
        if (parameters.Length != system.ParameterCount)
            throw new ArgumentException($"Got {parameters.Length} parameter values; the system has {system.ParameterCount} parameters.", nameof(parameters));
        options.Validate(n, parameters[first], parameters[second], system.GetParameterName(first), system.GetParameterName(second));
        return (new SystemDerivatives(system, options.Time, parameters), n);
    }

    /// <summary>A right null vector estimate of a nearly singular J by inverse iteration (or the unit vector of a zero pivot).</summary>
    internal static double[] NullVectorGuess(ReadOnlySpan<double> jac, int n)
    {
        var v = new double[n];
        for (int i = 0; i < n; i++) v[i] = 1 + 0.1 * i;
        var lu = new LuFactorization(n);
        if (!lu.Factor(jac, n))
        {
            // Exactly singular: perturb the diagonal slightly and iterate.
            var shifted = jac.ToArray();
            double scale = 1e-12 * (1 + Vec.NormInf(jac));
            for (int i = 0; i < n; i++) shifted[i * n + i] += scale;
            if (!lu.Factor(shifted, n)) return v;
        }
        for (int pass = 0; pass < 3; pass++)
        {
            lu.Solve(v);
            double norm = Vec.Norm2(v);
            if (!(norm > 0) || !double.IsFinite(norm)) break;
            Vec.Scale(v, 1 / norm);
        }
        return v;
    }
}

/// <summary>Shared parts of the fold-curve and Hopf-curve tracers: bounds, assembly.</summary>
internal abstract class ParameterPlaneTracer : CurveTracer
{
    protected ParameterPlaneTracer(SystemDerivatives d, ExtendedSystem system, double[] weights, int first, int second, CurveOptions options)
        : base(system, weights, options)
    {
        D = d;
        N = d.N;
        First = first;
        Second = second;
        Options = options;
        FirstName = d.System.GetParameterName(first);
        SecondName = d.System.GetParameterName(second);
    }

    protected SystemDerivatives D { get; }
    protected int N { get; }
    protected int First { get; }
    protected int Second { get; }
    protected CurveOptions Options { get; }
    protected string FirstName { get; }
    protected string SecondName { get; }

    protected static double[] StateWeights(int n, CurveOptions o, int total)
    {
        var w = new double[total];
        for (int i = 0; i < n; i++) { double s = o.StateScale?[i] ?? 1; w[i] = 1 / (s * s); }
        w[n] = 1 / (o.FirstParameterScale * o.FirstParameterScale);
        w[n + 1] = 1 / (o.SecondParameterScale * o.SecondParameterScale);
        return w;
    }

    protected override string Where(ReadOnlySpan<double> u) => $"{FirstName} = {u[N]:G10}, {SecondName} = {u[N + 1]:G10}";

    protected override Outside? CheckOutside(ReadOnlySpan<double> u)
    {
        var o = Options;
        if (u[N] > o.FirstParameterMax) return new Outside(EndReason.ParameterBoundReached, $"Reached the upper bound {FirstName} = {o.FirstParameterMax:G10}.", N, o.FirstParameterMax);
        if (u[N] < o.FirstParameterMin) return new Outside(EndReason.ParameterBoundReached, $"Reached the lower bound {FirstName} = {o.FirstParameterMin:G10}.", N, o.FirstParameterMin);
        if (u[N + 1] > o.SecondParameterMax) return new Outside(EndReason.ParameterBoundReached, $"Reached the upper bound {SecondName} = {o.SecondParameterMax:G10}.", N + 1, o.SecondParameterMax);
        if (u[N + 1] < o.SecondParameterMin) return new Outside(EndReason.ParameterBoundReached, $"Reached the lower bound {SecondName} = {o.SecondParameterMin:G10}.", N + 1, o.SecondParameterMin);
        for (int i = 0; i < N; i++)
        {
            if (o.StateMin is not null && u[i] < o.StateMin[i])
                return new Outside(EndReason.StateBoundReached, $"State variable {i} reached its lower bound {o.StateMin[i]:G10} at {Where(u)}.", i, o.StateMin[i]);
            if (o.StateMax is not null && u[i] > o.StateMax[i])
                return new Outside(EndReason.StateBoundReached, $"State variable {i} reached its upper bound {o.StateMax[i]:G10} at {Where(u)}.", i, o.StateMax[i]);
        }
        if (o.Validity is not null)
        {
            var p = (double[])D.P.Clone();
            p[First] = u[N];
            p[Second] = u[N + 1];
            if (o.Validity(u[..N], p) is string message)
                return new Outside(EndReason.InvalidState, $"The curve leaves the valid range at {Where(u)}: {message}", -1, 0);
        }
        return ExtraCheck(u);
    }

    protected virtual Outside? ExtraCheck(ReadOnlySpan<double> u) => null;

    protected override SpecialPointKind ClassifyCorner(ReadOnlySpan<double> tIn, ReadOnlySpan<double> tOut) => SpecialPointKind.NonSmoothKink;

    protected virtual double? FrequencyOf(ReadOnlySpan<double> u) => null;

    protected SpecialPoint Make(SpecialPointKind kind, ReadOnlySpan<double> u, double residual, bool located, int iterations, double arclength, string description) => new()
    {
        Kind = kind,
        Parameter = u[N],
        SecondParameter = u[N + 1],
        State = ImmutableArray.Create(u[..N].ToArray()),
        Residual = residual,
        Located = located,
        Iterations = iterations,
        Arclength = arclength,
        Description = description,
        Frequency = FrequencyOf(u),
    };

    public Curve TraceBoth(double[] u0, ContinuationDirection direction, double[] parameters, CurveKind kind)
    {
        var t0 = new double[M];
        if (!Stepper.InitialTangent(u0, N + 1, t0, out int det))
            throw new SteadyStateNotFoundException($"The {kind} curve has no well-defined tangent at its start ({Where(u0)}): a degenerate point. Start elsewhere on the branch.",
                new SteadyStateResult { Converged = false, State = ImmutableArray.Create(u0.AsSpan(0, N).ToArray()), Parameters = ImmutableArray.Create(parameters), Residual = double.NaN, Iterations = 0, Failure = NewtonFailure.SingularJacobian });
        if (t0[N + 1] < 0) { Vec.Scale(t0, -1); det = -det; }
        var start = StartNode(u0, t0, det);
        HalfTrace? reverse = null;
        HalfTrace forward;
        switch (direction)
        {
            case ContinuationDirection.Increasing: forward = Run(start, +1); break;
            case ContinuationDirection.Decreasing: forward = Run(start, -1); break;
            default: reverse = Run(start, -1); forward = Run(start, +1); break;
        }
        return Assemble(kind, forward, reverse, parameters);
    }

    private Curve Assemble(CurveKind kind, HalfTrace forward, HalfTrace? reverse, double[] parameters)
    {
        var specials = new List<SpecialPoint>();
        if (reverse is not null) specials.AddRange(reverse.Specials);
        specials.AddRange(forward.Specials);
        void AddEnd(HalfTrace h)
        {
            var last = h.Nodes[^1];
            specials.Add(Make(SpecialPointKind.End, last.U, Stepper.ResidualAt(last.U), true, 0, last.Arclength, h.Termination.Message));
        }
        if (reverse is not null) AddEnd(reverse);
        AddEnd(forward);
        specials.Sort((x, y) => x.Arclength.CompareTo(y.Arclength));
        var all = new List<CurveNode>();
        if (reverse is not null) for (int i = reverse.Nodes.Count - 1; i >= 1; i--) all.Add(reverse.Nodes[i]);
        all.AddRange(forward.Nodes);
        var start = forward.Nodes[0];
        var firstEnd = reverse is not null ? reverse.Nodes[^1] : start;
        var lastEnd = forward.Nodes[^1];
        var points = new List<CurvePoint>(all.Count + specials.Count);
        int s = 0;
        void AddSpecialsBefore(double arclength)
        {
            while (s < specials.Count && specials[s].Arclength < arclength)
            {
                var sp = specials[s];
                if (sp.Kind is SpecialPointKind.Cusp or SpecialPointKind.BogdanovTakens && sp.Located)
                    points.Add(new CurvePoint
                    {
                        FirstParameter = sp.Parameter, SecondParameter = sp.SecondParameter!.Value, State = sp.State, Arclength = sp.Arclength,
                        Frequency = sp.Frequency, Type = sp.Kind == SpecialPointKind.Cusp ? BranchPointType.Cusp : BranchPointType.BogdanovTakens,
                        SpecialPointIndex = s,
                    });
                s++;
            }
        }
        foreach (var node in all)
        {
            AddSpecialsBefore(node.Arclength);
            var type = ReferenceEquals(node, start) ? BranchPointType.Start
                : node.Corner is not null ? BranchPointType.NonSmoothKink
                : ReferenceEquals(node, firstEnd) || ReferenceEquals(node, lastEnd) ? BranchPointType.End
                : BranchPointType.Regular;
            int link = type == BranchPointType.End ? specials.FindIndex(x => x.Kind == SpecialPointKind.End && x.Arclength == node.Arclength)
                : type == BranchPointType.NonSmoothKink ? specials.FindIndex(x => x.Kind == SpecialPointKind.NonSmoothKink && x.Arclength == node.Arclength) : -1;
            points.Add(new CurvePoint
            {
                FirstParameter = node.U[N], SecondParameter = node.U[N + 1], State = ImmutableArray.Create(node.U.AsSpan(0, N).ToArray()),
                Arclength = node.Arclength, Frequency = FrequencyOf(node.U), Type = type, SpecialPointIndex = link,
            });
        }
        AddSpecialsBefore(double.PositiveInfinity);
        int startIndex = points.FindIndex(p => p.Type == BranchPointType.Start);
        return new Curve(kind, FirstName, First, SecondName, Second, ImmutableCollectionsMarshal.AsImmutableArray(parameters), points, specials, startIndex, forward.Termination, reverse?.Termination);
    }

    protected override void Detect(CurveNode a, CurveNode b, HalfTrace trace, double direction)
    {
        if (b.Corner is SpecialPointKind)
            trace.Specials.Add(Make(SpecialPointKind.NonSmoothKink, b.U, b.CornerResidual, true, b.CornerIterations, b.Arclength,
                $"Non-smooth kink of the {(this is FoldCurveTracer ? "fold" : "Hopf")} curve at {Where(b.U)}."));
        if (Settings.DetectSpecialPoints) DetectOnSegment(a, b, trace, direction);
    }

    protected abstract void DetectOnSegment(CurveNode a, CurveNode b, HalfTrace trace, double direction);
}

/// <summary>Test-function values at a point of a fold curve.</summary>
internal readonly record struct FoldTests(double Cusp, double BogdanovTakens);

/// <summary>Traces a fold curve and locates cusps and Bogdanov–Takens points on it.</summary>
internal sealed class FoldCurveTracer : ParameterPlaneTracer
{
    private readonly FoldSystem _fold;
    private readonly double[] _g, _jac;

    public FoldCurveTracer(SystemDerivatives d, FoldSystem system, int first, int second, CurveOptions options)
        : base(d, system, StateWeights(d.N, options, d.N + 2), first, second, options)
    {
        _fold = system;
        _g = new double[system.Equations];
        _jac = new double[system.Equations * system.Unknowns];
    }

    protected override object? Describe(ReadOnlySpan<double> u) => Tests(u);

    private FoldTests? Tests(ReadOnlySpan<double> u) =>
        _fold.Evaluate(u, _g, _jac) ? new FoldTests(_fold.CuspTest, _fold.BogdanovTakensTest) : null;

    protected override void DetectOnSegment(CurveNode a, CurveNode b, HalfTrace trace, double direction)
    {
        if (a.Data is not FoldTests ta || b.DataIn is not FoldTests tb) return;
        var found = new List<SpecialPoint>();
        if (Math.Sign(ta.Cusp) * Math.Sign(tb.Cusp) < 0)
            found.Add(LocateZero(a, b, direction, t => t.Cusp, SpecialPointKind.Cusp));
        if (Math.Sign(ta.BogdanovTakens) * Math.Sign(tb.BogdanovTakens) < 0)
            found.Add(LocateZero(a, b, direction, t => t.BogdanovTakens, SpecialPointKind.BogdanovTakens));
        found.Sort((x, y) => direction * x.Arclength < direction * y.Arclength ? -1 : 1);
        trace.Specials.AddRange(found);
    }

    /// <summary>
    /// Finds the zero of a test function between a and b along the curve by the Illinois variant of
    /// regula falsi (Dahlquist and Björck, Numerical Methods, §6.2.4), each trial point corrected onto the curve.
    /// </summary>
    private SpecialPoint LocateZero(CurveNode a, CurveNode b, double direction, Func<FoldTests, double> test, SpecialPointKind kind)
    {
        var row = new double[M];
        Stepper.WeightedRow(a.T, row);
        double c0 = Vec.Dot(row, a.U);
        double s0 = 0, s1 = Vec.Dot(row, b.U) - c0;
        double f0 = test((FoldTests)a.Data!), f1 = test((FoldTests)b.DataIn!);
        var u = new double[M];
        var best = (double[])a.U.Clone();
        double bestF = Math.Abs(f0);
        int side = 0, iterations = 0;
        bool ok = true;
        double width = 1e-14 * (1 + Stepper.Norm(a.U));
        while (Math.Abs(s1 - s0) > width && iterations < 100)
        {
            iterations++;
            double s = (s0 * f1 - s1 * f0) / (f1 - f0);
            if (!(s > Math.Min(s0, s1) && s < Math.Max(s0, s1))) s = 0.5 * (s0 + s1);
            double alpha = s / (Vec.Dot(row, b.U) - c0);
            for (int i = 0; i < M; i++) u[i] = a.U[i] + alpha * (b.U[i] - a.U[i]);
            var outcome = Stepper.Correct(u, row, c0 + s, 2 * Stepper.Distance(a.U, b.U) + Settings.MinStep);
            FoldTests? t = outcome.Converged ? Tests(u) : null;
            if (t is not FoldTests tt) { ok = false; break; }
            double f = test(tt);
            if (Math.Abs(f) < bestF) { bestF = Math.Abs(f); u.CopyTo(best, 0); }
            if (f == 0) break;
            if (Math.Sign(f) == Math.Sign(f1))
            {
                s1 = s; f1 = f;
                if (side == -1) f0 *= 0.5;
                side = -1;
            }
            else
            {
                s0 = s; f0 = f;
                if (side == +1) f1 *= 0.5;
                side = +1;
            }
        }
        double residual = Stepper.ResidualAt(best);
        double arclength = a.Arclength + direction * Stepper.Distance(best, a.U);
        string name = kind == SpecialPointKind.Cusp ? "Cusp" : "Bogdanov–Takens point";
        string what = kind == SpecialPointKind.Cusp
            ? $"{name} at {Where(best)}: two fold curves meet and the bistable region between them closes."
            : $"{name} at {Where(best)}: the fold meets a Hopf curve (double zero eigenvalue).";
        return Make(kind, best, residual, ok, iterations, arclength, ok ? what : $"{name} near {Where(best)} (not converged).");
    }
}

/// <summary>Traces a Hopf curve; it ends where ω falls to zero (a Bogdanov–Takens point).</summary>
internal sealed class HopfCurveTracer : ParameterPlaneTracer
{
    /// <summary>ω below this fraction of its starting value ends the curve (the last point is placed at that ω): the extended system degenerates as ω → 0.</summary>
    private const double VanishingFrequency = 1e-4;

    private readonly HopfSystem _hopf;
    private readonly double _omega0;

    public HopfCurveTracer(SystemDerivatives d, HopfSystem system, int first, int second, CurveOptions options, double startFrequency)
        : base(d, system, StateWeights(d.N, options, system.Unknowns), first, second, options)
    {
        _hopf = system;
        _omega0 = Math.Abs(startFrequency);
    }

    protected override bool PassCorners => false;

    protected override object? Describe(ReadOnlySpan<double> u) => null;

    protected override double? FrequencyOf(ReadOnlySpan<double> u) => u[_hopf.OmegaIndex];

    protected override Outside? ExtraCheck(ReadOnlySpan<double> u)
    {
        double omega = u[_hopf.OmegaIndex];
        double floor = VanishingFrequency * _omega0;
        return omega <= floor
            ? new Outside(EndReason.HopfFrequencyVanished, $"The Hopf frequency ω fell to {floor:G3} near {Where(u)}: a Bogdanov–Takens point is near, where the Hopf curve ends on a fold curve.", _hopf.OmegaIndex, floor)
            : null;
    }

    /// <summary>No special points are detected on Hopf curves; their Bogdanov–Takens ends show as <see cref="EndReason.HopfFrequencyVanished"/>.</summary>
    protected override void DetectOnSegment(CurveNode a, CurveNode b, HalfTrace trace, double direction) { }
}
