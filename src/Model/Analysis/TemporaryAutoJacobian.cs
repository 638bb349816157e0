namespace Thermostrat.Model.Numerics;

/// <summary>Finite-difference stand-in with the signatures of the exact AutoJacobian; removed when the dual-number version is merged.</summary>
internal static class AutoJacobian
{
    public static void OfState(IParametricSystem system, double t, ReadOnlySpan<double> y, ReadOnlySpan<double> p, Span<double> jacobianRowMajor, Span<double> f)
    {
        int n = system.Dimension;
        system.Evaluate(t, y, p, f);
        Span<double> yy = stackalloc double[n];
        Span<double> fp = stackalloc double[n];
        Span<double> fm = stackalloc double[n];
        for (int j = 0; j < n; j++)
        {
            y.CopyTo(yy);
            double h = 1e-6 * Math.Max(1, Math.Abs(y[j]));
            yy[j] = y[j] + h; system.Evaluate(t, (ReadOnlySpan<double>)yy, p, fp);
            yy[j] = y[j] - h; system.Evaluate(t, (ReadOnlySpan<double>)yy, p, fm);
            for (int i = 0; i < n; i++) jacobianRowMajor[i * n + j] = (fp[i] - fm[i]) / (2 * h);
        }
    }

    public static void OfParameter(IParametricSystem system, double t, ReadOnlySpan<double> y, ReadOnlySpan<double> p, int parameterIndex, Span<double> dfdp)
    {
        int n = system.Dimension;
        Span<double> pp = stackalloc double[p.Length];
        Span<double> fm = stackalloc double[n];
        p.CopyTo(pp);
        double h = 1e-6 * Math.Max(1, Math.Abs(p[parameterIndex]));
        pp[parameterIndex] = p[parameterIndex] + h; system.Evaluate(t, y, (ReadOnlySpan<double>)pp, dfdp);
        pp[parameterIndex] = p[parameterIndex] - h; system.Evaluate(t, y, (ReadOnlySpan<double>)pp, fm);
        for (int i = 0; i < n; i++) dfdp[i] = (dfdp[i] - fm[i]) / (2 * h);
    }
}
