namespace Thermostrat.Model.Numerics.Ode;

/// <summary>Mutable work counters shared by the loop and the stepper of one solve.</summary>
internal sealed class WorkCounters
{
    public long Accepted, Rejected, FunctionEvaluations, JacobianEvaluations, LuFactorizations, LinearSolves, EventEvaluations;

    public OdeStatistics Snapshot() => new(Accepted, Rejected, FunctionEvaluations, JacobianEvaluations, LuFactorizations, LinearSolves, EventEvaluations);
}

/// <summary>Outcome of one step attempt.</summary>
internal enum TrialOutcome
{
    /// <summary>Computed; accept or reject by the error norm.</summary>
    Computed,
    /// <summary>A stage or the result was NaN or infinite.</summary>
    NonFinite,
    /// <summary>The iteration matrix was singular.</summary>
    Singular,
}

/// <summary>
/// One integration method's step: the shared loop in <see cref="OdeSolver"/> owns time, step-size control, output and events;
/// a stepper owns its stages. Between <see cref="Attempt"/> returning an accepted step and <see cref="Accept"/>, the step's
/// data stay valid for dense output.
/// </summary>
internal abstract class Stepper
{
    protected Stepper(int n, RhsFunction<double> f, WorkCounters counters)
    {
        N = n;
        F = f;
        Counters = counters;
    }

    protected int N { get; }
    protected RhsFunction<double> F { get; }
    protected WorkCounters Counters { get; }

    public abstract OdeMethod Method { get; }

    /// <summary>Order of the error estimate's leading term minus one (the controller uses exponent 1/(ErrorOrder + 1)); 0 if none.</summary>
    public abstract int ErrorOrder { get; }

    /// <summary>Classical order of the propagated solution.</summary>
    public abstract int Order { get; }

    /// <summary>f(t, y) at the current accepted point (valid after <see cref="Start"/> and after <see cref="Accept"/>).</summary>
    public abstract ReadOnlySpan<double> CurrentDerivative { get; }

    /// <summary>Prepares to step from (t, y): evaluates what the first attempt needs. Returns the first non-finite component of f(t, y) or −1.</summary>
    public abstract int Start(double t, ReadOnlySpan<double> y);

    /// <summary>
    /// Attempts a step of size h from (t, y) into <paramref name="yNew"/>. With <paramref name="estimateError"/> the square of the
    /// weighted RMS error norm is returned in <paramref name="errorSquared"/> (NaN when the method has no estimate; the step is
    /// acceptable when it is ≤ 1). <paramref name="badIndex"/> names the
    /// first non-finite component when the outcome is <see cref="TrialOutcome.NonFinite"/>.
    /// </summary>
    public abstract TrialOutcome Attempt(double t, double h, ReadOnlySpan<double> y, Span<double> yNew, bool estimateError,
        ReadOnlySpan<double> atol, double rtol, out double errorSquared, out int badIndex);

    /// <summary>y(t + θh) on the last computed step, 0 ≤ θ ≤ 1, from its continuous extension.</summary>
    public abstract void Interpolate(double theta, double h, ReadOnlySpan<double> y, ReadOnlySpan<double> yNew, Span<double> output);

    /// <summary>|hλ| estimate of the dominant eigenvalue on the last computed step (for the stiffness test), or NaN if the method has none.</summary>
    public virtual double StiffnessEstimate(double h, ReadOnlySpan<double> yNew) => double.NaN;

    /// <summary>Where the method's stability region meets the negative real axis (|hλ|), or NaN.</summary>
    public virtual double StabilityBoundary => double.NaN;

    /// <summary>The last computed step becomes the current point (t + h, yNew).</summary>
    public abstract void Accept(double tNew, ReadOnlySpan<double> yNew);

    protected void Evaluate(double t, ReadOnlySpan<double> y, Span<double> dydt)
    {
        F(t, y, dydt);
        Counters.FunctionEvaluations++;
    }
}
