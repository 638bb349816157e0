using System.Collections.Immutable;
using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using Thermostrat.Model.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>Linear stability class of an equilibrium from the signs of the Jacobian's eigenvalues' real parts.</summary>
public enum StabilityType
{
    /// <summary>All eigenvalues have negative real part: perturbations decay (node or focus).</summary>
    Stable,
    /// <summary>All eigenvalues have positive real part: every perturbation grows (repeller).</summary>
    Unstable,
    /// <summary>Eigenvalues with real parts of both signs: attracting in some directions, repelling in others.</summary>
    Saddle,
    /// <summary>At least one eigenvalue on the imaginary axis (within rounding): a bifurcation point or a neutral direction.</summary>
    NonHyperbolic,
    /// <summary>Eigenvalues were not computed.</summary>
    Unknown,
}

/// <summary>Eigenvalues of the Jacobian at an equilibrium and what they say about it.</summary>
public sealed record StabilityReport
{
    /// <summary>All eigenvalues, sorted by decreasing real part (then decreasing imaginary part).</summary>
    public required ImmutableArray<Complex> Eigenvalues { get; init; }

    /// <summary>The stability class.</summary>
    public required StabilityType Type { get; init; }

    /// <summary>Number of eigenvalues with positive real part.</summary>
    public required int UnstableCount { get; init; }

    /// <summary>The eigenvalue with the largest real part (for a complex pair, the one with positive imaginary part).</summary>
    public Complex Leading => Eigenvalues[0];

    /// <summary>
    /// 1/|Re λ| of the leading eigenvalue, in the system's time unit: the e-folding time of the slowest-decaying
    /// (stable) or fastest-growing (unstable) perturbation; +∞ on the imaginary axis.
    /// </summary>
    public double EFoldingTime => Leading.Real == 0 ? double.PositiveInfinity : 1 / Math.Abs(Leading.Real);

    /// <summary>2π/|Im λ| of the leading eigenvalue when it is one of a complex pair (the period of the damped or growing oscillation); null when real.</summary>
    public double? OscillationPeriod => Leading.Imaginary == 0 ? null : 2 * Math.PI / Math.Abs(Leading.Imaginary);

    /// <summary>True when <see cref="Type"/> is <see cref="StabilityType.Stable"/>.</summary>
    public bool IsStable => Type == StabilityType.Stable;
}

/// <summary>Linear stability of equilibria from the eigenvalues of the exact Jacobian (MathNet.Numerics).</summary>
public static class Stability
{
    /// <summary>
    /// Real parts within this fraction of the largest eigenvalue modulus (or of 1, whichever is larger)
    /// count as zero: eigenvalues of a nonsymmetric matrix are accurate to about ε·‖J‖·condition.
    /// </summary>
    public const double ZeroTolerance = 1e-10;

    /// <summary>Eigenvalues and stability class at <paramref name="state"/> for parameter values <paramref name="parameters"/>.</summary>
    public static StabilityReport Analyze(IParametricSystem system, ReadOnlySpan<double> state, ReadOnlySpan<double> parameters, double time = 0)
    {
        ArgumentNullException.ThrowIfNull(system);
        int n = system.Dimension;
        if (state.Length != n) throw new ArgumentException($"The state has {state.Length} entries; the system has {n} state variables.", nameof(state));
        if (parameters.Length != system.ParameterCount)
            throw new ArgumentException($"Got {parameters.Length} parameter values; the system has {system.ParameterCount} parameters.", nameof(parameters));
        var jac = new double[n * n];
        var f = new double[n];
        AutoJacobian.OfState(system, time, state, parameters, jac, f);
        return FromJacobian(jac, n);
    }

    /// <summary>Eigenvalues and stability class of the row-major <paramref name="order"/> × <paramref name="order"/> Jacobian <paramref name="jacobianRowMajor"/>.</summary>
    public static StabilityReport FromJacobian(ReadOnlySpan<double> jacobianRowMajor, int order)
    {
        var eigenvalues = Eigenvalues(jacobianRowMajor, order);
        return Classify(eigenvalues);
    }

    /// <summary>Classifies a set of eigenvalues (sorted as in <see cref="StabilityReport.Eigenvalues"/>).</summary>
    internal static StabilityReport Classify(Complex[] eigenvalues)
    {
        double scale = 1;
        foreach (var l in eigenvalues) scale = Math.Max(scale, l.Magnitude);
        double zero = ZeroTolerance * scale;
        int positive = 0, negative = 0, neutral = 0;
        foreach (var l in eigenvalues)
        {
            if (Math.Abs(l.Real) <= zero) neutral++;
            else if (l.Real > 0) positive++;
            else negative++;
        }
        var type = neutral > 0 ? StabilityType.NonHyperbolic
            : positive == 0 ? StabilityType.Stable
            : negative == 0 ? StabilityType.Unstable
            : StabilityType.Saddle;
        return new StabilityReport
        {
            Eigenvalues = System.Runtime.InteropServices.ImmutableCollectionsMarshal.AsImmutableArray(eigenvalues),
            Type = type,
            UnstableCount = positive,
        };
    }

    /// <summary>Eigenvalues of a row-major square matrix, sorted by decreasing real part, then decreasing imaginary part.</summary>
    internal static Complex[] Eigenvalues(ReadOnlySpan<double> a, int order)
    {
        if (a.Length < order * order) throw new ArgumentException($"The matrix needs {order * order} entries.", nameof(a));
        var m = Matrix<double>.Build.Dense(order, order);
        for (int i = 0; i < order; i++)
            for (int j = 0; j < order; j++)
                m[i, j] = a[i * order + j];
        var values = new Complex[order];
        if (order == 1) values[0] = new Complex(a[0], 0);
        else
        {
            var evd = m.Evd(MathNet.Numerics.LinearAlgebra.Symmetricity.Asymmetric);
            for (int i = 0; i < order; i++) values[i] = evd.EigenValues[i];
        }
        Array.Sort(values, static (x, y) =>
        {
            int c = y.Real.CompareTo(x.Real);
            return c != 0 ? c : y.Imaginary.CompareTo(x.Imaginary);
        });
        return values;
    }
}
