using System.Numerics;
using Thermostrat.Model.Numerics;
using Thermostrat.Model.Numerics.Ode;

namespace Thermostrat.Model.Tests.Numerics;

/// <summary>Linear decay y' = −k y: y(t) = y0 e^(−kt).</summary>
internal sealed class DecaySystem(double k) : IOdeSystem
{
    public int Dimension => 1;
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> =>
        dydt[0] = -T.CreateChecked(k) * y[0];
}

/// <summary>Harmonic oscillator y1' = y2, y2' = −y1: y = (cos t, −sin t) from (1, 0); energy (y1² + y2²)/2 is conserved.</summary>
internal sealed class HarmonicSystem : IOdeSystem
{
    public int Dimension => 2;
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        dydt[0] = y[1];
        dydt[1] = -y[0];
    }
}

/// <summary>
/// A nonlinear, non-autonomous pair with closed forms: y1' = −2t y1² (y1 = 1/(1 + t²) from 1), y2' = y2 cos t (y2 = e^(sin t) from 1).
/// Solved by separation of variables.
/// </summary>
internal sealed class NonlinearSystem : IOdeSystem
{
    public int Dimension => 2;
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        T tt = T.CreateChecked(t);
        dydt[0] = -T.CreateChecked(2) * tt * y[0] * y[0];
        dydt[1] = y[1] * T.CreateChecked(Math.Cos(t));
    }

    public static double[] Exact(double t) => [1 / (1 + t * t), Math.Exp(Math.Sin(t))];
}

/// <summary>
/// Prothero and Robinson (1974), Math. Comp. 28, 145: y' = λ(y − g(t)) + g'(t) with g = sin, exact y = sin t from y(0) = 0, for any λ &lt; 0.
/// </summary>
internal sealed class ProtheroRobinsonSystem(double lambda) : IOdeSystem
{
    public int Dimension => 1;
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> =>
        dydt[0] = T.CreateChecked(lambda) * (y[0] - T.CreateChecked(Math.Sin(t))) + T.CreateChecked(Math.Cos(t));
}

/// <summary>Van der Pol oscillator y1' = y2, y2' = μ(1 − y1²) y2 − y1 (Hairer and Wanner II, Sect. IV.1, unscaled form).</summary>
internal sealed class VanDerPolSystem(double mu) : IOdeSystem
{
    public int Dimension => 2;
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>
    {
        dydt[0] = y[1];
        dydt[1] = T.CreateChecked(mu) * (T.One - y[0] * y[0]) * y[1] - y[0];
    }
}

/// <summary>Constant noise amplitude σ on every component (additive noise).</summary>
internal sealed class AdditiveNoise(double sigma) : IStochasticForcing
{
    public void Diffusion(double t, ReadOnlySpan<double> y, Span<double> s) => s.Fill(sigma);
}

/// <summary>A system defined as a struct, to check that value-type systems bind and run.</summary>
internal readonly struct DecayStruct(double k) : IOdeSystem
{
    public int Dimension => 1;
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> =>
        dydt[0] = -T.CreateChecked(k) * y[0];
}

/// <summary>
/// Logistic growth with a time-dependent rate, y' = (1 + t) y (1 − y): nonlinear and non-autonomous, with the closed form
/// y = 1 / (1 + (1/y0 − 1) e^(−(t + t²/2))) (separation of variables).
/// </summary>
internal sealed class LogisticSystem : IOdeSystem
{
    public int Dimension => 1;
    public void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T> =>
        dydt[0] = T.CreateChecked(1 + t) * y[0] * (T.One - y[0]);

    public static double Exact(double t, double y0) => 1 / (1 + (1 / y0 - 1) * Math.Exp(-(t + t * t / 2)));
}
