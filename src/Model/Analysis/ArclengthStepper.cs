namespace Thermostrat.Model.Analysis;

/// <summary>Outcome of one corrector solve.</summary>
internal readonly record struct CorrectorOutcome(bool Converged, bool NonFinite, double Residual, int Iterations);

/// <summary>
/// The linear algebra of pseudo-arclength continuation (Keller 1977; Allgower and Georg, Introduction
/// to Numerical Continuation Methods, SIAM 2003, ch. 2): tangents as the kernel of the Jacobian of
/// G bordered by the previous tangent, and Newton correctors on G(u) = 0 plus one linear constraint
/// rᵀu = c. Inner products are weighted, ⟨a, b⟩ = Σ wᵢ aᵢ bᵢ with wᵢ = 1/scaleᵢ² (wᵢ = 0 leaves a
/// component out of the arclength). Buffers are allocated once; not thread-safe.
/// </summary>
internal sealed class ArclengthStepper
{
    private readonly ExtendedSystem _sys;
    private readonly double[] _g, _jac, _mat, _rhs, _probe, _start;
    private readonly LuFactorization _lu;

    public ArclengthStepper(ExtendedSystem system, double[] weights, double tolerance, int maxIterations)
    {
        if (system.Unknowns != system.Equations + 1) throw new ArgumentException("A curve needs one more unknown than equations.", nameof(system));
        _sys = system;
        M = system.Unknowns;
        Weights = weights;
        Tolerance = tolerance;
        MaxIterations = maxIterations;
        _g = new double[M];
        _jac = new double[M * M];
        _mat = new double[M * M];
        _rhs = new double[M];
        _probe = new double[M];
        _start = new double[M];
        _lu = new LuFactorization(M);
    }

    public int M { get; }

    public double[] Weights { get; }

    public double Tolerance { get; }

    public int MaxIterations { get; }

    public ExtendedSystem System => _sys;

    /// <summary>Number of evaluations of G and its Jacobian so far.</summary>
    public long Evaluations { get; private set; }

