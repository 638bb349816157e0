using System.Numerics;

namespace Thermostrat.Model.Numerics;

/// <summary>
/// The right-hand side of an ordinary differential equation y' = f(t, y), written once and
/// generic over the number type, so that the same code evaluates <see cref="double"/> values
/// and forward-mode dual numbers (exact Jacobians).
/// </summary>
/// <remarks>
/// Implementations must not allocate in <see cref="Evaluate{T}"/>: it is the hot path of every
/// integrator, Newton solver and continuation method in the library.
/// </remarks>
public interface IOdeSystem
{
    /// <summary>Number of state variables.</summary>
    int Dimension { get; }

    /// <summary>Writes f(t, y) into <paramref name="dydt"/> (same length as <paramref name="y"/>).</summary>
    /// <param name="t">Time, in the system's own time unit (years for the climate models).</param>
    /// <param name="y">State.</param>
    /// <param name="dydt">Tendency, overwritten.</param>
    void Evaluate<T>(double t, ReadOnlySpan<T> y, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>;
}

/// <summary>
/// An ODE system whose right-hand side depends on named scalar parameters, so that analysis
/// code (equilibria, continuation, sweeps) can vary any of them and differentiate with respect
/// to them exactly.
/// </summary>
public interface IParametricSystem : IOdeSystem
{
    /// <summary>Number of parameters exposed for analysis.</summary>
    int ParameterCount { get; }

    /// <summary>Name of parameter <paramref name="index"/> (for example "Ventilation:HosingNorth_Sv").</summary>
    string GetParameterName(int index);

    /// <summary>Current values of all parameters (length <see cref="ParameterCount"/>), copied into <paramref name="destination"/>.</summary>
    void GetParameters(Span<double> destination);

    /// <summary>
    /// Writes f(t, y; p) into <paramref name="dydt"/> with the parameters taken from <paramref name="p"/>
    /// (length <see cref="ParameterCount"/>) instead of the system's current values.
    /// </summary>
    void Evaluate<T>(double t, ReadOnlySpan<T> y, ReadOnlySpan<T> p, Span<T> dydt) where T : struct, IFloatingPointIeee754<T>;
}
