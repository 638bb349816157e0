using System.Buffers;

namespace Thermostrat.Model.Numerics;

/// <summary>
/// Jacobians by central finite differences, ∂f/∂y_j ≈ [f(y + h e_j) − f(y − h e_j)] / (2h):
/// a cross-check for <see cref="AutoJacobian"/> and a fallback for right-hand sides that cannot run on dual numbers.
/// </summary>
/// <remarks>
/// Step h_j = ε^(1/3)·max(|y_j|, 1), which balances the O(h²) truncation error against the O(ε/h)
/// rounding error of a central difference (Dennis and Schnabel, <i>Numerical Methods for Unconstrained
/// Optimization and Nonlinear Equations</i>, SIAM 1996, Sect. 5.6); h_j is then rounded so that
/// y_j ± h_j are exact. Expect about 2/3 of the digits of double precision (≈ 1e-10 relative).
/// Costs 2n + 1 evaluations; no heap allocation (stack for n ≤ 64, <see cref="ArrayPool{T}"/> above).
/// </remarks>
public static class FiniteDifferenceJacobian
{
    /// <summary>ε^(1/3) for double: the optimal relative step of a central difference.</summary>
    private const double RelativeStep = 6.055454452393343e-06; // (2^-52)^(1/3)

    /// <summary>Computes J[i·n + j] ≈ ∂f_i/∂y_j and f(t, y), as <see cref="AutoJacobian.OfState(IOdeSystem, double, ReadOnlySpan{double}, Span{double}, Span{double})"/>.</summary>
    public static void OfState(IOdeSystem system, double t, ReadOnlySpan<double> y, Span<double> jacobianRowMajor, Span<double> f)
    {
        ArgumentNullException.ThrowIfNull(system);
        int n = system.Dimension;
        AutoJacobian.CheckState(n, y, jacobianRowMajor, f);
        Run(system, null, default, n, t, y, jacobianRowMajor, f);
    }

    /// <summary>As the other overload, with the parameters taken from <paramref name="p"/>.</summary>
    public static void OfState(IParametricSystem system, double t, ReadOnlySpan<double> y, ReadOnlySpan<double> p, Span<double> jacobianRowMajor, Span<double> f)
    {
        ArgumentNullException.ThrowIfNull(system);
        int n = system.Dimension;
        AutoJacobian.CheckState(n, y, jacobianRowMajor, f);
        AutoJacobian.CheckLength(nameof(p), p.Length, system.ParameterCount);
        Run(system, system, p, n, t, y, jacobianRowMajor, f);
    }

    private static void Evaluate(IOdeSystem system, IParametricSystem? parametric, ReadOnlySpan<double> p, double t, ReadOnlySpan<double> y, Span<double> dydt)
    {
        if (parametric is null) system.Evaluate<double>(t, y, dydt);
        else parametric.Evaluate<double>(t, y, p, dydt);
    }

    private static void Run(IOdeSystem system, IParametricSystem? parametric, ReadOnlySpan<double> p, int n, double t, ReadOnlySpan<double> y, Span<double> jac, Span<double> f)
    {
        double[]? rented = null;
        Span<double> work = n <= AutoJacobian.StackLimit ? stackalloc double[3 * AutoJacobian.StackLimit] : (rented = ArrayPool<double>.Shared.Rent(3 * n));
        try
        {
            Span<double> yp = work[..n], fPlus = work.Slice(n, n), fMinus = work.Slice(2 * n, n);
            y.CopyTo(yp);
            Evaluate(system, parametric, p, t, y, f);
            for (int j = 0; j < n; j++)
            {
                double yj = y[j];
                double h = RelativeStep * Math.Max(Math.Abs(yj), 1.0);
                double up = yj + h, down = yj - h;
                double span = up - down; // the exactly representable 2h
                yp[j] = up;
                Evaluate(system, parametric, p, t, yp, fPlus);
                yp[j] = down;
                Evaluate(system, parametric, p, t, yp, fMinus);
                yp[j] = yj;
                for (int i = 0; i < n; i++) jac[i * n + j] = (fPlus[i] - fMinus[i]) / span;
            }
        }
        finally
        {
            if (rented is not null) ArrayPool<double>.Shared.Return(rented);
        }
    }
}
