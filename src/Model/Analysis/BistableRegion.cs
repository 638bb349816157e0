using System.Collections.Immutable;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>
/// The folds met at one value of the second parameter, and the bistable interval of the first
/// parameter between the outermost two: the collapse thresholds of the upper and lower states.
/// </summary>
public sealed record BistableInterval
{
    /// <summary>Value of the second parameter.</summary>
    public required double SecondParameter { get; init; }

    /// <summary>First-parameter values of all folds of the curve at this second-parameter value, ascending.</summary>
    public required ImmutableArray<double> Folds { get; init; }

    /// <summary>Lower end of the bistable interval (the smallest fold), or NaN with fewer than two folds.</summary>
    public double Lower => Folds.Length >= 2 ? Folds[0] : double.NaN;

    /// <summary>Upper end of the bistable interval (the largest fold), or NaN with fewer than two folds.</summary>
    public double Upper => Folds.Length >= 2 ? Folds[^1] : double.NaN;

    /// <summary>True when at least two folds bound an interval of coexisting states.</summary>
    public bool IsBistable => Folds.Length >= 2;

    /// <summary>Largest residual of the fold system at the reported folds.</summary>
    public required double Residual { get; init; }
}

/// <summary>
/// The bistable region of a fold curve as a table over the second parameter: for each value, the
/// folds of the first parameter found where the curve crosses it, each refined by Newton's method on
/// the fold system with the second parameter fixed. This is the collapse-threshold map: inside the
/// interval two stable states coexist; beyond its ends one of them is gone.
/// </summary>
public static class BistableRegion
{
    /// <summary>The folds of <paramref name="foldCurve"/> at each of <paramref name="secondParameterValues"/>.</summary>
    /// <param name="system">The model the curve was computed for.</param>
    /// <param name="foldCurve">A fold curve from <see cref="TwoParameterContinuation.TraceFold(IParametricSystem, ReadOnlySpan{double}, ReadOnlySpan{double}, int, int, CurveOptions)"/>.</param>
    /// <param name="secondParameterValues">Where to cut the curve.</param>
    /// <param name="tolerance">Newton tolerance of the refinement (max-norm of the fold system).</param>
    public static IReadOnlyList<BistableInterval> Map(IParametricSystem system, Curve foldCurve, IEnumerable<double> secondParameterValues, double tolerance = 1e-10)
    {
        ArgumentNullException.ThrowIfNull(system);
        ArgumentNullException.ThrowIfNull(foldCurve);
        ArgumentNullException.ThrowIfNull(secondParameterValues);
        if (foldCurve.Kind != CurveKind.Fold)
            throw new ArgumentException($"The bistable region is bounded by a fold curve; got a {foldCurve.Kind} curve.", nameof(foldCurve));
        if (!(tolerance > 0)) throw new ArgumentOutOfRangeException(nameof(tolerance), tolerance, "The tolerance must be positive.");
        int n = system.Dimension;
        int first = foldCurve.FirstParameterIndex, second = foldCurve.SecondParameterIndex;
        var d = new SystemDerivatives(system, 0, foldCurve.Parameters.AsSpan());
        var result = new List<BistableInterval>();
        var pts = foldCurve.Points;
        foreach (double value in secondParameterValues)
        {
            if (!double.IsFinite(value)) throw new ArgumentException($"Second-parameter value {value} is not finite.", nameof(secondParameterValues));
            var folds = new List<double>();
            double worst = 0;
            for (int i = 0; i + 1 < pts.Count; i++)
            {
                double a = pts[i].SecondParameter - value, b = pts[i + 1].SecondParameter - value;
                if (a == 0 && i > 0) continue;
                if (a * b > 0 || a == b) continue;
                double alpha = a / (a - b);
                var u = new double[n + 1];
                for (int j = 0; j < n; j++) u[j] = pts[i].State[j] + alpha * (pts[i + 1].State[j] - pts[i].State[j]);
                u[n] = pts[i].FirstParameter + alpha * (pts[i + 1].FirstParameter - pts[i].FirstParameter);
                d.P[second] = value;
                d.P[first] = u[n];
                var jac = new double[n * n];
                d.Jacobian(u.AsSpan(0, n), jac, new double[n]);
                var fold = new FoldSystem(d, [first], TwoParameterContinuation.NullVectorGuess(jac, n));
                if (!fold.InitialiseBorders(u)) continue;
                var outcome = ExtendedNewton.Solve(fold, u, tolerance, 30);
                if (!outcome.Converged) continue;
                if (folds.Any(f => Math.Abs(f - u[n]) <= 1e-9 * (1 + Math.Abs(f)))) continue;
                folds.Add(u[n]);
                worst = Math.Max(worst, outcome.Residual);
            }
            folds.Sort();
            result.Add(new BistableInterval { SecondParameter = value, Folds = [.. folds], Residual = worst });
        }
        return result;
    }
}
