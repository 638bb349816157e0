using System.Collections.Immutable;

namespace Thermostrat.Model.Analysis;

/// <summary>What a two-parameter curve is made of.</summary>
public enum CurveKind
{
    /// <summary>Folds (saddle-nodes): the boundary of a bistable region in the parameter plane.</summary>
    Fold,
    /// <summary>Hopf points: where oscillations are born.</summary>
    Hopf,
}

/// <summary>One point on a two-parameter curve of folds or Hopf points.</summary>
public sealed record CurvePoint
{
    /// <summary>Value of the first parameter.</summary>
    public required double FirstParameter { get; init; }

    /// <summary>Value of the second parameter.</summary>
    public required double SecondParameter { get; init; }

    /// <summary>The (non-hyperbolic) equilibrium.</summary>
    public required ImmutableArray<double> State { get; init; }

    /// <summary>Signed pseudo-arclength from the start.</summary>
    public required double Arclength { get; init; }

    /// <summary>On a Hopf curve, the frequency ω of the critical pair ±iω (radians per time unit); null on a fold curve.</summary>
    public double? Frequency { get; init; }

    /// <summary>What kind of point this is (Regular, Start, End, Cusp, BogdanovTakens, NonSmoothKink).</summary>
    public required BranchPointType Type { get; init; }

    /// <summary>Index into <see cref="Curve.SpecialPoints"/>, or −1.</summary>
    public int SpecialPointIndex { get; init; } = -1;
}

/// <summary>A curve of folds or Hopf points in a two-parameter plane.</summary>
public sealed class Curve
{
    internal Curve(CurveKind kind, string firstName, int firstIndex, string secondName, int secondIndex, ImmutableArray<double> parameters,
        IReadOnlyList<CurvePoint> points, IReadOnlyList<SpecialPoint> specials, int startIndex, BranchTermination forward, BranchTermination? reverse)
    {
        Kind = kind;
        FirstParameterName = firstName;
        FirstParameterIndex = firstIndex;
        SecondParameterName = secondName;
        SecondParameterIndex = secondIndex;
        Parameters = parameters;
        Points = points;
        SpecialPoints = specials;
        StartIndex = startIndex;
        Forward = forward;
        Reverse = reverse;
    }

    /// <summary>Folds or Hopf points.</summary>
    public CurveKind Kind { get; }

    /// <summary>Name of the first parameter (the one of the branch the curve started from).</summary>
    public string FirstParameterName { get; }

    /// <summary>Index of the first parameter.</summary>
    public int FirstParameterIndex { get; }

    /// <summary>Name of the second parameter.</summary>
    public string SecondParameterName { get; }

    /// <summary>Index of the second parameter.</summary>
    public int SecondParameterIndex { get; }

    /// <summary>All parameter values at the start (the others stay fixed along the curve).</summary>
    public ImmutableArray<double> Parameters { get; }

    /// <summary>Points in order of arclength, reverse end first; located special points are included.</summary>
    public IReadOnlyList<CurvePoint> Points { get; }

    /// <summary>Cusps, Bogdanov–Takens points, corners and ends, in order of arclength.</summary>
    public IReadOnlyList<SpecialPoint> SpecialPoints { get; }

    /// <summary>Index of the starting point in <see cref="Points"/>.</summary>
    public int StartIndex { get; }

    /// <summary>How tracing ended in the forward direction.</summary>
    public BranchTermination Forward { get; }

    /// <summary>How tracing ended in the reverse direction; null when only one direction was traced.</summary>
    public BranchTermination? Reverse { get; }

    /// <summary>True if either direction stopped early; the computed part is kept.</summary>
    public bool EndedEarly => Forward.EndedEarly || (Reverse?.EndedEarly ?? false);

    /// <summary>The special points of one kind.</summary>
    public IEnumerable<SpecialPoint> OfKind(SpecialPointKind kind) => SpecialPoints.Where(s => s.Kind == kind);
}

/// <summary>Settings of two-parameter continuation of fold or Hopf curves.</summary>
public sealed record CurveOptions : ArclengthSettings
{
    /// <summary>Lower bound of the first parameter.</summary>
    public required double FirstParameterMin { get; init; }

    /// <summary>Upper bound of the first parameter.</summary>
    public required double FirstParameterMax { get; init; }

    /// <summary>Lower bound of the second parameter.</summary>
    public required double SecondParameterMin { get; init; }

    /// <summary>Upper bound of the second parameter.</summary>
    public required double SecondParameterMax { get; init; }

    /// <summary>Which way to go from the start, in terms of the second parameter.</summary>
    public ContinuationDirection Direction { get; init; } = ContinuationDirection.Both;

    /// <summary>Scale of the first parameter in the arclength norm.</summary>
    public double FirstParameterScale { get; init; } = 1;

    /// <summary>Scale of the second parameter in the arclength norm.</summary>
    public double SecondParameterScale { get; init; } = 1;

    internal void Validate(int dimension, double first, double second, string firstName, string secondName)
    {
        CheckRange(FirstParameterMin, FirstParameterMax, first, firstName, nameof(FirstParameterMin));
        CheckRange(SecondParameterMin, SecondParameterMax, second, secondName, nameof(SecondParameterMin));
        Positive(FirstParameterScale, nameof(FirstParameterScale));
        Positive(SecondParameterScale, nameof(SecondParameterScale));
        ValidateSteps(dimension);
    }

    private static void CheckRange(double min, double max, double start, string name, string key)
    {
        if (!double.IsFinite(min) || !double.IsFinite(max) || !(min < max))
            throw new ArgumentException($"The range of parameter '{name}' is empty or inverted: [{min:G6}, {max:G6}]; the minimum must be finite and below the maximum.", key);
        if (start < min || start > max)
            throw new ArgumentOutOfRangeException(key, start, $"The starting value {start:G6} of parameter '{name}' lies outside its range [{min:G6}, {max:G6}].");
    }
}
