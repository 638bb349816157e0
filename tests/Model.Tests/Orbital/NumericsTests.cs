using Thermostrat.Model.Orbital;
using Xunit;

namespace Thermostrat.Model.Tests.Orbital;

/// <summary>The spline, quadrature and root-finding building blocks of the orbital code.</summary>
public class NumericsTests
{
    [Fact]
    public void Not_a_knot_spline_matches_scipy()
    {
        // Reference: SciPy 1.10 scipy.interpolate.CubicSpline(x, y) (default bc_type 'not-a-knot'; Debian python3-scipy)
        // for y = sin x + 0.1 x² on these knots, evaluated at xs.
        double[] x = [0.0, 0.7, 1.9, 2.4, 3.8, 5.0, 5.3, 7.1];
        double[] y = x.Select(v => Math.Sin(v) + 0.1 * v * v).ToArray();
        double[] xs = [0.1, 0.69, 1.2, 2.0, 3.0, 4.4, 5.15, 6.0, 7.05];
        double[] scipy = [0.10777713870618633, 0.6845603678845158, 1.0620040942737203, 1.310582576175815, 1.0356029937953077,
                          0.9938979214918466, 1.7459579038725976, 3.3156645864153105, 5.661532773966967];
        var spline = new CubicSpline(x, [y]);
        for (int i = 0; i < xs.Length; i++) Assert.Equal(scipy[i], spline.Evaluate(xs[i], 0), 1e-13);
    }

    [Fact]
    public void Spline_reproduces_cubics_exactly()
    {
        // A not-a-knot spline reproduces any cubic polynomial (de Boor 1978, ch. IV).
        double[] x = [-3.0, -2.2, -0.5, 0.1, 1.7, 2.0, 4.5];
        static double Cubic(double t) => 1.5 - 2 * t + 0.3 * t * t - 0.07 * t * t * t;
        var spline = new CubicSpline(x, [x.Select(Cubic).ToArray(), x.Select(t => 2.0).ToArray()]);
        Span<double> v = stackalloc double[2];
        for (double t = -3; t <= 4.5; t += 0.13)
        {
            spline.Evaluate(t, v);
            Assert.Equal(Cubic(t), v[0], 1e-12);
            Assert.Equal(2.0, v[1], 1e-14);
        }
    }

    [Fact]
    public void Tridiagonal_solver_pivots_when_it_must()
    {
        // A zero leading diagonal needs a row interchange; check A·x = b.
        double[] lower = [1.0, 2.0, 1.0], diag = [0.0, 1.0, 3.0, 1.0], upper = [2.0, 1.0, 4.0];
        double[] b = [1.0, 2.0, 3.0, 4.0];
        double[] l = (double[])lower.Clone(), d = (double[])diag.Clone(), u = (double[])upper.Clone(), x = (double[])b.Clone();
        CubicSpline.SolveTridiagonal(l, d, u, x);
        for (int i = 0; i < 4; i++)
        {
            double r = diag[i] * x[i] + (i > 0 ? lower[i - 1] * x[i - 1] : 0) + (i < 3 ? upper[i] * x[i + 1] : 0);
            Assert.Equal(b[i], r, 1e-12);
        }
    }

    private readonly struct Fn(Func<double, double> f) : IRealFunction
    {
        public double Evaluate(double x) => f(x);
    }

    [Fact]
    public void Gauss_Kronrod_integrates_known_integrals()
    {
        // ∫₀^π sin = 2; ∫₀¹ √x = 2/3 (endpoint singularity); ∫₀¹ x²² = 1/23 (degree 22 is exact for K15).
        Assert.Equal(2.0, GaussKronrod.Integrate(new Fn(Math.Sin), 0, Math.PI, 1e-14), 1e-13);
        Assert.Equal(2.0 / 3.0, GaussKronrod.Integrate(new Fn(Math.Sqrt), 0, 1, 1e-14), 1e-11);
        Assert.Equal(1.0 / 23.0, GaussKronrod.Rule(new Fn(x => Math.Pow(x, 22)), 0, 1, out _), 1e-15);
    }

    [Fact]
    public void Brent_finds_roots()
    {
        // cos x = x at x = 0.739085133215160641655 (the Dottie number; common knowledge).
        var f = new Fn(x => Math.Cos(x) - x);
        Assert.Equal(0.739085133215160641655, BrentRoot.Solve(f, 0, 1, f.Evaluate(0), f.Evaluate(1), 1e-15), 1e-14);
        Assert.Throws<ArgumentException>(() => BrentRoot.Solve(f, 0, 0.5, f.Evaluate(0), f.Evaluate(0.5), 1e-12));
    }
}
