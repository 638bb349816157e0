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
    /// Hyperbolic ramp ½(x + √(x² + w²)): ≈ max(x, 0) away from |x| ≲ w, smooth (C∞), positive, slope in (0, 1),
    /// equal to w/2 at x = 0 and within w²/(4|x|) of max(x, 0) elsewhere. One square root (a softplus would cost
    /// an exponential and a logarithm on the hot path).
    /// </summary>
    /// <param name="x">Argument.</param>
    /// <param name="width">Width w of the smooth corner, &gt; 0, in the unit of <paramref name="x"/>.</param>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static T Ramp<T>(T x, T width) where T : struct, IFloatingPointIeee754<T> =>
        (x + T.Sqrt(x * x + width * width)) * T.CreateTruncating(0.5);

    /// <summary>
    /// Smooth clamp of <paramref name="x"/> to [<paramref name="lo"/>, <paramref name="hi"/>]:
    /// lo + Ramp(x − lo) − Ramp(x − hi); monotone, within w/2 of the hard clamp.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public static T Clamp<T>(T x, T lo, T hi, T width) where T : struct, IFloatingPointIeee754<T> =>
        lo + Ramp(x - lo, width) - Ramp(x - hi, width);
}
