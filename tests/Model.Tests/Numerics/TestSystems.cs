using System.Numerics;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Tests.Numerics;

/// <summary>
/// An invented nonlinear 4-variable system that exercises exp, tanh, pow, sqrt, sin, cos, atan2 and log,
/// with its Jacobian derived by hand (<see cref="AnalyticJacobian"/>). Needs y1 ≠ 0, y3 &gt; 0.
/// </summary>
internal sealed class MixedFunctionsSystem : IOdeSystem
{
    public int Dimension => 4;

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        T tt = T.CreateChecked(t);
        dydt[0] = T.Exp(-y[0]) * y[1] + T.Sin(y[2]);
        dydt[1] = T.Tanh(y[0] * y[1]) - T.Pow(y[3], T.CreateChecked(2.5));
        dydt[2] = T.Sqrt(y[0] * y[0] + y[3]) * T.Cos(y[1]) + T.Atan2(y[2], y[3]);
        dydt[3] = T.Log(y[3]) * y[2] - y[0] / y[1] + tt * y[1];
    }

    /// <summary>∂f_i/∂y_j by hand (row-major).</summary>
    public static double[] AnalyticJacobian(double t, double[] y)
    {
        double y0 = y[0], y1 = y[1], y2 = y[2], y3 = y[3];
        double u = Math.Tanh(y0 * y1), s = 1 - u * u;
        double r = Math.Sqrt(y0 * y0 + y3);
        double q = y2 * y2 + y3 * y3;
        return
        [
            -Math.Exp(-y0) * y1, Math.Exp(-y0), Math.Cos(y2), 0,
            s * y1, s * y0, 0, -2.5 * Math.Pow(y3, 1.5),
            y0 / r * Math.Cos(y1), -r * Math.Sin(y1), y3 / q, Math.Cos(y1) / (2 * r) - y2 / q,
            -1 / y1, y0 / (y1 * y1) + t, Math.Log(y3), y2 / y3,
        ];
    }
}

/// <summary>
/// Robertson's chemical kinetics (Robertson 1966; the stiff test problem of Hairer and Wanner,
/// Solving ODEs II, Sect. IV.1, eq. 1.4): y1' = −0.04 y1 + 1e4 y2 y3, y2' = 0.04 y1 − 1e4 y2 y3 − 3e7 y2², y3' = 3e7 y2².
/// </summary>
internal sealed class RobertsonSystem : IOdeSystem
{
    public int Dimension => 3;

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        T k1 = T.CreateChecked(0.04), k2 = T.CreateChecked(3e7), k3 = T.CreateChecked(1e4);
        T a = k1 * y[0], b = k3 * y[1] * y[2], c = k2 * y[1] * y[1];
        dydt[0] = -a + b;
        dydt[1] = a - b - c;
        dydt[2] = c;
    }

    public static double[] AnalyticJacobian(double[] y) =>
    [
        -0.04, 1e4 * y[2], 1e4 * y[1],
        0.04, -1e4 * y[2] - 6e7 * y[1], -1e4 * y[1],
        0, 6e7 * y[1], 0,
    ];
}

/// <summary>Lotka–Volterra with parameters p = (growth, predation, death): f = (p0 y0 − p1 y0 y1, p1 y0 y1 − p2 y1).</summary>
internal sealed class LotkaVolterraSystem : IParametricSystem
{
    private readonly double[] _p = [1.1, 0.4, 0.7];

    public int Dimension => 2;
    public int ParameterCount => 3;
    public string GetParameterName(int index) => index switch { 0 => "Growth", 1 => "Predation", 2 => "Death", _ => throw new ArgumentOutOfRangeException(nameof(index)) };
    public void GetParameters(Span<double> destination) => _p.CopyTo(destination);

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        // A collection expression into Span<T> lives on the stack (inline array) for any T.
        Span<T> p = [T.CreateChecked(_p[0]), T.CreateChecked(_p[1]), T.CreateChecked(_p[2])];
        Evaluate<T>(t, y, p, dydt);
    }

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        dydt[0] = p[0] * y[0] - p[1] * y[0] * y[1];
        dydt[1] = p[1] * y[0] * y[1] - p[2] * y[1];
    }
}

/// <summary>A linear system f = A y of any size (A given, row-major): its Jacobian is exactly A.</summary>
internal sealed class LinearSystem(int n, double[] a) : IOdeSystem
{
    public int Dimension => n;
    public double[] Matrix => a;

    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        for (int i = 0; i < n; i++)
        {
            T s = T.Zero;
            for (int j = 0; j < n; j++) s += T.CreateChecked(a[i * n + j]) * y[j];
            dydt[i] = s;
        }
    }
}
