namespace Thermostrat.Model.Orbital;

/// <summary>
/// Brent's method for a zero of a continuous function on a bracketing interval: inverse quadratic
/// interpolation and secant steps, safeguarded by bisection so that the bracket always shrinks
/// (Brent 1973, Algorithms for Minimization without Derivatives, ch. 4, procedure zero).
/// </summary>
internal static class BrentRoot
{
    /// <summary>Most iterations; bisection alone would reach double precision on any bracket in fewer.</summary>
    private const int MaxIterations = 200;

    /// <summary>
    /// A zero of f in [a, b], where f(a) = <paramref name="fa"/> and f(b) = <paramref name="fb"/> have opposite signs
    /// (or one is zero), located to within 4·eps·|x| + <paramref name="tolerance"/>.
    /// </summary>
    public static double Solve<TF>(in TF f, double a, double b, double fa, double fb, double tolerance) where TF : struct, IRealFunction
    {
        if (fa == 0.0) return a;
        if (fb == 0.0) return b;
        if (Math.Sign(fa) == Math.Sign(fb))
            throw new ArgumentException("BrentRoot.Solve needs a bracket: f(a) and f(b) must have opposite signs.");
        double c = a, fc = fa, d = b - a, e = d;
        for (int iteration = 0; iteration < MaxIterations; iteration++)
        {
            if (Math.Sign(fb) == Math.Sign(fc))
            {
                c = a; fc = fa; d = b - a; e = d;
            }
            if (Math.Abs(fc) < Math.Abs(fb))
            {
                a = b; b = c; c = a;
                fa = fb; fb = fc; fc = fa;
            }
            double tol = 2.0 * double.Epsilon + 4.0 * 2.220446049250313e-16 * Math.Abs(b) + 0.5 * tolerance;
            double m = 0.5 * (c - b);
            if (Math.Abs(m) <= tol || fb == 0.0) return b;
            if (Math.Abs(e) < tol || Math.Abs(fa) <= Math.Abs(fb))
            {
                d = m; e = m; // bisection
            }
            else
            {
                double s = fb / fa, p, q;
                if (a == c)
                {
                    p = 2.0 * m * s; // secant
                    q = 1.0 - s;
                }
                else
                {
                    double r = fb / fc; // inverse quadratic interpolation
                    q = fa / fc;
                    p = s * (2.0 * m * q * (q - r) - (b - a) * (r - 1.0));
                    q = (q - 1.0) * (r - 1.0) * (s - 1.0);
                }
                if (p > 0) q = -q; else p = -p;
                if (2.0 * p < Math.Min(3.0 * m * q - Math.Abs(tol * q), Math.Abs(e * q)))
                {
                    e = d; d = p / q;
                }
                else
                {
                    d = m; e = m;
                }
            }
            a = b; fa = fb;
            b += Math.Abs(d) > tol ? d : (m > 0 ? tol : -tol);
            fb = f.Evaluate(b);
        }
        return b;
    }
}
