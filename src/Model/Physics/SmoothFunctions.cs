using System.Numerics;
using System.Runtime.CompilerServices;

namespace Thermostrat.Model.Physics;

/// <summary>
/// Smooth replacements for max(x, 0) and clamping, so that thresholds in the processes keep the
/// right-hand side differentiable (Newton, continuation and stiff integrators need smooth Jacobians).
/// </summary>
public static class SmoothFunctions
{
    /// <summary>
    /// Softplus ramp w·ln(1 + exp(x/w)): ≈ max(x, 0) away from |x| ≲ w, smooth, positive, slope in (0, 1);
    /// equals w·ln 2 at x = 0. Evaluated without overflow for any x.
    /// </summary>
    /// <param name="x">Argument.</param>
    /// <param name="width">Width w of the smooth corner, &gt; 0, in the unit of <paramref name="x"/>.</param>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static T Ramp<T>(T x, T width) where T : struct, IFloatingPointIeee754<T>
    {
        T z = x / width;
        return z > T.Zero ? x + width * T.LogP1(T.Exp(-z)) : width * T.LogP1(T.Exp(z));
    }

    /// <summary>
    /// Smooth clamp of <paramref name="x"/> to [<paramref name="lo"/>, <paramref name="hi"/>]:
    /// lo + Ramp(x − lo) − Ramp(x − hi); monotone, within w·ln 2 of the hard clamp.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static T Clamp<T>(T x, T lo, T hi, T width) where T : struct, IFloatingPointIeee754<T> =>
        lo + Ramp(x - lo, width) - Ramp(x - hi, width);
}
