using System.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>
/// The first Lyapunov coefficient l1 of a Hopf point, which decides whether the oscillation born there
/// is stable (supercritical, l1 &lt; 0) or unstable (subcritical, l1 &gt; 0). Kuznetsov, Elements of Applied
/// Bifurcation Theory, 3rd ed., eq. (3.20), valid in n dimensions (§5.4):
/// <code>
///   l1 = Re[ ⟨p, C(q, q, q̄)⟩ − 2⟨p, B(q, A⁻¹B(q, q̄))⟩ + ⟨p, B(q̄, (2iω − A)⁻¹B(q, q))⟩ ] / (2ω)
/// </code>
/// with A q = iω q, Aᵀp = −iω p, ⟨q, q⟩ = ⟨p, q⟩ = 1 (⟨u, v⟩ = Σ ūᵢvᵢ), and B, C the second and third
/// derivatives of f (Kuznetsov's normalisation ⟨q, q⟩ = 1, from memory; the value scales with |q|², its sign
/// does not). For ż = (μ + iω) z + s z|z|² in Cartesian coordinates this gives l1 = 2s/ω. B comes from
/// central differences of the exact Jacobian along a direction, C from a second central difference of
/// those; l1 is accurate to about 1e-6 relative.
/// </summary>
internal static class HopfCoefficient
{
    /// <summary>Outer difference step of the third derivative (relative), larger than the inner one to limit rounding.</summary>
    private const double OuterStep = 1e-4;

