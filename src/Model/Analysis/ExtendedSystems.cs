namespace Thermostrat.Model.Analysis;

/// <summary>
/// A system of equations G(u) = 0 built on a model's right-hand side, with its Jacobian: the
/// equilibrium equations with free parameters, and the extended systems whose regular solutions
/// are folds, Hopf points and branch points. With as many unknowns as equations it is solved by
/// Newton's method (locating a point); with one unknown more it defines a curve that the
/// pseudo-arclength tracer follows.
/// </summary>
/// <remarks>The unknown vector always begins with the state x (n entries) and then the free parameters.</remarks>
internal abstract class ExtendedSystem
{
    protected ExtendedSystem(SystemDerivatives d, int[] freeParameters, int unknowns, int equations)
    {
        D = d;
        N = d.N;
        Free = freeParameters;
        Unknowns = unknowns;
        Equations = equations;
    }

    public SystemDerivatives D { get; }

    public int N { get; }

    /// <summary>Indices of the model parameters that are unknowns (stored at u[N], u[N+1], …).</summary>
    public int[] Free { get; }

    public int Unknowns { get; }

    public int Equations { get; }

    /// <summary>Writes G(u) and its Jacobian (Equations × Unknowns, row-major). Returns false if anything is non-finite.</summary>
    public abstract bool Evaluate(ReadOnlySpan<double> u, Span<double> g, Span<double> jacobian);

    /// <summary>Called once u is accepted as a point; may renormalise auxiliary unknowns in u (returns true if it changed u).</summary>
    public virtual bool OnAccepted(Span<double> u) => false;

    protected void SetParameters(ReadOnlySpan<double> u)
    {
        for (int j = 0; j < Free.Length; j++) D.P[Free[j]] = u[N + j];
    }
}

/// <summary>f(x; p) = 0 with the parameters in <see cref="ExtendedSystem.Free"/> as unknowns.</summary>
internal sealed class EquilibriumSystem : ExtendedSystem
{
    private readonly double[] _j, _fp;

    public EquilibriumSystem(SystemDerivatives d, int[] free) : base(d, free, d.N + free.Length, d.N)
    {
        _j = new double[N * N];
        _fp = new double[N];
    }

    /// <summary>The state Jacobian at the last evaluated point.</summary>
    public ReadOnlySpan<double> StateJacobian => _j;

    public override bool Evaluate(ReadOnlySpan<double> u, Span<double> g, Span<double> jacobian)
    {
        SetParameters(u);
        var x = u[..N];
        D.Jacobian(x, _j, g[..N]);
        int m = Unknowns;
        for (int i = 0; i < N; i++) _j.AsSpan(i * N, N).CopyTo(jacobian.Slice(i * m, N));
        for (int k = 0; k < Free.Length; k++)
        {
            D.ParameterDerivative(x, Free[k], _fp);
            for (int i = 0; i < N; i++) jacobian[i * m + N + k] = _fp[i];
        }
        return Vec.AllFinite(g[..N]) && Vec.AllFinite(jacobian[..(N * m)]);
    }
}

/// <summary>
/// The minimally augmented fold system (Govaerts, Numerical Methods for Bifurcations of Dynamical
/// Equilibria, SIAM 2000, §4.2; Kuznetsov, Elements of Applied Bifurcation Theory, 3rd ed., §10.2):
/// f(x; p) = 0 and g(x; p) = 0, where g is the last component of the solution of the bordered system
/// [J b; cᵀ 0] [v; g] = [0; 1]. g vanishes exactly where J is singular, and g_z = −wᵀ J_z v with
/// [J b; cᵀ 0]ᵀ [w; g] = [0; 1]. The borders b, c are the last left and right null vector estimates.
/// </summary>
internal sealed class FoldSystem : ExtendedSystem
{
    private readonly double[] _j, _fp, _bordered, _v, _w, _hv, _fpv, _b, _c;
    private readonly LuFactorization _lu;

