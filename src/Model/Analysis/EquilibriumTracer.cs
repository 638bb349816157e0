using System.Collections.Immutable;
using System.Numerics;
using System.Runtime.InteropServices;

namespace Thermostrat.Model.Analysis;

/// <summary>Eigenvalue data at a point of a branch of equilibria.</summary>
internal sealed class EquilibriumData(StabilityReport report)
{
    public StabilityReport Report { get; } = report;

    /// <summary>Number of eigenvalues of complex pairs with positive real part (changes by 2 at a Hopf point).</summary>
    public int ComplexUnstable { get; } = report.Eigenvalues.Count(l => l.Real > 0 && l.Imaginary != 0);
}

/// <summary>Pseudo-arclength tracing of f(x; p) = 0 in one parameter, with detection and location of its special points.</summary>
internal sealed class EquilibriumTracer : CurveTracer
{
    /// <summary>Newton iterations allowed when locating a special point on its extended system.</summary>
    private const int LocateIterations = 25;

    /// <summary>A located point must lie within this many segment lengths of the bracketing segment's ends.</summary>
    private const double SegmentSlack = 1.5;

    private readonly SystemDerivatives _d;
    private readonly int _k, _n;
    private readonly ContinuationOptions _o;
    private readonly string _parameterName;
    private readonly IReadOnlyList<string>? _stateNames;
    private readonly double[] _jac, _f;

    public EquilibriumTracer(SystemDerivatives d, int parameterIndex, ContinuationOptions options, IReadOnlyList<string>? stateNames)
        : base(new EquilibriumSystem(d, [parameterIndex]), Weights(d.N, options), options)
    {
        _d = d;
        _k = parameterIndex;
        _n = d.N;
        _o = options;
        _parameterName = d.System.GetParameterName(parameterIndex);
        _stateNames = stateNames;
        _jac = new double[_n * _n];
        _f = new double[_n];
    }

    private static double[] Weights(int n, ContinuationOptions o)
    {
        var w = new double[n + 1];
        for (int i = 0; i < n; i++)
        {
            double s = o.StateScale?[i] ?? 1;
            w[i] = 1 / (s * s);
        }
        w[n] = 1 / (o.ParameterScale * o.ParameterScale);
        return w;
    }

    public new ArclengthStepper Stepper => base.Stepper;

    private string StateName(int i) => _stateNames is not null && i < _stateNames.Count ? $"'{_stateNames[i]}'" : $"{i}";

    protected override string Where(ReadOnlySpan<double> u) => $"{_parameterName} = {u[_n]:G10}";

    protected override Outside? CheckOutside(ReadOnlySpan<double> u)
    {
        double p = u[_n];
        if (p > _o.ParameterMax)
            return new Outside(EndReason.ParameterBoundReached, $"Reached the upper bound {_parameterName} = {_o.ParameterMax:G10}.", _n, _o.ParameterMax);
        if (p < _o.ParameterMin)
            return new Outside(EndReason.ParameterBoundReached, $"Reached the lower bound {_parameterName} = {_o.ParameterMin:G10}.", _n, _o.ParameterMin);
        for (int i = 0; i < _n; i++)
        {
            if (_o.StateMin is not null && u[i] < _o.StateMin[i])
                return new Outside(EndReason.StateBoundReached, $"State variable {StateName(i)} reached its lower bound {_o.StateMin[i]:G10} at {_parameterName} ≈ {p:G10}.", i, _o.StateMin[i]);
            if (_o.StateMax is not null && u[i] > _o.StateMax[i])
                return new Outside(EndReason.StateBoundReached, $"State variable {StateName(i)} reached its upper bound {_o.StateMax[i]:G10} at {_parameterName} ≈ {p:G10}.", i, _o.StateMax[i]);
        }
        if (_o.Validity is not null)
        {
            var parameters = (double[])_d.P.Clone();
            parameters[_k] = p;
            string? message = _o.Validity(u[.._n], parameters);
            if (message is not null)
                return new Outside(EndReason.InvalidState, $"The branch leaves the valid range at {_parameterName} ≈ {p:G10}: {message}", -1, 0);
        }
        return null;
    }

    protected override object? Describe(ReadOnlySpan<double> u)
    {
        if (!_o.ComputeEigenvalues) return null;
        return new EquilibriumData(Analyze(u));
    }

    public StabilityReport Analyze(ReadOnlySpan<double> u)
    {
        _d.P[_k] = u[_n];
        _d.Jacobian(u[.._n], _jac, _f);
        return Stability.FromJacobian(_jac, _n);
    }