    public double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        double s = 0;
        for (int i = 0; i < M; i++) s += Weights[i] * a[i] * b[i];
        return s;
    }

    public double Norm(ReadOnlySpan<double> a) => Math.Sqrt(Dot(a, a));

    public double Distance(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        double s = 0;
        for (int i = 0; i < M; i++) { double d = a[i] - b[i]; s += Weights[i] * d * d; }
        return Math.Sqrt(s);
    }

    /// <summary>The weighted row w∘t, so that rowᵀ(u − u₀) is the projection of u − u₀ on t.</summary>
    public void WeightedRow(ReadOnlySpan<double> t, Span<double> row)
    {
        for (int i = 0; i < M; i++) row[i] = Weights[i] * t[i];
    }

    private bool Evaluate(ReadOnlySpan<double> u)
    {
        Evaluations++;
        return _sys.Evaluate(u, _g, _jac);
    }

    /// <summary>max|G| at u (one evaluation).</summary>
    public double ResidualAt(ReadOnlySpan<double> u) => Evaluate(u) ? Vec.NormInf(_g.AsSpan(0, M - 1)) : double.NaN;

    private bool FactorBordered(ReadOnlySpan<double> row)
    {
        int e = M - 1;
        _jac.AsSpan(0, e * M).CopyTo(_mat);
        row.CopyTo(_mat.AsSpan(e * M, M));
        return _lu.Factor(_mat, M);
    }

    /// <summary>
    /// Newton's method on G(u) = 0, rowᵀu = c from the guess in <paramref name="u"/> (overwritten).
    /// Fails if it does not converge in the iteration limit or ends farther than
    /// <paramref name="maxDistance"/> (weighted) from the guess. At least <paramref name="minIterations"/>
    /// Newton steps are taken even if the guess already meets the tolerance, so that accepted points
    /// are polished to rounding rather than left anywhere within the tolerance.
    /// </summary>
    public CorrectorOutcome Correct(Span<double> u, ReadOnlySpan<double> row, double c, double maxDistance, int minIterations = 1)
    {
        int e = M - 1;
        u.CopyTo(_start);
        for (int it = 0; ; it++)
        {
            if (!Evaluate(u)) return new CorrectorOutcome(false, true, double.NaN, it);
            double residual = Vec.NormInf(_g.AsSpan(0, e));
            double constraint = Vec.Dot(row, u) - c;
            if (it >= minIterations && residual <= Tolerance && Math.Abs(constraint) <= Tolerance * (1 + Math.Abs(c)))
            {
                bool near = Distance(u, _start) <= maxDistance;
                return new CorrectorOutcome(near, false, residual, it);
            }
            if (it >= MaxIterations || !FactorBordered(row)) return new CorrectorOutcome(false, false, residual, it);
            for (int i = 0; i < e; i++) _rhs[i] = -_g[i];
            _rhs[e] = -constraint;
            _lu.Solve(_rhs);
            for (int i = 0; i < M; i++) u[i] += _rhs[i];
            if (!Vec.AllFinite(u)) return new CorrectorOutcome(false, true, double.NaN, it + 1);
        }
    }

    /// <summary>
    /// The unit (weighted) tangent at u: the kernel of the Jacobian of G, bordered by
    /// <paramref name="border"/> and oriented so that borderᵀt &gt; 0. With <paramref name="evaluate"/> false
    /// it uses the Jacobian of the last evaluation (valid right after a converged corrector at u).
    /// </summary>
    /// <remarks>determinantSign is the sign of det [DG; borderᵀ], the branch-point test function.</remarks>
    public bool Tangent(ReadOnlySpan<double> u, ReadOnlySpan<double> border, Span<double> t, out int determinantSign, bool evaluate = true)
    {
        determinantSign = 0;
        if (evaluate && !Evaluate(u)) return false;
        if (!FactorBordered(border)) return false;
        t.Clear();
        t[M - 1] = 1;
        _lu.Solve(t);
        double norm = Norm(t);
        if (!(norm > 0) || !double.IsFinite(norm)) return false;
        Vec.Scale(t, 1 / norm);
        determinantSign = _lu.DeterminantSign;
        return true;
    }

    /// <summary>
    /// A first tangent at u with no previous tangent: borders by the unit vector of component
    /// <paramref name="preferred"/> first, then by each other component, and keeps the best-conditioned.
    /// </summary>
    public bool InitialTangent(ReadOnlySpan<double> u, int preferred, Span<double> t, out int determinantSign)
    {
        determinantSign = 0;
        if (!Evaluate(u)) return false;
        double bestRatio = 0;
        var border = new double[M];
        var trial = new double[M];
        for (int pass = -1; pass < M; pass++)
        {
            int index = pass < 0 ? preferred : pass;
            if (pass >= 0 && index == preferred) continue;
            Array.Clear(border);
            border[index] = 1;
            if (!FactorBordered(border)) continue;
            double ratio = _lu.PivotRatio;
            if (ratio <= bestRatio) continue;
            trial.AsSpan().Clear();
            trial[M - 1] = 1;
            _lu.Solve(trial);
            double norm = Norm(trial);
            if (!(norm > 0) || !double.IsFinite(norm)) continue;
            Vec.Scale(trial, 1 / norm);
            trial.CopyTo(t);
            bestRatio = ratio;
            determinantSign = _lu.DeterminantSign;
            if (pass < 0 && ratio > 1e-8) break;
        }
        if (bestRatio == 0) return false;
        // Re-derive the determinant sign with the tangent itself as border, as on the rest of the curve.
        WeightedRow(t, border);
        return Tangent(u, border, trial, out determinantSign, evaluate: false) && CopyTo(trial, t);
    }

    private static bool CopyTo(ReadOnlySpan<double> a, Span<double> b) { a.CopyTo(b); return true; }

    /// <summary>The (unoriented) kernel direction of the Jacobian of G at an arbitrary point u, bordered by <paramref name="border"/>.</summary>
    public bool KernelAt(ReadOnlySpan<double> u, ReadOnlySpan<double> border, Span<double> k) => Tangent(u, border, k, out _, evaluate: true);

    /// <summary>Scratch vector of length M for callers' probes.</summary>
    public Span<double> Probe => _probe;
}