    public FoldSystem(SystemDerivatives d, int[] free, ReadOnlySpan<double> rightNullGuess)
        : base(d, free, d.N + free.Length, d.N + 1)
    {
        _j = new double[N * N];
        _fp = new double[N];
        _bordered = new double[(N + 1) * (N + 1)];
        _v = new double[N + 1];
        _w = new double[N + 1];
        _hv = new double[N * N];
        _fpv = new double[N];
        _b = new double[N];
        _c = new double[N];
        _lu = new LuFactorization(N + 1);
        rightNullGuess.CopyTo(_c);
        double norm = Vec.Norm2(_c);
        if (!(norm > 0)) { _c.AsSpan().Clear(); _c[0] = 1; norm = 1; }
        Vec.Scale(_c, 1 / norm);
        _c.CopyTo(_b, 0);
    }

    /// <summary>Right null vector estimate v (normalised) at the last evaluation.</summary>
    public ReadOnlySpan<double> RightVector => _v.AsSpan(0, N);

    /// <summary>Left null vector estimate w at the last evaluation.</summary>
    public ReadOnlySpan<double> LeftVector => _w.AsSpan(0, N);

    /// <summary>Cusp test function wᵀ B(v, v)/(|w| |v|²) at the last evaluation (B the second derivative of f).</summary>
    public double CuspTest { get; private set; }

    /// <summary>Bogdanov–Takens test function wᵀv/(|w| |v|) at the last evaluation.</summary>
    public double BogdanovTakensTest { get; private set; }

    /// <summary>
    /// Sets the left border to the left null vector estimate of J at u (one transposed bordered solve
    /// with b = c), so that b is not nearly orthogonal to the true left null vector.
    /// </summary>
    public bool InitialiseBorders(ReadOnlySpan<double> u)
    {
        SetParameters(u);
        D.Jacobian(u[..N], _j, _fp);
        for (int pass = 0; pass < 2; pass++)
        {
            if (!FactorBordered()) return false;
            SolveNull();
            UpdateBorders();
        }
        return true;
    }

    private bool FactorBordered()
    {
        int m = N + 1;
        for (int i = 0; i < N; i++)
        {
            _j.AsSpan(i * N, N).CopyTo(_bordered.AsSpan(i * m, N));
            _bordered[i * m + N] = _b[i];
        }
        for (int j = 0; j < N; j++) _bordered[N * m + j] = _c[j];
        _bordered[N * m + N] = 0;
        return _lu.Factor(_bordered, m);
    }

    private void SolveNull()
    {
        Array.Clear(_v); _v[N] = 1; _lu.Solve(_v);
        Array.Clear(_w); _w[N] = 1; _lu.SolveTransposed(_w);
    }

    private void UpdateBorders()
    {
        double nv = Vec.Norm2(_v.AsSpan(0, N)), nw = Vec.Norm2(_w.AsSpan(0, N));
        if (nv > 0 && double.IsFinite(nv)) for (int i = 0; i < N; i++) _c[i] = _v[i] / nv;
        if (nw > 0 && double.IsFinite(nw)) for (int i = 0; i < N; i++) _b[i] = _w[i] / nw;
    }

    public override bool Evaluate(ReadOnlySpan<double> u, Span<double> g, Span<double> jacobian)
    {
        SetParameters(u);
        var x = u[..N];
        int m = Unknowns;
        D.Jacobian(x, _j, g[..N]);
        if (!Vec.AllFinite(_j) || !FactorBordered()) return false;
        SolveNull();
        g[N] = _v[N];
        var v = _v.AsSpan(0, N);
        var w = _w.AsSpan(0, N);
        D.JacobianAlong(x, v, _hv);
        for (int i = 0; i < N; i++) _j.AsSpan(i * N, N).CopyTo(jacobian.Slice(i * m, N));
        // g_x = −wᵀ (d/dε J(x + εv)).
        double cusp = 0;
        for (int j = 0; j < N; j++)
        {
            double s = 0;
            for (int i = 0; i < N; i++) s += w[i] * _hv[i * N + j];
            jacobian[N * m + j] = -s;
            cusp += s * v[j];
        }
        for (int k = 0; k < Free.Length; k++)
        {
            D.ParameterDerivative(x, Free[k], _fp);
            for (int i = 0; i < N; i++) jacobian[i * m + N + k] = _fp[i];
            D.ParameterDerivativeAlong(x, Free[k], v, _fpv);
            jacobian[N * m + N + k] = -Vec.Dot(w, _fpv);
        }
        double nv = Vec.Norm2(v), nw = Vec.Norm2(w);
        CuspTest = cusp / (nw * nv * nv);
        BogdanovTakensTest = Vec.Dot(w, v) / (nw * nv);
        return Vec.AllFinite(g[..(N + 1)]) && Vec.AllFinite(jacobian[..((N + 1) * m)]);
    }