    protected override SpecialPointKind ClassifyCorner(ReadOnlySpan<double> tIn, ReadOnlySpan<double> tOut) =>
        Math.Sign(tIn[_n]) != Math.Sign(tOut[_n]) && tIn[_n] != 0 && tOut[_n] != 0 ? SpecialPointKind.NonSmoothTurn : SpecialPointKind.NonSmoothKink;

    private SpecialPoint Make(SpecialPointKind kind, ReadOnlySpan<double> u, double residual, bool located, int iterations, double arclength, string description, double? frequency = null) => new()
    {
        Kind = kind,
        Parameter = u[_n],
        State = ImmutableArray.Create(u[.._n].ToArray()),
        Residual = residual,
        Located = located,
        Iterations = iterations,
        Arclength = arclength,
        Description = description,
        Frequency = frequency,
    };

    protected override void Detect(CurveNode a, CurveNode b, HalfTrace trace, double direction)
    {
        if (b.Corner is SpecialPointKind cornerKind)
        {
            string what = cornerKind == SpecialPointKind.NonSmoothTurn
                ? $"Non-smooth turning point at {_parameterName} = {b.U[_n]:G10}: the branch turns back at a corner of the right-hand side (no zero eigenvalue)."
                : $"Non-smooth kink at {_parameterName} = {b.U[_n]:G10}: the branch crosses a corner of the right-hand side.";
            trace.Specials.Add(Make(cornerKind, b.U, b.CornerResidual, true, b.CornerIterations, b.Arclength, what));
        }
        if (!_o.DetectSpecialPoints) return;
        var found = new List<SpecialPoint>();
        double ta = a.T[_n], tb = b.TIn[_n];
        if (ta != 0 && tb != 0 && Math.Sign(ta) != Math.Sign(tb)) found.Add(LocateFoldOrCorner(a, b, direction));
        if (a.DetSign != 0 && b.DetSignIn != 0 && a.DetSign != b.DetSignIn && LocateBranchPoint(a, b, direction) is SpecialPoint bp) found.Add(bp);
        if (a.Data is EquilibriumData da && b.DataIn is EquilibriumData db && da.ComplexUnstable != db.ComplexUnstable
            && LocateHopf(a, b, da, db, direction) is SpecialPoint hopf) found.Add(hopf);
        found.Sort((x, y) => direction * x.Arclength < direction * y.Arclength ? -1 : 1);
        trace.Specials.AddRange(found);
    }

    private bool OnSegment(ReadOnlySpan<double> u, CurveNode a, CurveNode b)
    {
        double len = Stepper.Distance(a.U, b.U) + Settings.MinStep;
        return Stepper.Distance(u, a.U) <= SegmentSlack * len && Stepper.Distance(u, b.U) <= SegmentSlack * len;
    }

    private SpecialPoint LocateFoldOrCorner(CurveNode a, CurveNode b, double direction)
    {
        double ta = a.T[_n], tb = b.TIn[_n];
        double alpha = ta / (ta - tb);
        var u = new double[_n + 1];
        var v = new double[_n];
        for (int i = 0; i <= _n; i++) u[i] = a.U[i] + alpha * (b.U[i] - a.U[i]);
        for (int i = 0; i < _n; i++) v[i] = a.T[i] + alpha * (b.TIn[i] - a.T[i]);
        var guess = (double[])u.Clone();
        var fold = new FoldSystem(_d, [_k], v);
        if (fold.InitialiseBorders(u))
        {
            var outcome = ExtendedNewton.Solve(fold, u, Settings.CorrectorTolerance, LocateIterations);
            if (outcome.Converged && OnSegment(u, a, b))
                return Make(SpecialPointKind.Fold, u, outcome.Residual, true, outcome.Iterations,
                    a.Arclength + direction * Stepper.Distance(u, a.U),
                    $"Fold (saddle-node) at {_parameterName} = {u[_n]:G10}: a real eigenvalue passes through zero and the branch turns back.");
        }
        // No smooth fold: a corner of a non-smooth right-hand side between a and b?
        var row = new double[_n + 1];
        Stepper.WeightedRow(a.T, row);
        double sigma = Vec.Dot(row, b.U) - Vec.Dot(row, a.U);
        var corner = sigma > 0 ? LocateCorner(a, a.T, b.TIn, sigma) : null;
        if (corner is not null && corner.Corner == SpecialPointKind.NonSmoothTurn)
            return Make(SpecialPointKind.NonSmoothTurn, corner.U, corner.CornerResidual, true, corner.CornerIterations,
                a.Arclength + direction * Stepper.Distance(corner.U, a.U),
                $"Non-smooth turning point at {_parameterName} = {corner.U[_n]:G10}: the branch turns back at a corner of the right-hand side (no zero eigenvalue).");
        _d.P[_k] = guess[_n];
        _d.Residual(guess.AsSpan(0, _n), _f);
        return Make(SpecialPointKind.Fold, guess, Vec.NormInf(_f), false, LocateIterations,
            a.Arclength + direction * Stepper.Distance(guess, a.U),
            $"Fold near {_parameterName} ≈ {guess[_n]:G8} (estimated by interpolation; the fold system did not converge).");
    }

