namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// Diagonal Itô noise for <see cref="OdeMethod.EulerMaruyama"/>: the state obeys dy_i = f_i(t, y) dt + σ_i(t, y) dW_i
/// with independent standard Wiener processes W_i.
/// </summary>
public interface IStochasticForcing
{
    /// <summary>Writes the noise amplitudes σ_i(t, y) (state units per √time unit) into <paramref name="sigma"/>; must not allocate.</summary>
    void Diffusion(double t, ReadOnlySpan<double> y, Span<double> sigma);
}
