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
/// <remarks>
/// With the cubic coefficient s (x' = … + s x(x² + y²)) the complex form is ż = (μ + iω) z + s z|z|²:
/// supercritical for s &lt; 0 (Kuznetsov, §3.4–3.5); see the test for l1 in Kuznetsov's normalisation.
/// </remarks>
internal sealed class HopfNormalForm(double mu = -1, double omega = 2.5, double cubic = -1) : TestSystem(["mu", "omega"], [mu, omega])
{
    public override int Dimension => 2;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt)
    {
        T r2 = y[0] * y[0] + y[1] * y[1];
        T s = T.CreateChecked(cubic);
        dydt[0] = p[0] * y[0] - p[1] * y[1] + s * y[0] * r2;
        dydt[1] = p[1] * y[0] + p[0] * y[1] + s * y[1] * r2;
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

    /// <summary>The maps converted to the number type last used, and work buffers (a test system: not thread-safe).</summary>
    private object? _typed;

    private sealed class Typed<T>(T[] map, T[] inverse, int m)
    {
        public T[] Map { get; } = map;
        public T[] Inverse { get; } = inverse;
        public T[] Xz { get; } = new T[m];
        public T[] G { get; } = new T[m];
    }

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        if (_typed is not Typed<T> typed)
            _typed = typed = new Typed<T>(_map.Select(T.CreateChecked).ToArray(), _inverse.Select(T.CreateChecked).ToArray(), _m);
        var xz = typed.Xz;
        var inv = typed.Inverse;
        for (int i = 0; i < _m; i++) { T s = T.Zero; for (int j = 0; j < _m; j++) s += inv[i * _m + j] * y[j]; xz[i] = s; }
        var g = typed.G;
        _inner.Evaluate(t, (ReadOnlySpan<T>)xz.AsSpan(0, _n), p, g.AsSpan(0, _n));
        for (int k = _n; k < _m; k++) g[k] = -T.CreateChecked(k - _n + 1.0) * xz[k];
        var map = typed.Map;
        for (int i = 0; i < _m; i++) { T s = T.Zero; for (int j = 0; j < _m; j++) s += map[i * _m + j] * g[j]; dydt[i] = s; }
    }
}

/// <summary>
/// Bogdanov–Takens normal form (Kuznetsov, Elements of Applied Bifurcation Theory, §8.4, with s = −1):
/// x' = y, y' = β1 + β2 x + x² − x y. Equilibria (x, 0) with β1 + β2 x + x² = 0; Jacobian
/// [[0, 1], [β2 + 2x, −x]]: folds on β1 = β2²/4, Hopf points on β1 = 0, β2 &lt; 0 with ω² = −β2, both
/// curves meeting the Bogdanov–Takens point β1 = β2 = 0.
/// </summary>
internal sealed class BogdanovTakensNormalForm(double beta1 = 0.1, double beta2 = -1) : TestSystem(["beta1", "beta2"], [beta1, beta2])
{
    public override int Dimension => 2;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt)
    {
        dydt[0] = y[1];
        dydt[1] = p[0] + p[1] * y[0] + y[0] * y[0] - y[0] * y[1];
    }
}

/// <summary>x' = μ² + x² − 1: a closed circle of equilibria (an isola) with folds at μ = ±1, x = 0 (exact).</summary>
internal sealed class CircleOfEquilibria(double mu = 0) : TestSystem(["mu"], [mu])
{
    public override int Dimension => 1;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) => dydt[0] = p[0] * p[0] + y[0] * y[0] - T.One;
}

/// <summary>x' = μ − x − ½|x|: equilibria x = μ/1.5 (x &gt; 0) and x = 2μ (x &lt; 0), a kink without a turn at μ = 0 (exact).</summary>
internal sealed class KinkedLine(double mu = 1) : TestSystem(["mu"], [mu])
{
    public override int Dimension => 1;

    public override void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) =>
        dydt[0] = p[0] - y[0] - T.CreateChecked(0.5) * T.Abs(y[0]);
}
