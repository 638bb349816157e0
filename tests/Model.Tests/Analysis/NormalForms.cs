using System.Numerics;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Tests.Analysis;

/// <summary>Base for small test systems with named parameters.</summary>
internal abstract class TestSystem(string[] names, double[] values) : IParametricSystem
{
    private readonly double[] _values = values;

    public abstract int Dimension { get; }

    public int ParameterCount => names.Length;

    public string GetParameterName(int index) => names[index];

    public void GetParameters(Span<double> destination) => _values.CopyTo(destination);

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        var p = new T[_values.Length];
        for (int i = 0; i < p.Length; i++) p[i] = T.CreateChecked(_values[i]);
        Evaluate(t, y, (ReadOnlySpan<T>)p, dydt);
    }

    public abstract void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>;
}

/// <summary>Saddle-node normal form x' = μ − x² (Kuznetsov, Elements of Applied Bifurcation Theory, §3.2): fold at μ = 0, x = 0.</summary>
internal sealed class SaddleNodeNormalForm(double mu = 1) : TestSystem(["mu"], [mu])
{
    public override int Dimension => 1;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) => dydt[0] = p[0] - y[0] * y[0];
}

/// <summary>Cusp normal form x' = a + b x − x³ (Kuznetsov, §8.2): folds on 4b³ = 27a², cusp at a = b = 0.</summary>
internal sealed class CuspNormalForm(double a = 0, double b = 1) : TestSystem(["a", "b"], [a, b])
{
    public override int Dimension => 1;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) =>
        dydt[0] = p[0] + p[1] * y[0] - y[0] * y[0] * y[0];
}

/// <summary>
/// Hopf normal form in Cartesian coordinates (Kuznetsov, §3.4): x' = μx − ωy − x(x² + y²),
/// y' = ωx + μy − y(x² + y²). The origin has eigenvalues μ ± iω: Hopf at μ = 0 with period 2π/ω.
/// </summary>
internal sealed class HopfNormalForm(double mu = -1, double omega = 2.5) : TestSystem(["mu", "omega"], [mu, omega])
{
    public override int Dimension => 2;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt)
    {
        T r2 = y[0] * y[0] + y[1] * y[1];
        dydt[0] = p[0] * y[0] - p[1] * y[1] - y[0] * r2;
        dydt[1] = p[1] * y[0] + p[0] * y[1] - y[1] * r2;
    }
}

/// <summary>Transcritical normal form x' = μx − x² (Kuznetsov, §3.2 exercises; Strogatz, Nonlinear Dynamics and Chaos, §3.2): branches x = 0 and x = μ cross at μ = 0.</summary>
internal sealed class TranscriticalNormalForm(double mu = -1) : TestSystem(["mu"], [mu])
{
    public override int Dimension => 1;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) => dydt[0] = p[0] * y[0] - y[0] * y[0];
}

/// <summary>Pitchfork normal form x' = μx − x³ (Strogatz, §3.4): x = ±√μ branch off x = 0 at μ = 0.</summary>
internal sealed class PitchforkNormalForm(double mu = -1) : TestSystem(["mu"], [mu])
{
    public override int Dimension => 1;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) => dydt[0] = p[0] * y[0] - y[0] * y[0] * y[0];
}

/// <summary>
/// A system in mixed coordinates: the inner system's state x plus <c>extra</c> decoupled decaying
/// variables z_k' = −(k + 1) z_k, seen through the invertible linear map y = M (x, z). Equilibria,
/// their parameter values and eigenvalues are invariant under this (an exact property), so it tests
/// that the analysis code does not depend on the coordinates or on the dimension.
/// </summary>
internal sealed class MixedCoordinates : IParametricSystem
{
    private readonly IParametricSystem _inner;
    private readonly int _n, _m;
    private readonly double[] _map, _inverse;

    public MixedCoordinates(IParametricSystem inner, int extra)
    {
        _inner = inner;
        _n = inner.Dimension;
        _m = _n + extra;
        // M = L U with unit lower L (entries 0.3·sin) and upper U (diagonal 1 + 0.1 k): invertible by construction.
        var l = new double[_m * _m];
        var u = new double[_m * _m];
        for (int i = 0; i < _m; i++)
        {
            l[i * _m + i] = 1;
            for (int j = 0; j < i; j++) l[i * _m + j] = 0.3 * Math.Sin(1 + i + 2 * j);
            u[i * _m + i] = 1 + 0.1 * i;
            for (int j = i + 1; j < _m; j++) u[i * _m + j] = 0.2 * Math.Cos(i + j);
        }
        _map = Multiply(l, u, _m);
        var mm = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(_m, _m, (i, j) => _map[i * _m + j]).Inverse();
        _inverse = new double[_m * _m];
        for (int i = 0; i < _m; i++) for (int j = 0; j < _m; j++) _inverse[i * _m + j] = mm[i, j];
    }

    private static double[] Multiply(double[] a, double[] b, int m)
    {
        var c = new double[m * m];
        for (int i = 0; i < m; i++) for (int j = 0; j < m; j++) { double s = 0; for (int k = 0; k < m; k++) s += a[i * m + k] * b[k * m + j]; c[i * m + j] = s; }
        return c;
    }

    /// <summary>y = M (x, 0).</summary>
    public double[] ToMixed(ReadOnlySpan<double> x)
    {
        var y = new double[_m];
        for (int i = 0; i < _m; i++) { double s = 0; for (int j = 0; j < _n; j++) s += _map[i * _m + j] * x[j]; y[i] = s; }
        return y;
    }

    /// <summary>The inner state x from y.</summary>
    public double[] ToInner(ReadOnlySpan<double> y)
    {
        var x = new double[_n];
        for (int i = 0; i < _n; i++) { double s = 0; for (int j = 0; j < _m; j++) s += _inverse[i * _m + j] * y[j]; x[i] = s; }
        return x;
    }

    public int Dimension => _m;

    public int ParameterCount => _inner.ParameterCount;

    public string GetParameterName(int index) => _inner.GetParameterName(index);

    public void GetParameters(Span<double> destination) => _inner.GetParameters(destination);

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        var p = new double[ParameterCount];
        GetParameters(p);
        var pt = p.Select(T.CreateChecked).ToArray();
        Evaluate(t, y, (ReadOnlySpan<T>)pt, dydt);
    }

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        var xz = new T[_m];
        for (int i = 0; i < _m; i++) { T s = T.Zero; for (int j = 0; j < _m; j++) s += T.CreateChecked(_inverse[i * _m + j]) * y[j]; xz[i] = s; }
        var g = new T[_m];
        _inner.Evaluate(t, (ReadOnlySpan<T>)xz.AsSpan(0, _n), p, g.AsSpan(0, _n));
        for (int k = _n; k < _m; k++) g[k] = -T.CreateChecked(k - _n + 1.0) * xz[k];
        for (int i = 0; i < _m; i++) { T s = T.Zero; for (int j = 0; j < _m; j++) s += T.CreateChecked(_map[i * _m + j]) * g[j]; dydt[i] = s; }
    }
}
