using System.Buffers;

namespace Thermostrat.Model.Numerics;

/// <summary>
/// Exact Jacobians of an <see cref="IOdeSystem"/> by forward-mode automatic differentiation:
/// the right-hand side is evaluated on <see cref="Dual"/> numbers once per seeded direction,
/// so column j of ∂f/∂y comes from seeding y_j with derivative 1 (n evaluations for n states).
/// </summary>
/// <remarks>
/// Exact to rounding error: no step size, no truncation error (Griewank and Walther,
/// <i>Evaluating Derivatives</i>, 2nd ed., SIAM 2008, ch. 3). No heap allocation: work arrays
/// are stack-allocated for n ≤ 64 and rented from <see cref="ArrayPool{T}.Shared"/> otherwise.
/// </remarks>
public static class AutoJacobian
{
    /// <summary>Largest state (or parameter) count whose dual work arrays go on the stack (2·64·16 B = 2 KiB).</summary>
    internal const int StackLimit = 64;

    /// <summary>
    /// Computes J[i·n + j] = ∂f_i/∂y_j at (t, y) into <paramref name="jacobianRowMajor"/> (length ≥ n²)
    /// and f(t, y) into <paramref name="f"/> (length n).
    /// </summary>
    /// <param name="system">The system (n = <see cref="IOdeSystem.Dimension"/>).</param>
    /// <param name="t">Time.</param>
    /// <param name="y">State, length n.</param>
    /// <param name="jacobianRowMajor">Receives the n×n Jacobian, row-major.</param>
    /// <param name="f">Receives f(t, y).</param>
    public static void OfState(IOdeSystem system, double t, ReadOnlySpan<double> y, Span<double> jacobianRowMajor, Span<double> f) =>
        OfState<IOdeSystem>(system, t, y, jacobianRowMajor, f);

    /// <summary>
    /// As <see cref="OfState(IOdeSystem, double, ReadOnlySpan{double}, Span{double}, Span{double})"/> with the
    /// parameters taken from <paramref name="p"/> (length <see cref="IParametricSystem.ParameterCount"/>).
    /// </summary>
    public static void OfState(IParametricSystem system, double t, ReadOnlySpan<double> y, ReadOnlySpan<double> p, Span<double> jacobianRowMajor, Span<double> f)
    {
        ArgumentNullException.ThrowIfNull(system);
        int n = system.Dimension;
        int m = system.ParameterCount;
        CheckState(n, y, jacobianRowMajor, f);
        CheckLength(nameof(p), p.Length, m);

        Dual[]? rented = null;
        int need = 2 * n + m;
        Span<Dual> work = need <= 3 * StackLimit ? stackalloc Dual[3 * StackLimit] : (rented = ArrayPool<Dual>.Shared.Rent(need));
        try
        {
            Span<Dual> yd = work[..n], fd = work.Slice(n, n), pd = work.Slice(2 * n, m);
            for (int k = 0; k < m; k++) pd[k] = new Dual(p[k], 0.0);
            for (int k = 0; k < n; k++) yd[k] = new Dual(y[k], 0.0);
            for (int j = 0; j < n; j++)
            {
                yd[j] = new Dual(y[j], 1.0);
                system.Evaluate<Dual>(t, yd, pd, fd);
                yd[j] = new Dual(y[j], 0.0);
                for (int i = 0; i < n; i++) jacobianRowMajor[i * n + j] = fd[i].Derivative;
            }
            if (n == 0) system.Evaluate<Dual>(t, yd, pd, fd);
            for (int i = 0; i < n; i++) f[i] = fd[i].Value;
        }
        finally
        {
            if (rented is not null) ArrayPool<Dual>.Shared.Return(rented);
        }
    }

