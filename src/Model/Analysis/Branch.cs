using System.Collections.Immutable;
using System.Numerics;

namespace Thermostrat.Model.Analysis;

/// <summary>Kinds of special points found on branches of equilibria and on curves of folds or Hopf points.</summary>
public enum SpecialPointKind
{
    /// <summary>Fold (saddle-node, limit point): a real eigenvalue passes through zero and the branch turns back in the parameter.</summary>
    Fold,
    /// <summary>Hopf point: a complex pair ±iω crosses the imaginary axis; small oscillations of period 2π/ω are born.</summary>
    Hopf,
    /// <summary>Branch point (simple bifurcation): another branch of equilibria crosses this one.</summary>
    BranchPoint,
    /// <summary>A corner of a non-smooth right-hand side (for example |q|) where the branch turns back in the parameter without a zero eigenvalue.</summary>
    NonSmoothTurn,
    /// <summary>A corner of a non-smooth right-hand side that the branch passes without turning back.</summary>
    NonSmoothKink,
    /// <summary>Cusp on a fold curve: two fold curves meet and the bistable region closes.</summary>
    Cusp,
    /// <summary>Bogdanov–Takens point: a fold curve meets a Hopf curve (double zero eigenvalue).</summary>
    BogdanovTakens,
    /// <summary>An end of the computed branch or curve.</summary>
    End,
}

/// <summary>Why tracing a branch or curve in one direction stopped.</summary>
public enum EndReason
{
    /// <summary>The parameter reached a bound of its range (a normal end).</summary>
    ParameterBoundReached,
    /// <summary>A state variable reached one of the user's state bounds (a normal end).</summary>
    StateBoundReached,
    /// <summary>The branch returned to its starting point (an isola or a closed curve; a normal end).</summary>
    ClosedLoop,
    /// <summary>The user's validity check rejected the next state (for example outside an equation of state's range).</summary>
    InvalidState,
    /// <summary>The point budget was used up.</summary>
    MaxPointsReached,
    /// <summary>The corrector failed even at the smallest step: the branch could not be followed further.</summary>
    StepSizeTooSmall,
    /// <summary>The right-hand side became non-finite.</summary>
    NonFiniteState,
    /// <summary>On a Hopf curve, the frequency ω fell to zero (a Bogdanov–Takens point is near).</summary>
    HopfFrequencyVanished,
}

/// <summary>What a point on a branch is.</summary>
public enum BranchPointType
{
    /// <summary>An ordinary continuation point.</summary>
    Regular,
    /// <summary>The starting equilibrium.</summary>
    Start,
    /// <summary>The last point in one direction.</summary>
    End,
    /// <summary>A located fold.</summary>
    Fold,
    /// <summary>A located Hopf point.</summary>
    Hopf,
    /// <summary>A located branch point.</summary>
    BranchPoint,
    /// <summary>A non-smooth turning point.</summary>
    NonSmoothTurn,
    /// <summary>A non-smooth kink.</summary>
    NonSmoothKink,
    /// <summary>A cusp (on a fold curve).</summary>
    Cusp,
    /// <summary>A Bogdanov–Takens point (on a fold curve).</summary>
    BogdanovTakens,
}

/// <summary>How tracing ended in one direction.</summary>
/// <param name="Reason">The reason.</param>
/// <param name="Message">A sentence saying what happened, with the values involved.</param>
public sealed record BranchTermination(EndReason Reason, string Message)
{
    /// <summary>True unless the end is a parameter bound, a state bound or a closed loop: the branch stopped before it should have.</summary>
    public bool EndedEarly => Reason is not (EndReason.ParameterBoundReached or EndReason.StateBoundReached or EndReason.ClosedLoop);
}

/// <summary>One point on a branch of equilibria.</summary>
public sealed record ContinuationPoint
{
    /// <summary>Value of the continuation parameter.</summary>
    public required double Parameter { get; init; }

    /// <summary>The equilibrium state.</summary>
    public required ImmutableArray<double> State { get; init; }

    /// <summary>Signed pseudo-arclength from the start (in the scaled norm of the options), negative on the reverse side.</summary>
    public required double Arclength { get; init; }

    /// <summary>Eigenvalues of the Jacobian, sorted by decreasing real part (empty if not computed).</summary>
    public required ImmutableArray<Complex> Eigenvalues { get; init; }

    /// <summary>Stability class from the eigenvalues.</summary>
    public required StabilityType Stability { get; init; }

    /// <summary>Number of eigenvalues with positive real part.</summary>
    public required int UnstableCount { get; init; }

    /// <summary>What kind of point this is.</summary>
    public required BranchPointType Type { get; init; }

    /// <summary>Index into <see cref="Branch.SpecialPoints"/> when <see cref="Type"/> is a special point; otherwise −1.</summary>
    public int SpecialPointIndex { get; init; } = -1;