    public override bool OnAccepted(Span<double> u)
    {
        UpdateBorders();
        return false;
    }
}

/// <summary>
/// The standard extended system for Hopf points (Kuznetsov, Elements of Applied Bifurcation Theory,
/// 3rd ed., §10.2.2; Roose and Hlavacek, SIAM J. Appl. Math. 45, 879, 1985): unknowns
/// (x, free parameters, ω, a, b) with f = 0, J a + ω b = 0, J b − ω a = 0, cᵀa = 1, cᵀb = 0, so that
/// J (a + i b) = iω (a + i b): a pair of eigenvalues ±iω.
/// </summary>
internal sealed class HopfSystem : ExtendedSystem
{
    private readonly double[] _j, _fp, _ha, _hb, _pa, _pb, _c;

    public HopfSystem(SystemDerivatives d, int[] free, ReadOnlySpan<double> normalisation)
        : base(d, free, 3 * d.N + free.Length + 1, 3 * d.N + 2)
    {
        _j = new double[N * N];
        _fp = new double[N];
        _ha = new double[N * N];
        _hb = new double[N * N];
        _pa = new double[N];
        _pb = new double[N];
        _c = normalisation.ToArray();
    }

    /// <summary>Offset of ω in the unknown vector.</summary>
    public int OmegaIndex => N + Free.Length;

    /// <summary>Offset of a (b follows it).</summary>
    public int RealVectorIndex => OmegaIndex + 1;

    /// <summary>
    /// Fills u's eigenvector part from an eigenvector a + ib of eigenvalue iω (any complex scale),
    /// normalised so that cᵀa = 1, cᵀb = 0 with c = a/|a| (after rotating so a carries the larger part).
    /// </summary>
    public static void Normalise(ReadOnlySpan<double> aIn, ReadOnlySpan<double> bIn, Span<double> aOut, Span<double> bOut, Span<double> c)
    {
        int n = aIn.Length;
        // Rotate the phase to maximise |Re q|: q e^{iθ} with tan 2θ = 2 a·b / (b·b − a·a).
        double aa = Vec.Dot(aIn, aIn), bb = Vec.Dot(bIn, bIn), ab = Vec.Dot(aIn, bIn);
        double theta = 0.5 * Math.Atan2(2 * ab, aa - bb);
        double cs = Math.Cos(theta), sn = Math.Sin(theta);
        // (a + ib)(cos θ − i sin θ) = (a cos θ + b sin θ) + i (b cos θ − a sin θ)
        for (int i = 0; i < n; i++)
        {
            double ai = aIn[i] * cs + bIn[i] * sn;
            double bi = bIn[i] * cs - aIn[i] * sn;
            aOut[i] = ai; bOut[i] = bi;
        }
        double na = Vec.Norm2(aOut);
        for (int i = 0; i < n; i++) c[i] = aOut[i] / na;
        double sRe = Vec.Dot(c, aOut), sIm = Vec.Dot(c, bOut);
        double den = sRe * sRe + sIm * sIm;
        for (int i = 0; i < n; i++)
        {
            // (a + ib)/(sRe + i sIm)
            double ai = aOut[i], bi = bOut[i];
            aOut[i] = (ai * sRe + bi * sIm) / den;
            bOut[i] = (bi * sRe - ai * sIm) / den;
        }
    }