    /// <summary>
    /// Computes ∂f/∂p_k at (t, y; p) for k = <paramref name="parameterIndex"/> into <paramref name="dfdp"/> (length n),
    /// with one dual evaluation.
    /// </summary>
    /// <param name="system">The system.</param>
    /// <param name="t">Time.</param>
    /// <param name="y">State, length n.</param>
    /// <param name="p">Parameters, length <see cref="IParametricSystem.ParameterCount"/>.</param>
    /// <param name="parameterIndex">Which parameter to differentiate by, 0 ≤ k &lt; ParameterCount.</param>
    /// <param name="dfdp">Receives ∂f_i/∂p_k.</param>
    public static void OfParameter(IParametricSystem system, double t, ReadOnlySpan<double> y, ReadOnlySpan<double> p, int parameterIndex, Span<double> dfdp)
    {
        ArgumentNullException.ThrowIfNull(system);
        int n = system.Dimension;
        int m = system.ParameterCount;
        CheckLength(nameof(y), y.Length, n);
        CheckLength(nameof(p), p.Length, m);
        CheckLength(nameof(dfdp), dfdp.Length, n);
        if ((uint)parameterIndex >= (uint)m)
            throw new ArgumentOutOfRangeException(nameof(parameterIndex), parameterIndex, $"Parameter index must be in [0, {m - 1}] for a system with {m} parameters.");

        Dual[]? rented = null;
        int need = 2 * n + m;
        Span<Dual> work = need <= 3 * StackLimit ? stackalloc Dual[3 * StackLimit] : (rented = ArrayPool<Dual>.Shared.Rent(need));
        try
        {
            Span<Dual> yd = work[..n], fd = work.Slice(n, n), pd = work.Slice(2 * n, m);
            for (int k = 0; k < m; k++) pd[k] = new Dual(p[k], k == parameterIndex ? 1.0 : 0.0);
            for (int k = 0; k < n; k++) yd[k] = new Dual(y[k], 0.0);
            system.Evaluate<Dual>(t, yd, pd, fd);
            for (int i = 0; i < n; i++) dfdp[i] = fd[i].Derivative;
        }
        finally
        {
            if (rented is not null) ArrayPool<Dual>.Shared.Return(rented);
        }
    }

    /// <summary>
    /// Generic core of <see cref="OfState(IOdeSystem, double, ReadOnlySpan{double}, Span{double}, Span{double})"/>:
    /// a struct or sealed <typeparamref name="TSystem"/> is called without interface dispatch.
    /// </summary>
    internal static void OfState<TSystem>(TSystem system, double t, ReadOnlySpan<double> y, Span<double> jacobianRowMajor, Span<double> f)
        where TSystem : IOdeSystem
    {
        ArgumentNullException.ThrowIfNull(system);
        int n = system.Dimension;
        CheckState(n, y, jacobianRowMajor, f);

        Dual[]? rented = null;
        Span<Dual> work = n <= StackLimit ? stackalloc Dual[2 * StackLimit] : (rented = ArrayPool<Dual>.Shared.Rent(2 * n));
        try
        {
            Span<Dual> yd = work[..n], fd = work.Slice(n, n);
            for (int k = 0; k < n; k++) yd[k] = new Dual(y[k], 0.0);
            for (int j = 0; j < n; j++)
            {
                yd[j] = new Dual(y[j], 1.0);
                system.Evaluate<Dual>(t, yd, fd);
                yd[j] = new Dual(y[j], 0.0);
                for (int i = 0; i < n; i++) jacobianRowMajor[i * n + j] = fd[i].Derivative;
            }
            if (n == 0) system.Evaluate<Dual>(t, yd, fd);
            for (int i = 0; i < n; i++) f[i] = fd[i].Value;
        }
        finally
        {
            if (rented is not null) ArrayPool<Dual>.Shared.Return(rented);
        }
    }

    internal static void CheckState(int n, ReadOnlySpan<double> y, Span<double> jacobianRowMajor, Span<double> f)
    {
        CheckLength(nameof(y), y.Length, n);
        CheckLength(nameof(f), f.Length, n);
        if (jacobianRowMajor.Length < n * n)
            throw new ArgumentException($"The Jacobian buffer has length {jacobianRowMajor.Length}; a system of dimension {n} needs at least {n * n} (n², row-major).", nameof(jacobianRowMajor));
    }

    internal static void CheckLength(string name, int actual, int expected)
    {
        if (actual != expected)
            throw new ArgumentException($"'{name}' has length {actual}; the system needs length {expected}.", name);
    }
}