    /// <summary>The eigenvalue with the largest real part (NaN if eigenvalues were not computed).</summary>
    public Complex LeadingEigenvalue => Eigenvalues.IsDefaultOrEmpty ? new Complex(double.NaN, double.NaN) : Eigenvalues[0];
}

/// <summary>A special point on a branch or curve, located by Newton's method on its extended system.</summary>
public sealed record SpecialPoint
{
    /// <summary>What it is.</summary>
    public required SpecialPointKind Kind { get; init; }

    /// <summary>Value of the (first) continuation parameter.</summary>
    public required double Parameter { get; init; }

    /// <summary>Value of the second parameter on a two-parameter curve; null on a one-parameter branch.</summary>
    public double? SecondParameter { get; init; }

    /// <summary>The equilibrium state at the point.</summary>
    public required ImmutableArray<double> State { get; init; }

    /// <summary>
    /// Max-norm of the residual of the defining system at the reported point (for a fold: f and the
    /// bordered test function; for a Hopf point: f and the eigen-equations; for a corner: f).
    /// </summary>
    public required double Residual { get; init; }

    /// <summary>True when the extended system converged and its solution lay on the bracketing segment; false for an estimate by interpolation.</summary>
    public required bool Located { get; init; }

    /// <summary>Newton iterations (or bisection steps, for corners and cusps) used to locate it.</summary>
    public int Iterations { get; init; }

    /// <summary>Angular frequency ω at a Hopf point (radians per time unit); null otherwise.</summary>
    public double? Frequency { get; init; }

    /// <summary>
    /// First Lyapunov coefficient l1 at a Hopf point (Kuznetsov, Elements of Applied Bifurcation Theory, eq. 3.20,
    /// eigenvectors normalised ⟨q, q⟩ = ⟨p, q⟩ = 1): negative for a supercritical Hopf point (a stable oscillation of amplitude ∝ √|Δp| is born), positive for a
    /// subcritical one (an unstable oscillation; the state may jump). Null otherwise or if it could not be computed.
    /// </summary>
    public double? FirstLyapunovCoefficient { get; init; }

    /// <summary>Period 2π/ω of the oscillation born at a Hopf point (system time unit); null otherwise.</summary>
    public double? Period => Frequency is double w && w > 0 ? 2 * Math.PI / w : null;

    /// <summary>Signed pseudo-arclength from the start of the branch or curve.</summary>
    public double Arclength { get; init; }

    /// <summary>A sentence describing the point (and, for an End, why tracing stopped).</summary>
    public string Description { get; init; } = "";
}

/// <summary>A branch of equilibria in one parameter, from pseudo-arclength continuation.</summary>
public sealed class Branch
{
    internal Branch(string parameterName, int parameterIndex, ImmutableArray<double> parameters, IReadOnlyList<ContinuationPoint> points,
        IReadOnlyList<SpecialPoint> specialPoints, int startIndex, BranchTermination forward, BranchTermination? reverse)
    {
        ParameterName = parameterName;
        ParameterIndex = parameterIndex;
        Parameters = parameters;
        Points = points;
        SpecialPoints = specialPoints;
        StartIndex = startIndex;
        Forward = forward;
        Reverse = reverse;
    }

    /// <summary>Name of the continuation parameter.</summary>
    public string ParameterName { get; }

    /// <summary>Index of the continuation parameter.</summary>
    public int ParameterIndex { get; }

    /// <summary>All parameter values at the start (the others stay fixed along the branch).</summary>
    public ImmutableArray<double> Parameters { get; }

    /// <summary>Points in order of arclength: from the end of the reverse direction, through the start, to the end of the forward direction. Located special points are included with their type.</summary>
    public IReadOnlyList<ContinuationPoint> Points { get; }

    /// <summary>Special points (folds, Hopf points, branch points, corners, ends), in order of arclength.</summary>
    public IReadOnlyList<SpecialPoint> SpecialPoints { get; }

    /// <summary>Index of the starting equilibrium in <see cref="Points"/>.</summary>
    public int StartIndex { get; }

    /// <summary>How tracing ended in the forward direction (the requested one, or increasing parameter for both directions).</summary>
    public BranchTermination Forward { get; }

    /// <summary>How tracing ended in the reverse direction; null when only one direction was traced.</summary>
    public BranchTermination? Reverse { get; }

    /// <summary>True if either direction stopped early (see <see cref="BranchTermination.EndedEarly"/>). The computed part is kept.</summary>
    public bool EndedEarly => Forward.EndedEarly || (Reverse?.EndedEarly ?? false);

    /// <summary>The special points of one kind.</summary>
    public IEnumerable<SpecialPoint> OfKind(SpecialPointKind kind) => SpecialPoints.Where(s => s.Kind == kind);
}