    public override bool Evaluate(ReadOnlySpan<double> u, Span<double> g, Span<double> jacobian)
    {
        SetParameters(u);
        int n = N, m = Unknowns, nf = Free.Length, iw = OmegaIndex, ia = RealVectorIndex, ib = ia + n;
        var x = u[..n];
        double omega = u[iw];
        var a = u.Slice(ia, n);
        var b = u.Slice(ib, n);
        jacobian[..(Equations * m)].Clear();
        D.Jacobian(x, _j, g[..n]);
        D.JacobianAlong(x, a, _ha);
        D.JacobianAlong(x, b, _hb);
        for (int i = 0; i < n; i++)
        {
            double ja = 0, jb = 0;
            for (int j = 0; j < n; j++) { ja += _j[i * n + j] * a[j]; jb += _j[i * n + j] * b[j]; }
            g[n + i] = ja + omega * b[i];
            g[2 * n + i] = jb - omega * a[i];
            var row1 = jacobian.Slice(i * m, m);
            var row2 = jacobian.Slice((n + i) * m, m);
            var row3 = jacobian.Slice((2 * n + i) * m, m);
            for (int j = 0; j < n; j++)
            {
                double jij = _j[i * n + j];
                row1[j] = jij;
                row2[j] = _ha[i * n + j];
                row3[j] = _hb[i * n + j];
                row2[ia + j] = jij;
                row3[ib + j] = jij;
            }
            row2[iw] = b[i];
            row3[iw] = -a[i];
            row2[ib + i] = omega;
            row3[ia + i] = -omega;
        }
        for (int k = 0; k < nf; k++)
        {
            D.ParameterDerivative(x, Free[k], _fp);
            D.ParameterDerivativeAlong(x, Free[k], a, _pa);
            D.ParameterDerivativeAlong(x, Free[k], b, _pb);
            for (int i = 0; i < n; i++)
            {
                jacobian[i * m + n + k] = _fp[i];
                jacobian[(n + i) * m + n + k] = _pa[i];
                jacobian[(2 * n + i) * m + n + k] = _pb[i];
            }
        }
        g[3 * n] = Vec.Dot(_c, a) - 1;
        g[3 * n + 1] = Vec.Dot(_c, b);
        var r4 = jacobian.Slice(3 * n * m, m);
        var r5 = jacobian.Slice((3 * n + 1) * m, m);
        for (int j = 0; j < n; j++) { r4[ia + j] = _c[j]; r5[ib + j] = _c[j]; }
        return Vec.AllFinite(g[..Equations]) && Vec.AllFinite(jacobian[..(Equations * m)]);
    }

    public override bool OnAccepted(Span<double> u)
    {
        int n = N, ia = RealVectorIndex;
        var a = u.Slice(ia, n).ToArray();
        var b = u.Slice(ia + n, n).ToArray();
        Normalise(a, b, u.Slice(ia, n), u.Slice(ia + n, n), _c);
        return true;
    }
}

/// <summary>
/// The extended system for a simple branch point of f(x; p) = 0 in one parameter (Moore, SIAM J. Numer.
/// Anal. 17, 567, 1980; Govaerts 2000, §5.1): unknowns (x, p, μ, φ) with f + μφ = 0, Jᵀφ = 0,
/// f_pᵀφ = 0, φᵀφ = 1. At a branch point [J f_p] has rank n − 1 with left null vector φ, and μ = 0.
/// </summary>
internal sealed class BranchPointSystem : ExtendedSystem
{
    private readonly double[] _j, _fp, _hphi, _jp, _fpp;

    public BranchPointSystem(SystemDerivatives d, int parameter) : base(d, [parameter], 2 * d.N + 2, 2 * d.N + 2)
    {
        _j = new double[N * N];
        _fp = new double[N];
        _hphi = new double[N * N];
        _jp = new double[N * N];
        _fpp = new double[N];
    }