    private SpecialPoint? LocateBranchPoint(CurveNode a, CurveNode b, double direction)
    {
        int n = _n;
        var z = new double[n + 1];
        var t = new double[n + 1];
        for (int i = 0; i <= n; i++) { z[i] = 0.5 * (a.U[i] + b.U[i]); t[i] = 0.5 * (a.T[i] + b.TIn[i]); }
        // Left null vector of [J f_p; tᵀ] by two steps of inverse iteration on its transpose.
        _d.P[_k] = z[n];
        var bordered = new double[(n + 1) * (n + 1)];
        var fp = new double[n];
        _d.Jacobian(z.AsSpan(0, n), _jac, _f);
        _d.ParameterDerivative(z.AsSpan(0, n), _k, fp);
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++) bordered[i * (n + 1) + j] = _jac[i * n + j];
            bordered[i * (n + 1) + n] = fp[i];
        }
        for (int j = 0; j <= n; j++) bordered[n * (n + 1) + j] = t[j];
        var lu = new LuFactorization(n + 1);
        var y = new double[n + 1];
        for (int i = 0; i <= n; i++) y[i] = 1 + 0.1 * i;
        if (lu.Factor(bordered, n + 1))
        {
            for (int pass = 0; pass < 2; pass++)
            {
                lu.SolveTransposed(y);
                double norm = Vec.Norm2(y);
                if (!(norm > 0) || !double.IsFinite(norm)) break;
                Vec.Scale(y, 1 / norm);
            }
        }
        var u = new double[2 * n + 2];
        z.AsSpan(0, n + 1).CopyTo(u);
        u[n + 1] = 0;
        double phiNorm = Vec.Norm2(y.AsSpan(0, n));
        for (int i = 0; i < n; i++) u[n + 2 + i] = phiNorm > 0 ? y[i] / phiNorm : (i == 0 ? 1 : 0);
        var bp = new BranchPointSystem(_d, _k);
        var outcome = ExtendedNewton.Solve(bp, u, Settings.CorrectorTolerance, LocateIterations);
        var x = u.AsSpan(0, n + 1);
        if (!outcome.Converged || !OnSegment(x, a, b)) return null;
        return Make(SpecialPointKind.BranchPoint, x, outcome.Residual, true, outcome.Iterations,
            a.Arclength + direction * Stepper.Distance(x, a.U),
            $"Branch point at {_parameterName} = {u[n]:G10}: another branch of equilibria crosses here.");
    }

    private SpecialPoint? LocateHopf(CurveNode a, CurveNode b, EquilibriumData da, EquilibriumData db, double direction)
    {
        int n = _n;
        static Complex? Crossing(StabilityReport r)
        {
            Complex? best = null;
            foreach (var l in r.Eigenvalues)
                if (l.Imaginary > 0 && (best is null || Math.Abs(l.Real) < Math.Abs(best.Value.Real))) best = l;
            return best;
        }
        if (Crossing(da.Report) is not Complex la || Crossing(db.Report) is not Complex lb) return null;
        double alpha = la.Real != lb.Real && Math.Sign(la.Real) != Math.Sign(lb.Real) ? la.Real / (la.Real - lb.Real) : 0.5;
        var z = new double[n + 1];
        for (int i = 0; i <= n; i++) z[i] = a.U[i] + alpha * (b.U[i] - a.U[i]);
        double omega = la.Imaginary + alpha * (lb.Imaginary - la.Imaginary);
        double mu = la.Real + alpha * (lb.Real - la.Real);
        _d.P[_k] = z[n];
        _d.Jacobian(z.AsSpan(0, n), _jac, _f);
        var ar = new double[n];
        var ai = new double[n];
        if (!ComplexEigenvector(_jac, n, mu, omega, ar, ai)) return null;
        var u = new double[3 * n + 2];
        var c = new double[n];
        z.AsSpan(0, n + 1).CopyTo(u);
        u[n + 1] = omega;
        HopfSystem.Normalise(ar, ai, u.AsSpan(n + 2, n), u.AsSpan(2 * n + 2, n), c);
        var hopf = new HopfSystem(_d, [_k], c);
        var outcome = ExtendedNewton.Solve(hopf, u, Settings.CorrectorTolerance, LocateIterations);
        var x = u.AsSpan(0, n + 1);
        double w = Math.Abs(u[n + 1]);
        if (!outcome.Converged || !(w > 0) || !OnSegment(x, a, b)) return null;
        _d.P[_k] = u[n];
        // a + ib belongs to iω; for ω < 0 its conjugate a − ib belongs to i|ω|.
        var imag = u.AsSpan(2 * n + 2, n).ToArray();
        if (u[n + 1] < 0) Vec.Scale(imag, -1);
        double? l1 = HopfCoefficient.FirstLyapunov(_d, u.AsSpan(0, n), w, u.AsSpan(n + 2, n), imag);
        string kind = l1 switch
        {
            < 0 => $" (supercritical, l1 = {l1:G4}: a stable oscillation is born)",
            > 0 => $" (subcritical, l1 = {l1:G4}: an unstable oscillation; expect a jump)",
            _ => "",
        };
        return Make(SpecialPointKind.Hopf, x, outcome.Residual, true, outcome.Iterations,
            a.Arclength + direction * Stepper.Distance(x, a.U),
            $"Hopf point at {_parameterName} = {u[n]:G10}: eigenvalues ±{w:G6}i cross the imaginary axis; oscillations of period {2 * Math.PI / w:G6} are born{kind}.",
            w) with { FirstLyapunovCoefficient = l1 };
    }

    /// <summary>
    /// An eigenvector a + ib of J for the eigenvalue nearest μ + iω, by inverse iteration on the real form
    /// [[J − μ, ω], [−ω, J − μ]] of J − (μ + iω) (Golub and Van Loan, §7.6.1).
    /// </summary>
    internal static bool ComplexEigenvector(ReadOnlySpan<double> jac, int n, double mu, double omega, Span<double> a, Span<double> b)
    {
        int m = 2 * n;
        var mat = new double[m * m];
        var lu = new LuFactorization(m);
        for (int attempt = 0; attempt < 3; attempt++)
        {
            double shiftRe = mu + attempt * 1e-9 * (1 + Math.Abs(omega)), shiftIm = omega;
            Array.Clear(mat);
            for (int i = 0; i < n; i++)
            {
                for (int j = 0; j < n; j++)
                {
                    mat[i * m + j] = jac[i * n + j];
                    mat[(n + i) * m + n + j] = jac[i * n + j];
                }
                mat[i * m + i] -= shiftRe;
                mat[(n + i) * m + n + i] -= shiftRe;
                mat[i * m + n + i] = shiftIm;
                mat[(n + i) * m + i] = -shiftIm;
            }
            if (!lu.Factor(mat, m)) continue;
            var y = new double[m];
            for (int i = 0; i < m; i++) y[i] = 1 + 0.37 * i;
            bool ok = true;
            for (int pass = 0; pass < 3 && ok; pass++)
            {
                lu.Solve(y);
                double norm = Vec.Norm2(y);
                ok = norm > 0 && double.IsFinite(norm);
                if (ok) Vec.Scale(y, 1 / norm);
            }
            if (!ok) continue;
            y.AsSpan(0, n).CopyTo(a);
            y.AsSpan(n, n).CopyTo(b);
            return true;
        }
        return false;
    }

    /// <summary>Converts traced halves into a branch.</summary>
    public Branch Assemble(HalfTrace forward, HalfTrace? reverse, double[] parameters)
    {
        var nodes = new List<(CurveNode Node, BranchPointType Type, int Special)>();
        var specials = new List<SpecialPoint>();
        if (reverse is not null) specials.AddRange(reverse.Specials);
        specials.AddRange(forward.Specials);
        void AddEnd(HalfTrace h)
        {
            var last = h.Nodes[^1];
            _d.P[_k] = last.U[_n];
            _d.Residual(last.U.AsSpan(0, _n), _f);
            specials.Add(Make(SpecialPointKind.End, last.U, Vec.NormInf(_f), true, 0, last.Arclength, h.Termination.Message));
        }
        if (reverse is not null) AddEnd(reverse);
        AddEnd(forward);
        specials.Sort((x, y) => x.Arclength.CompareTo(y.Arclength));

        var all = new List<CurveNode>();
        if (reverse is not null)
            for (int i = reverse.Nodes.Count - 1; i >= 1; i--) all.Add(reverse.Nodes[i]);
        int startIndex = all.Count;
        all.AddRange(forward.Nodes);

        var points = new List<ContinuationPoint>(all.Count + specials.Count);
        var start = forward.Nodes[0];
        var firstEnd = reverse is not null ? reverse.Nodes[^1] : start;
        var lastEnd = forward.Nodes[^1];
        int s = 0;
        for (int i = 0; i < all.Count; i++)
        {
            var node = all[i];
            // Located specials that lie before this node (not corners or ends, which are nodes themselves).
            while (s < specials.Count && specials[s].Arclength < node.Arclength)
            {
                var sp = specials[s];
                if (sp.Kind is not (SpecialPointKind.End or SpecialPointKind.NonSmoothTurn or SpecialPointKind.NonSmoothKink) && sp.Located)
                    points.Add(PointFromSpecial(sp, s));
                s++;
            }
            var type = ReferenceEquals(node, start) ? BranchPointType.Start
                : node.Corner is SpecialPointKind ck ? (ck == SpecialPointKind.NonSmoothTurn ? BranchPointType.NonSmoothTurn : BranchPointType.NonSmoothKink)
                : ReferenceEquals(node, firstEnd) || ReferenceEquals(node, lastEnd) ? BranchPointType.End
                : BranchPointType.Regular;
            int link = -1;
            if (type is BranchPointType.NonSmoothTurn or BranchPointType.NonSmoothKink or BranchPointType.End)
            {
                var kind = type switch
                {
                    BranchPointType.NonSmoothTurn => SpecialPointKind.NonSmoothTurn,
                    BranchPointType.NonSmoothKink => SpecialPointKind.NonSmoothKink,
                    _ => SpecialPointKind.End,
                };
                link = specials.FindIndex(x => x.Kind == kind && x.Arclength == node.Arclength);
            }
            var data = node.DataIn as EquilibriumData;
            points.Add(new ContinuationPoint
            {
                Parameter = node.U[_n],
                State = ImmutableArray.Create(node.U.AsSpan(0, _n).ToArray()),
                Arclength = node.Arclength,
                Eigenvalues = data?.Report.Eigenvalues ?? ImmutableArray<Complex>.Empty,
                Stability = data?.Report.Type ?? StabilityType.Unknown,
                UnstableCount = data?.Report.UnstableCount ?? -1,
                Type = type,
                SpecialPointIndex = link,
            });
        }
        for (; s < specials.Count; s++)
            if (specials[s].Kind is not (SpecialPointKind.End or SpecialPointKind.NonSmoothTurn or SpecialPointKind.NonSmoothKink) && specials[s].Located)
                points.Add(PointFromSpecial(specials[s], s));
        int startPoint = points.FindIndex(p => p.Type == BranchPointType.Start);
        return new Branch(_parameterName, _k, ImmutableCollectionsMarshal.AsImmutableArray(parameters), points, specials,
            startPoint, forward.Termination, reverse?.Termination);
    }

    private ContinuationPoint PointFromSpecial(SpecialPoint sp, int index)
    {
        var u = new double[_n + 1];
        sp.State.CopyTo(u);
        u[_n] = sp.Parameter;
        var report = _o.ComputeEigenvalues ? Analyze(u) : null;
        return new ContinuationPoint
        {
            Parameter = sp.Parameter,
            State = sp.State,
            Arclength = sp.Arclength,
            Eigenvalues = report?.Eigenvalues ?? ImmutableArray<Complex>.Empty,
            Stability = report?.Type ?? StabilityType.Unknown,
            UnstableCount = report?.UnstableCount ?? -1,
            Type = sp.Kind switch
            {
                SpecialPointKind.Fold => BranchPointType.Fold,
                SpecialPointKind.Hopf => BranchPointType.Hopf,
                SpecialPointKind.BranchPoint => BranchPointType.BranchPoint,
                _ => BranchPointType.Regular,
            },
            SpecialPointIndex = index,
        };
    }
}