    public static double? FirstLyapunov(SystemDerivatives d, ReadOnlySpan<double> x, double omega, ReadOnlySpan<double> aIn, ReadOnlySpan<double> bIn)
    {
        int n = d.N;
        var a = aIn.ToArray();
        var b = bIn.ToArray();
        // Normalise ⟨q, q⟩ = 1.
        double qn = Math.Sqrt(Vec.Dot(a, a) + Vec.Dot(b, b));
        if (!(qn > 0)) return null;
        Vec.Scale(a, 1 / qn);
        Vec.Scale(b, 1 / qn);
        var jac = new double[n * n];
        var f = new double[n];
        d.Jacobian(x, jac, f);
        // Left eigenvector p of Aᵀ for −iω, normalised so that ⟨p, q⟩ = 1.
        var jt = new double[n * n];
        for (int i = 0; i < n; i++) for (int j = 0; j < n; j++) jt[j * n + i] = jac[i * n + j];
        var pr = new double[n];
        var pi = new double[n];
        if (!EquilibriumTracer.ComplexEigenvector(jt, n, 0, -omega, pr, pi)) return null;
        var p = new Complex[n];
        var q = new Complex[n];
        for (int i = 0; i < n; i++) { p[i] = new Complex(pr[i], pi[i]); q[i] = new Complex(a[i], b[i]); }
        Complex s = Inner(p, q);
        if (s == Complex.Zero) return null;
        for (int i = 0; i < n; i++) p[i] /= Complex.Conjugate(s);

        var ha = new double[n * n];
        var hb = new double[n * n];
        d.JacobianAlong(x, a, ha);
        d.JacobianAlong(x, b, hb);
        // B(q, q̄) = B(a, a) + B(b, b) (real); B(q, q) = B(a, a) − B(b, b) + 2i B(a, b).
        var baa = MatVec(ha, a, n);
        var bbb = MatVec(hb, b, n);
        var bab = MatVec(ha, b, n);
        var bqqbar = new double[n];
        var bqq = new Complex[n];
        for (int i = 0; i < n; i++)
        {
            bqqbar[i] = baa[i] + bbb[i];
            bqq[i] = new Complex(baa[i] - bbb[i], 2 * bab[i]);
        }
        // h = A⁻¹ B(q, q̄) (real).
        var lu = new LuFactorization(2 * n);
        if (!lu.Factor(jac, n)) return null;
        var h = (double[])bqqbar.Clone();
        lu.Solve(h);
        // B(q, h) = H_a h + i H_b h.
        var hah = MatVec(ha, h, n);
        var hbh = MatVec(hb, h, n);
        var bqh = new Complex[n];
        for (int i = 0; i < n; i++) bqh[i] = new Complex(hah[i], hbh[i]);
        // w = (2iω − A)⁻¹ B(q, q): real form [[−A, −2ω], [2ω, −A]] [r; s] = [Re; Im].
        var big = new double[4 * n * n];
        int m = 2 * n;
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++)
            {
                big[i * m + j] = -jac[i * n + j];
                big[(n + i) * m + n + j] = -jac[i * n + j];
            }
            big[i * m + n + i] = -2 * omega;
            big[(n + i) * m + i] = 2 * omega;
        }
        if (!lu.Factor(big, m)) return null;
        var rhs = new double[m];
        for (int i = 0; i < n; i++) { rhs[i] = bqq[i].Real; rhs[n + i] = bqq[i].Imaginary; }
        lu.Solve(rhs);
        var wr = rhs.AsSpan(0, n).ToArray();
        var wi = rhs.AsSpan(n, n).ToArray();
        // B(q̄, w) = H_a wr + H_b wi + i (H_a wi − H_b wr).
        var t1 = MatVec(ha, wr, n);
        var t2 = MatVec(hb, wi, n);
        var t3 = MatVec(ha, wi, n);
        var t4 = MatVec(hb, wr, n);
        var bqbarw = new Complex[n];
        for (int i = 0; i < n; i++) bqbarw[i] = new Complex(t1[i] + t2[i], t3[i] - t4[i]);
        // C(q, q, q̄) = [C(a,a,a) + C(a,b,b)] + i [C(a,a,b) + C(b,b,b)] by symmetry of C.
        var caaa = Third(d, x, a, a, a);
        var cabb = Third(d, x, b, b, a);
        var caab = Third(d, x, a, a, b);
        var cbbb = Third(d, x, b, b, b);
        var cqqq = new Complex[n];
        for (int i = 0; i < n; i++) cqqq[i] = new Complex(caaa[i] + cabb[i], caab[i] + cbbb[i]);
        Complex total = Inner(p, cqqq) - 2 * Inner(p, bqh) + Inner(p, bqbarw);
        double l1 = total.Real / (2 * omega);
        return double.IsFinite(l1) ? l1 : null;
    }

    /// <summary>C(u, v, w) = d/dδ [B at x + δw](u, v), a central difference of B(u, v) = (d/dε J(x + εu)) v.</summary>
    private static double[] Third(SystemDerivatives d, ReadOnlySpan<double> x, double[] u, double[] v, double[] w)
    {
        int n = d.N;
        double step = OuterStep * (1 + Vec.NormInf(x)) / Math.Max(Vec.NormInf(w), 1e-300);
        var xp = new double[n];
        var xm = new double[n];
        for (int i = 0; i < n; i++) { xp[i] = x[i] + step * w[i]; xm[i] = x[i] - step * w[i]; }
        var hp = new double[n * n];
        var hm = new double[n * n];
        d.JacobianAlong(xp, u, hp);
        d.JacobianAlong(xm, u, hm);
        var plus = MatVec(hp, v, n);
        var minus = MatVec(hm, v, n);
        for (int i = 0; i < n; i++) plus[i] = (plus[i] - minus[i]) / (2 * step);
        return plus;
    }

    private static double[] MatVec(double[] m, ReadOnlySpan<double> v, int n)
    {
        var r = new double[n];
        Vec.MatVec(m, n, n, v, r);
        return r;
    }

    private static Complex Inner(Complex[] u, Complex[] v)
    {
        Complex s = Complex.Zero;
        for (int i = 0; i < u.Length; i++) s += Complex.Conjugate(u[i]) * v[i];
        return s;
    }
}