    public override bool Evaluate(ReadOnlySpan<double> u, Span<double> g, Span<double> jacobian)
    {
        SetParameters(u);
        int n = N, m = Unknowns, k = Free[0];
        var x = u[..n];
        double mu = u[n + 1];
        var phi = u.Slice(n + 2, n);
        jacobian[..(m * m)].Clear();
        D.Jacobian(x, _j, g[..n]);
        D.ParameterDerivative(x, k, _fp);
        D.HessianOfContraction(x, phi, _hphi);
        D.JacobianParameterDerivative(x, k, _jp);
        D.SecondParameterDerivative(x, k, _fpp);
        int iPhi = n + 2;
        for (int i = 0; i < n; i++)
        {
            g[i] += mu * phi[i];
            double jt = 0, jpt = 0;
            for (int l = 0; l < n; l++) { jt += _j[l * n + i] * phi[l]; jpt += _jp[l * n + i] * phi[l]; }
            g[n + i] = jt;
            var row1 = jacobian.Slice(i * m, m);
            var row2 = jacobian.Slice((n + i) * m, m);
            for (int j = 0; j < n; j++)
            {
                row1[j] = _j[i * n + j];
                row2[j] = _hphi[i * n + j];
                row2[iPhi + j] = _j[j * n + i];
            }
            row1[n] = _fp[i];
            row1[n + 1] = phi[i];
            row1[iPhi + i] = mu;
            row2[n] = jpt;
            // Row of f_pᵀφ: ∂/∂x_j = (J_pᵀφ)_j.
            jacobian[2 * n * m + i] = jpt;
            jacobian[2 * n * m + iPhi + i] = _fp[i];
            jacobian[(2 * n + 1) * m + iPhi + i] = 2 * phi[i];
        }
        g[2 * n] = Vec.Dot(_fp, phi);
        jacobian[2 * n * m + n] = Vec.Dot(_fpp, phi);
        g[2 * n + 1] = Vec.Dot(phi, phi) - 1;
        return Vec.AllFinite(g[..m]) && Vec.AllFinite(jacobian[..(m * m)]);
    }
}

/// <summary>Outcome of a Newton solve of a square extended system.</summary>
internal readonly record struct NewtonOutcome(bool Converged, double Residual, int Iterations);

/// <summary>Plain Newton's method on a square extended system (quadratic convergence near a regular solution).</summary>
internal static class ExtendedNewton
{
    /// <summary>
    /// Iterates until max|G| ≤ <paramref name="tolerance"/>, then up to <paramref name="polish"/> further
    /// iterations while the residual keeps falling (the located point is then accurate to rounding).
    /// </summary>
    public static NewtonOutcome Solve(ExtendedSystem system, Span<double> u, double tolerance, int maxIterations, int polish = 2)
    {
        if (system.Unknowns != system.Equations) throw new InvalidOperationException("Newton's method needs a square system.");
        int m = system.Unknowns;
        var g = new double[m];
        var jac = new double[m * m];
        var lu = new LuFactorization(m);
        var best = new double[m];
        double bestResidual = double.PositiveInfinity;
        int converged = -1;
        for (int it = 0; ; it++)
        {
            if (!system.Evaluate(u, g, jac)) break;
            double residual = Vec.NormInf(g);
            if (!(residual < bestResidual))
            {
                if (converged >= 0) break;
            }
            else
            {
                bestResidual = residual;
                u.CopyTo(best);
            }
            if (residual <= tolerance && converged < 0) converged = it;
            if (converged >= 0 && it - converged >= polish) break;
            if ((converged < 0 && it >= maxIterations) || !lu.Factor(jac, m)) break;
            for (int i = 0; i < m; i++) g[i] = -g[i];
            lu.Solve(g);
            for (int i = 0; i < m; i++) u[i] += g[i];
            if (!Vec.AllFinite(u)) break;
        }
        if (double.IsFinite(bestResidual)) best.CopyTo(u);
        else bestResidual = double.NaN;
        // Note: the system's internal state (null vectors, test functions) may belong to a later iterate; re-evaluate at u if needed.
        return new NewtonOutcome(converged >= 0, bestResidual, converged >= 0 ? converged : maxIterations);
    }
}
